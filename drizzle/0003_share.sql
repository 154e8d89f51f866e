CREATE TABLE `snapshot_comments` (
	`id` text PRIMARY KEY NOT NULL,
	`slug` text NOT NULL,
	`step_n` integer NOT NULL,
	`author_id` text NOT NULL,
	`body` text NOT NULL,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`slug`) REFERENCES `shares`(`slug`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`author_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `snapshot_comments_slug_idx` ON `snapshot_comments` (`slug`,`created_at`);--> statement-breakpoint
ALTER TABLE `macros` ADD `effects` text;--> statement-breakpoint
ALTER TABLE `shares` ADD `note` text;--> statement-breakpoint
ALTER TABLE `shares` ADD `snapshot` text;--> statement-breakpoint
ALTER TABLE `shares` ADD `frozen_at` integer;