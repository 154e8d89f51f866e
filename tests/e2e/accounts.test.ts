// Accounts in the browser: an owner invites from the sharing panel, a newcomer makes an account through the
// link, confirms the address from the mail and lands on the pad; the owner revokes and the pad is gone for
// them. Then the Keys & sessions page: this session marked, the password changed with the warning beside it.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { inject } from 'vitest';
import type { BrowserContext } from 'playwright-core';
import { launch, screenshot, signInThroughForm } from '../helpers/browser';
import { Client, mailedToken, signUpConfirmed } from '../helpers/client';
import { signInPatiently } from '../helpers/roles';

const baseUrl = inject('baseUrl');
let ownerCtx: BrowserContext;
let newcomerCtx: BrowserContext;

beforeAll(async () => {
	ownerCtx = await launch();
	newcomerCtx = await launch();
});
afterAll(async () => {
	await ownerCtx?.close();
	await newcomerCtx?.close();
});

describe('an invitation from the sharing panel', () => {
	it('brings a newcomer through sign-up and confirmation to the pad, and revoking takes it away', async () => {
		const api = await signInPatiently('tomas@sable.test');
		const title = `Invited in the browser ${Date.now()}`;
		const padId = (await api.post('/api/pads', { title })).body.pad.id as string;
		const to = `browser-invitee-${Date.now()}@tests.test`;

		const owner = await ownerCtx.newPage();
		await signInThroughForm(owner, baseUrl, 'tomas@sable.test');
		await owner.goto(`${baseUrl}/shared/${padId}`);
		await owner.fill('input[name=email]', to);
		await owner.click('button:has-text("Invite")');
		await owner.getByText('single-use link is on its way').waitFor();
		await owner.getByText('pending since').waitFor();

		const token = await mailedToken(to, 'invite');
		const page = await newcomerCtx.newPage();
		await page.goto(`${baseUrl}/invite/${token}`);
		await page.getByText(title).waitFor();
		await Promise.all([page.waitForURL((u) => u.pathname === '/signup'), page.click('a:has-text("Make an account")')]);
		expect(await page.inputValue('input[name=email]')).toBe(to);
		await page.fill('input[name=name]', 'Browser Invitee');
		await page.fill('input[name=password]', 'correct horse battery');
		await page.click('button:has-text("Make the account")');
		await page.getByText(`we sent a link to`).waitFor();

		const confirm = await mailedToken(to, 'confirm');
		await page.goto(`${baseUrl}/confirm/${confirm}`);
		await Promise.all([page.waitForURL((u) => u.pathname === '/signin'), page.click('button:has-text("Confirm my address")')]);
		await page.getByText('Address confirmed').waitFor();
		await page.fill('input[name=email]', to);
		await page.fill('input[name=password]', 'correct horse battery');
		await Promise.all([page.waitForURL((u) => u.pathname === `/shared/${padId}`), page.click('button:has-text("Sign in")')]);
		await page.getByRole('heading', { name: title }).waitFor();
		await screenshot(page, 'accounts-invited-pad');

		await owner.reload();
		await owner.getByText('accepted').first().waitFor();
		await owner.locator('[aria-label=invitations] button:has-text("Revoke")').first().click();
		await owner.getByText('gives no access any more').waitFor();
		const gone = await page.goto(`${baseUrl}/shared/${padId}`);
		expect(gone?.status()).toBe(404);
	});
});

describe('keys & sessions', () => {
	it('marks this session, and a password change keeps this browser in while the other session ends', async () => {
		const email = `browser-sessions-${Date.now()}@tests.test`;
		const other: Client = await signUpConfirmed(email, 'correct horse battery', 'Two Places');
		const ctx = await launch();
		const page = await ctx.newPage();
		await signInThroughForm(page, baseUrl, email, 'correct horse battery');
		await page.goto(`${baseUrl}/keys`);
		await page.getByRole('heading', { name: 'Keys & sessions' }).waitFor();
		await page.getByText('this one').waitFor();
		expect(await page.locator('[aria-label=sessions] tbody tr').count()).toBe(2);
		await page.getByText('revokes all your keys').waitFor();

		await page.fill('input[autocomplete=current-password]', 'correct horse battery');
		await page.fill('input[autocomplete=new-password]', 'another long secret');
		await page.click('button:has-text("Change the password")');
		await page.getByText('Password changed').waitFor();
		await expect.poll(() => page.locator('[aria-label=sessions] tbody tr').count(), { timeout: 30_000 }).toBe(1);
		expect((await other.get('/api/auth/me')).status).toBe(401);
		await screenshot(page, 'accounts-keys-sessions');
		await ctx.close();
	});
});
