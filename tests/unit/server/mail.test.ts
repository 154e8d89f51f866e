// Mail templates: what each message must carry, and nothing it must not.
import { describe, expect, it } from 'vitest';
import { inviteMessage, resetMessage } from '../../../src/lib/server/mail/templates';

describe('invitation', () => {
	const base = { to: 'ref@uni.test', inviter: 'Inès Cardoso', title: 'Boosted brane', padUrl: 'https://pad.test/shared/abc' };

	it('links the pad for an address with an account, and no sign-up', () => {
		const m = inviteMessage(base);
		expect(m.to).toBe('ref@uni.test');
		expect(m.subject).toBe('Inès Cardoso shared a Bulkpad pad with you: Boosted brane');
		expect(m.text).toContain('Open the pad (signed in as ref@uni.test): https://pad.test/shared/abc');
		expect(m.text).not.toContain('account with this address');
		expect(m.text).not.toContain('without an account');
	});

	it('asks a newcomer to make an account first and links a live transcript when there is one', () => {
		const m = inviteMessage({ ...base, signupUrl: 'https://pad.test/signup', transcriptUrl: 'https://pad.test/t/xyz' });
		const lines = m.text.split('\n');
		const signup = lines.findIndex((l) => l.includes('https://pad.test/signup'));
		const open = lines.findIndex((l) => l.includes('https://pad.test/shared/abc'));
		expect(signup).toBeGreaterThan(-1);
		expect(signup).toBeLessThan(open);
		expect(m.text).toContain('without an account: https://pad.test/t/xyz');
	});
});

describe('password reset', () => {
	it('carries the link and how long it works', () => {
		const m = resetMessage({ to: 'a@b.test', link: 'https://pad.test/reset/tok', validMinutes: 60 });
		expect(m).toMatchObject({ to: 'a@b.test', subject: 'Set a new Bulkpad password' });
		expect(m.text).toContain('within 60 minutes: https://pad.test/reset/tok');
		expect(m.text).toMatch(/works once/);
	});
});
