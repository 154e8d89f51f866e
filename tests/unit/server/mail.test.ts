// Mail templates: what each message must carry, and nothing it must not; and what the outbox keeps of them.
import { describe, expect, it } from 'vitest';
import { confirmMessage, inviteMessage, resetMessage } from '../../../src/lib/server/mail/templates';
import { LINK_WITHHELD, redactSecrets } from '../../../src/lib/server/mail/send';

describe('invitation', () => {
	const base = {
		to: 'ref@uni.test',
		inviter: 'Inès Cardoso',
		title: 'Boosted brane',
		acceptUrl: 'https://pad.test/invite/tok123',
		validDays: 14
	};

	it('carries the single-use link, how long it works, and marks it secret', () => {
		const m = inviteMessage(base);
		expect(m.to).toBe('ref@uni.test');
		expect(m.kind).toBe('invite');
		expect(m.subject).toBe('Inès Cardoso shared a Bulkpad pad with you: Boosted brane');
		expect(m.text).toContain('https://pad.test/invite/tok123');
		expect(m.text).toMatch(/works once, for 14 days/);
		expect(m.secrets).toEqual(['https://pad.test/invite/tok123']);
		expect(m.text).not.toContain('without an account');
	});

	it('links a live transcript when there is one, and keeps that public link readable in the outbox', () => {
		const m = inviteMessage({ ...base, transcriptUrl: 'https://pad.test/t/xyz' });
		expect(m.text).toContain('without an account: https://pad.test/t/xyz');
		const kept = redactSecrets(m.text, m.secrets);
		expect(kept).toContain('https://pad.test/t/xyz');
		expect(kept).not.toContain('tok123');
		expect(kept).toContain(LINK_WITHHELD);
	});
});

describe('password reset', () => {
	it('carries the link and how long it works, says keys and sessions end, and marks the link secret', () => {
		const m = resetMessage({ to: 'a@b.test', link: 'https://pad.test/reset/tok', validMinutes: 60 });
		expect(m).toMatchObject({ to: 'a@b.test', subject: 'Set a new Bulkpad password', kind: 'reset' });
		expect(m.text).toContain('within 60 minutes: https://pad.test/reset/tok');
		expect(m.text).toMatch(/works once/);
		expect(m.text).toMatch(/ends every session .* revokes its keys/);
		expect(redactSecrets(m.text, m.secrets)).not.toContain('/reset/tok');
	});
});

describe('address confirmation', () => {
	it('greets by name, carries the link, and the outbox copy has no link', () => {
		const m = confirmMessage({ to: 'n@b.test', name: 'Noor', link: 'https://pad.test/confirm/abc', validHours: 48 });
		expect(m).toMatchObject({ to: 'n@b.test', subject: 'Confirm your Bulkpad address', kind: 'confirm' });
		expect(m.text).toContain('Hello Noor');
		expect(m.text).toContain('within 48 hours: https://pad.test/confirm/abc');
		const kept = redactSecrets(m.text, m.secrets);
		expect(kept).not.toContain('confirm/abc');
		expect(kept.split(LINK_WITHHELD)).toHaveLength(2);
	});

	it('redacts every occurrence and leaves a body without secrets as it was', () => {
		expect(redactSecrets('a X b X', ['X'])).toBe(`a ${LINK_WITHHELD} b ${LINK_WITHHELD}`);
		expect(redactSecrets('plain', [])).toBe('plain');
		expect(redactSecrets('plain', [''])).toBe('plain');
	});
});
