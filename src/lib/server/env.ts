/** Server settings from the environment, read once; defaults suit `npm start` on a laptop. */
function intFrom(name: string, fallback: number): number {
	const raw = process.env[name];
	const n = raw === undefined ? NaN : Number(raw);
	return Number.isFinite(n) && n > 0 ? n : fallback;
}

export const env = {
	databaseUrl: process.env.DATABASE_URL ?? 'data/bulkpad.db',
	/**
	 * Secure cookies whenever the app is reached over https (a deployment sets ORIGIN=https://…), or when
	 * forced; a Secure cookie over plain http on this machine would simply never come back.
	 */
	secureCookies:
		process.env.BULKPAD_SECURE_COOKIES === '1' ||
		(process.env.NODE_ENV === 'production' && (process.env.ORIGIN ?? '').startsWith('https://')),
	/** the address mailed links use; the Host header is not trusted for that, since it can be forged */
	origin: process.env.ORIGIN ?? `http://localhost:${process.env.PORT ?? 3000}`,
	evalBudgetMs: intFrom('BULKPAD_EVAL_BUDGET_MS', 5000),
	evalThreads: intFrom('BULKPAD_EVAL_THREADS', 2),
	smtpHost: process.env.SMTP_HOST ?? '127.0.0.1',
	smtpPort: intFrom('SMTP_PORT', 2525),
	mailFrom: process.env.MAIL_FROM ?? 'Bulkpad <no-reply@bulkpad.test>',
	signinPerMinute: intFrom('BULKPAD_SIGNIN_PER_MINUTE', 10),
	signinPerMinutePerAddress: intFrom('BULKPAD_SIGNIN_PER_MINUTE_PER_ADDRESS', 60),
	/** sign-ups and invitations from one client address per hour (each also limited per target e-mail) */
	signupPerHourPerAddress: intFrom('BULKPAD_SIGNUP_PER_HOUR_PER_ADDRESS', 20),
	invitePerHourPerAddress: intFrom('BULKPAD_INVITE_PER_HOUR_PER_ADDRESS', 60),
	replayPerMinute: intFrom('BULKPAD_REPLAY_PER_MINUTE', 20),
	uploadMaxBytes: intFrom('BULKPAD_UPLOAD_MAX_BYTES', 1_000_000)
};
