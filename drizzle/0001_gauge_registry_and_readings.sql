CREATE TABLE `files` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`structure_id` integer NOT NULL,
	`gauge_id` integer,
	`kind` text NOT NULL,
	`title` text NOT NULL,
	`storage_key` text NOT NULL,
	`content_type` text NOT NULL,
	`bytes` integer NOT NULL,
	`width` integer,
	`height` integer,
	`uploaded_by_id` integer,
	`created_at` integer DEFAULT (cast(unixepoch('subsec') * 1000 as integer)) NOT NULL,
	FOREIGN KEY (`structure_id`) REFERENCES `structures`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`gauge_id`) REFERENCES `gauges`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`uploaded_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `files_storage_key_unique` ON `files` (`storage_key`);--> statement-breakpoint
CREATE INDEX `files_structure` ON `files` (`structure_id`,`kind`);--> statement-breakpoint
CREATE INDEX `files_gauge` ON `files` (`gauge_id`);--> statement-breakpoint
CREATE TABLE `gauges` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`structure_id` integer NOT NULL,
	`tag` text NOT NULL,
	`label` text,
	`member` text,
	`kind` text NOT NULL,
	`input` text NOT NULL,
	`bridge` text,
	`gauge_factor` real NOT NULL,
	`logger_gauge_factor` real,
	`batch_factor` real,
	`polarity` integer DEFAULT 1 NOT NULL,
	`lead_resistance` real,
	`gauge_resistance` real,
	`thermal` text NOT NULL,
	`material` text NOT NULL,
	`initial_stress` real DEFAULT 0 NOT NULL,
	`zero_value` real NOT NULL,
	`zero_temperature` real,
	`zero_time` integer NOT NULL,
	`expected_interval` integer,
	`rated_range` real,
	`status` text DEFAULT 'active' NOT NULL,
	`retired_at` integer,
	`replaces_gauge_id` integer,
	`drawing_id` integer,
	`drawing_x` real,
	`drawing_y` real,
	`created_at` integer DEFAULT (cast(unixepoch('subsec') * 1000 as integer)) NOT NULL,
	`updated_at` integer,
	FOREIGN KEY (`structure_id`) REFERENCES `structures`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `gauges_structure_tag` ON `gauges` (`structure_id`,`tag`);--> statement-breakpoint
CREATE TABLE `readings` (
	`gauge_id` integer NOT NULL,
	`t` integer NOT NULL,
	`value` real NOT NULL,
	`temperature` real,
	`strain` real NOT NULL,
	`stress` real NOT NULL,
	`flags` integer DEFAULT 0 NOT NULL,
	PRIMARY KEY(`gauge_id`, `t`)
) WITHOUT ROWID;
--> statement-breakpoint
CREATE TABLE `rollups` (
	`gauge_id` integer NOT NULL,
	`resolution` integer NOT NULL,
	`bucket` integer NOT NULL,
	`count` integer NOT NULL,
	`strain_min` real NOT NULL,
	`strain_max` real NOT NULL,
	`strain_sum` real NOT NULL,
	`stress_min` real NOT NULL,
	`stress_max` real NOT NULL,
	`stress_sum` real NOT NULL,
	`temperature_count` integer NOT NULL,
	`temperature_min` real,
	`temperature_max` real,
	`temperature_sum` real,
	PRIMARY KEY(`gauge_id`, `resolution`, `bucket`)
) WITHOUT ROWID;
--> statement-breakpoint
CREATE TABLE `rosettes` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`structure_id` integer NOT NULL,
	`tag` text NOT NULL,
	`layout` text NOT NULL,
	`gauge_a_id` integer NOT NULL,
	`gauge_b_id` integer NOT NULL,
	`gauge_c_id` integer NOT NULL,
	`created_at` integer DEFAULT (cast(unixepoch('subsec') * 1000 as integer)) NOT NULL,
	FOREIGN KEY (`structure_id`) REFERENCES `structures`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`gauge_a_id`) REFERENCES `gauges`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`gauge_b_id`) REFERENCES `gauges`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`gauge_c_id`) REFERENCES `gauges`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `rosettes_structure_tag` ON `rosettes` (`structure_id`,`tag`);--> statement-breakpoint
CREATE TABLE `zero_readings` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`gauge_id` integer NOT NULL,
	`value` real NOT NULL,
	`temperature` real,
	`time` integer NOT NULL,
	`reason` text NOT NULL,
	`source` text NOT NULL,
	`set_by_id` integer,
	`set_by_label` text NOT NULL,
	`created_at` integer DEFAULT (cast(unixepoch('subsec') * 1000 as integer)) NOT NULL,
	FOREIGN KEY (`gauge_id`) REFERENCES `gauges`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`set_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `zero_readings_gauge` ON `zero_readings` (`gauge_id`,`created_at`);