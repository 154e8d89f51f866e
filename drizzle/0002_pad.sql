CREATE TABLE `attempts` (
	`id` text PRIMARY KEY NOT NULL,
	`pad_id` text NOT NULL,
	`input` text NOT NULL,
	`status` text NOT NULL,
	`error` text,
	`after_n` integer DEFAULT 0 NOT NULL,
	`for_n` integer,
	`ms` real,
	`dismissed_at` integer,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`pad_id`) REFERENCES `pads`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `attempts_pad_idx` ON `attempts` (`pad_id`,`created_at`);--> statement-breakpoint
CREATE TABLE `step_versions` (
	`id` text PRIMARY KEY NOT NULL,
	`step_id` text NOT NULL,
	`version` integer NOT NULL,
	`input` text NOT NULL,
	`status` text NOT NULL,
	`results` text,
	`error` text,
	`ref` text,
	`bulk_before` text,
	`ms` real,
	`created_at` integer NOT NULL,
	`replaced_at` integer NOT NULL,
	FOREIGN KEY (`step_id`) REFERENCES `steps`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `step_versions_idx` ON `step_versions` (`step_id`,`version`);--> statement-breakpoint
ALTER TABLE `steps` ADD `name` text;--> statement-breakpoint
ALTER TABLE `steps` ADD `hidden_at` integer;--> statement-breakpoint
ALTER TABLE `steps` ADD `version` integer DEFAULT 1 NOT NULL;--> statement-breakpoint
CREATE UNIQUE INDEX `steps_pad_name_idx` ON `steps` (`pad_id`,`name`);