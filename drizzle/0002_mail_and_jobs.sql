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
ALTER TABLE `structure_members` ADD `alert_mail` text DEFAULT 'immediate' NOT NULL;