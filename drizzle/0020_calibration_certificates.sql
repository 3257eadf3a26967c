CREATE TABLE `calibration_certificates` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`structure_id` integer NOT NULL,
	`gauge_id` integer,
	`logger_name` text,
	`certificate_number` text NOT NULL,
	`issued_by` text NOT NULL,
	`issued_on` text NOT NULL,
	`expires_on` text NOT NULL,
	`file_id` integer NOT NULL,
	`created_by_id` integer,
	`created_by_label` text NOT NULL,
	`created_at` integer DEFAULT (cast(unixepoch('subsec') * 1000 as integer)) NOT NULL,
	FOREIGN KEY (`structure_id`) REFERENCES `structures`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`gauge_id`) REFERENCES `gauges`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`file_id`) REFERENCES `files`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`created_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `calibration_certificates_structure` ON `calibration_certificates` (`structure_id`,`expires_on`);--> statement-breakpoint
CREATE INDEX `calibration_certificates_gauge` ON `calibration_certificates` (`gauge_id`);--> statement-breakpoint
CREATE TABLE `certificate_reminders` (
	`certificate_id` integer NOT NULL,
	`threshold_days` integer NOT NULL,
	`days_left` integer NOT NULL,
	`recipients` integer NOT NULL,
	`queued_at` integer DEFAULT (cast(unixepoch('subsec') * 1000 as integer)) NOT NULL,
	PRIMARY KEY(`certificate_id`, `threshold_days`),
	FOREIGN KEY (`certificate_id`) REFERENCES `calibration_certificates`(`id`) ON UPDATE no action ON DELETE cascade
);
