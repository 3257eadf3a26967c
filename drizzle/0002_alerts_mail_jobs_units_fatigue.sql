CREATE TABLE `alert_events` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`alert_id` integer NOT NULL,
	`type` text NOT NULL,
	`at` integer NOT NULL,
	`level` text,
	`value` real,
	`by_id` integer,
	`by_label` text,
	`text` text,
	FOREIGN KEY (`alert_id`) REFERENCES `alerts`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `alert_events_alert` ON `alert_events` (`alert_id`,`at`);--> statement-breakpoint
CREATE TABLE `alerts` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`structure_id` integer NOT NULL,
	`gauge_id` integer NOT NULL,
	`kind` text NOT NULL,
	`level` text NOT NULL,
	`quantity` text,
	`code` text,
	`message` text,
	`opened_at` integer NOT NULL,
	`bound` real,
	`peak` real,
	`cleared_at` integer,
	`acknowledged_at` integer,
	`acknowledged_by_id` integer,
	`comment` text,
	FOREIGN KEY (`structure_id`) REFERENCES `structures`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`gauge_id`) REFERENCES `gauges`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`acknowledged_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `alerts_structure` ON `alerts` (`structure_id`,`opened_at`);--> statement-breakpoint
CREATE INDEX `alerts_gauge` ON `alerts` (`gauge_id`,`kind`,`cleared_at`);--> statement-breakpoint
CREATE TABLE `caught_mail` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`received_at` integer DEFAULT (cast(unixepoch('subsec') * 1000 as integer)) NOT NULL,
	`envelope_from` text,
	`envelope_to` text NOT NULL,
	`message_id` text,
	`subject` text,
	`text` text,
	`html` text,
	`raw_size` integer NOT NULL,
	`attachments` text NOT NULL
);
--> statement-breakpoint
CREATE INDEX `caught_mail_received` ON `caught_mail` (`received_at`);--> statement-breakpoint
CREATE TABLE `evaluation_states` (
	`gauge_id` integer PRIMARY KEY NOT NULL,
	`last_time` integer,
	`state` text NOT NULL,
	FOREIGN KEY (`gauge_id`) REFERENCES `gauges`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE TABLE `gauge_limits` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`gauge_id` integer NOT NULL,
	`quantity` text NOT NULL,
	`level` text NOT NULL,
	`upper` real,
	`lower` real,
	`hysteresis` real DEFAULT 0 NOT NULL,
	`persistence` integer DEFAULT 1 NOT NULL,
	FOREIGN KEY (`gauge_id`) REFERENCES `gauges`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `gauge_limits_level` ON `gauge_limits` (`gauge_id`,`quantity`,`level`);--> statement-breakpoint
CREATE TABLE `job_leases` (
	`name` text PRIMARY KEY NOT NULL,
	`holder` text NOT NULL,
	`lease_until` integer NOT NULL,
	`last_started_at` integer,
	`last_finished_at` integer,
	`last_outcome` text
);
--> statement-breakpoint
CREATE TABLE `mail_outbox` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`to_address` text NOT NULL,
	`to_user_id` integer,
	`kind` text NOT NULL,
	`dedupe_key` text NOT NULL,
	`subject` text NOT NULL,
	`text` text NOT NULL,
	`html` text NOT NULL,
	`attachments` text,
	`state` text DEFAULT 'queued' NOT NULL,
	`attempts` integer DEFAULT 0 NOT NULL,
	`next_attempt_at` integer DEFAULT (cast(unixepoch('subsec') * 1000 as integer)) NOT NULL,
	`last_error` text,
	`claimed_by` text,
	`claimed_until` integer,
	`created_at` integer DEFAULT (cast(unixepoch('subsec') * 1000 as integer)) NOT NULL,
	`sent_at` integer,
	FOREIGN KEY (`to_user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `mail_outbox_dedupe_key_unique` ON `mail_outbox` (`dedupe_key`);--> statement-breakpoint
CREATE INDEX `mail_outbox_due` ON `mail_outbox` (`state`,`next_attempt_at`);--> statement-breakpoint
CREATE INDEX `mail_outbox_created` ON `mail_outbox` (`created_at`);--> statement-breakpoint
ALTER TABLE `gauges` ADD `detail_category` real;--> statement-breakpoint
ALTER TABLE `structure_members` ADD `alert_mail` text DEFAULT 'immediate' NOT NULL;--> statement-breakpoint
ALTER TABLE `users` ADD `units` text DEFAULT 'si' NOT NULL;