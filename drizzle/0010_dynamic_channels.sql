CREATE TABLE `burst_summaries` (
	`gauge_id` integer NOT NULL,
	`start` integer NOT NULL,
	`length` integer NOT NULL,
	`samples` integer NOT NULL,
	`min` real NOT NULL,
	`max` real NOT NULL,
	`mean` real NOT NULL,
	`m2` real NOT NULL,
	`max_range` real NOT NULL,
	`cycles` real NOT NULL,
	`histogram` blob NOT NULL,
	PRIMARY KEY(`gauge_id`, `start`)
) WITHOUT ROWID;
--> statement-breakpoint
CREATE TABLE `bursts` (
	`gauge_id` integer NOT NULL,
	`start` integer NOT NULL,
	`end` real NOT NULL,
	`samples` integer NOT NULL,
	`temperature` real,
	`received_at` integer DEFAULT (cast(unixepoch('subsec') * 1000 as integer)) NOT NULL,
	PRIMARY KEY(`gauge_id`, `start`)
) WITHOUT ROWID;
--> statement-breakpoint
CREATE TABLE `dynamic_events` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`structure_id` integer NOT NULL,
	`gauge_id` integer NOT NULL,
	`start` real NOT NULL,
	`end` real NOT NULL,
	`rate_hz` real NOT NULL,
	`trigger` text NOT NULL,
	`trigger_level` real NOT NULL,
	`peak` real NOT NULL,
	`peak_at` real NOT NULL,
	`truncated` integer DEFAULT false NOT NULL,
	`waveform` blob NOT NULL,
	`label` text,
	`labelled_by_id` integer,
	`labelled_at` integer,
	FOREIGN KEY (`structure_id`) REFERENCES `structures`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`gauge_id`) REFERENCES `gauges`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`labelled_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `dynamic_events_gauge` ON `dynamic_events` (`gauge_id`,`start`);--> statement-breakpoint
CREATE INDEX `dynamic_events_structure` ON `dynamic_events` (`structure_id`,`start`);--> statement-breakpoint
CREATE TABLE `dynamic_states` (
	`gauge_id` integer PRIMARY KEY NOT NULL,
	`end` real NOT NULL,
	`residue` text NOT NULL,
	`capture_next_time` real,
	`capture_recent` blob,
	`open_event` text,
	`open_event_stress` blob,
	FOREIGN KEY (`gauge_id`) REFERENCES `gauges`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
ALTER TABLE `gauges` ADD `sampling` text DEFAULT '{"mode":"static"}' NOT NULL;