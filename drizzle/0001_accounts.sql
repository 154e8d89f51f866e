CREATE TABLE `email_confirmations` (
	`token_hash` text PRIMARY KEY NOT NULL,
	`user_id` text NOT NULL,
	`invite_id` text,
	`expires_at` integer NOT NULL,
	`outbox_id` text,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE TABLE `invitations` (
	`id` text PRIMARY KEY NOT NULL,
	`pad_id` text NOT NULL,
	`email` text NOT NULL,
	`token_hash` text NOT NULL,
	`invited_by` text NOT NULL,
	`state` text DEFAULT 'pending' NOT NULL,
	`accepted_by` text,
	`accepted_at` integer,
	`revoked_at` integer,
	`expires_at` integer NOT NULL,
	`outbox_id` text,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`pad_id`) REFERENCES `pads`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`invited_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`accepted_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `invitations_token_hash_unique` ON `invitations` (`token_hash`);--> statement-breakpoint
CREATE INDEX `invitations_pad_idx` ON `invitations` (`pad_id`,`created_at`);--> statement-breakpoint
CREATE TABLE `settings` (
	`key` text PRIMARY KEY NOT NULL,
	`value` text NOT NULL,
	`updated_at` integer NOT NULL
);
--> statement-breakpoint
ALTER TABLE `outbox` ADD `kind` text DEFAULT 'other' NOT NULL;--> statement-breakpoint
ALTER TABLE `password_resets` ADD `outbox_id` text;--> statement-breakpoint
ALTER TABLE `sessions` ADD `created_at` integer;--> statement-breakpoint
ALTER TABLE `sessions` ADD `last_seen_at` integer;--> statement-breakpoint
ALTER TABLE `sessions` ADD `user_agent` text;--> statement-breakpoint
ALTER TABLE `users` ADD `email_confirmed_at` integer;--> statement-breakpoint
-- data: accounts made before confirmation existed keep signing in
UPDATE `users` SET `email_confirmed_at` = `created_at`;--> statement-breakpoint
-- session ids were the cookie values: end them all, new ones are stored hashed
DELETE FROM `sessions`;--> statement-breakpoint
-- reset links were kept readable in the outbox: none of them may work any more, and no old body stays
DELETE FROM `password_resets`;--> statement-breakpoint
UPDATE `outbox` SET `text` = '(body withheld: recorded before links were redacted)';--> statement-breakpoint
-- access by address alone for an address with no account was an open invitation to whoever signs up with it
DELETE FROM `pad_access` WHERE `email` NOT IN (SELECT `email` FROM `users`);
