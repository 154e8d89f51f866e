ALTER TABLE `datasets` ADD `origin` text;--> statement-breakpoint
ALTER TABLE `pads` ADD `validity_tol` real;--> statement-breakpoint
ALTER TABLE `steps` ADD `figure_labels` text;