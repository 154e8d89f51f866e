import type { MailMessage } from './send';

/** Plain-text messages; every link is absolute on env.origin so it works from any mail client. */

export function inviteMessage(input: {
	to: string;
	inviter: string;
	title: string;
	padUrl: string;
	/** present when the address has no account yet */
	signupUrl?: string;
	transcriptUrl?: string;
}): MailMessage {
	const lines = [`${input.inviter} invited you to the Bulkpad pad "${input.title}".`, ''];
	if (input.signupUrl) lines.push(`First make a Bulkpad account with this address (${input.to}): ${input.signupUrl}`);
	lines.push(`Open the pad (signed in as ${input.to}): ${input.padUrl}`);
	if (input.transcriptUrl) {
		lines.push('', `Anyone with this link can read and replay its transcript without an account: ${input.transcriptUrl}`);
	}
	lines.push('', 'You can replay every step and see whether it still reproduces.');
	return { to: input.to, subject: `${input.inviter} shared a Bulkpad pad with you: ${input.title}`, text: lines.join('\n') };
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
			'The link works once. If you did not ask for it, ignore this message; your password stays as it is.'
		].join('\n')
	};
}
