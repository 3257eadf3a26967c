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
CREATE UNIQUE INDEX `gauge_limits_level` ON `gauge_limits` (`gauge_id`,`quantity`,`level`);