ALTER TABLE `api_keys` ADD `per_minute` integer DEFAULT 120 NOT NULL;--> statement-breakpoint
ALTER TABLE `api_keys` ADD `expires_at` integer;