import type { MailMessage } from './send';

/**
 * Plain-text messages; every link is absolute on env.origin so it works from any mail client. A link that
 * carries a token is listed in `secrets`, so the outbox keeps the message without it.
 */

export function inviteMessage(input: {
	to: string;
	inviter: string;
	title: string;
	/** /invite/<token>: whoever opens it, signed in with a confirmed address, may accept */
	acceptUrl: string;
	validDays: number;
	transcriptUrl?: string;
}): MailMessage {
	const lines = [
		`${input.inviter} invited you to read the Bulkpad pad "${input.title}".`,
		'',
		`Accept the invitation here (sign in, or make an account from the same page): ${input.acceptUrl}`,
		`The link works once, for ${input.validDays} days; keep it to yourself.`
	];
	if (input.transcriptUrl) {
		lines.push('', `Anyone with this link can read and replay its transcript without an account: ${input.transcriptUrl}`);
	}
	lines.push('', 'You can replay every step and see whether it still reproduces.');
	return {
		to: input.to,
		subject: `${input.inviter} shared a Bulkpad pad with you: ${input.title}`,
		text: lines.join('\n'),
		kind: 'invite',
		secrets: [input.acceptUrl]
	};
}

export function resetMessage(input: { to: string; link: string; validMinutes: number }): MailMessage {
	return {
		to: input.to,
		subject: 'Set a new Bulkpad password',
		text: [
			'Someone (hopefully you) asked to set a new password for this Bulkpad account.',
			'',
			`Set it here within ${input.validMinutes} minutes: ${input.link}`,
			'',
			'The link works once. If you did not ask for it, ignore this message; your password stays as it is.',
			'Setting a new password ends every session of the account and revokes its keys.'
		].join('\n'),
		kind: 'reset',
		secrets: [input.link]
	};
}

export function confirmMessage(input: { to: string; name: string; link: string; validHours: number }): MailMessage {
	return {
		to: input.to,
		subject: 'Confirm your Bulkpad address',
		text: [
			`Hello ${input.name},`,
			'',
			`Confirm that this address is yours within ${input.validHours} hours: ${input.link}`,
			'',
			'Until then the account cannot sign in. If you did not make a Bulkpad account, ignore this message.'
		].join('\n'),
		kind: 'confirm',
		secrets: [input.link]
	};
}
