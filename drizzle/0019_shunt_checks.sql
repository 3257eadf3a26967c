CREATE TABLE `shunt_checks` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`gauge_id` integer NOT NULL,
	`time` integer NOT NULL,
	`shunt_resistance` real NOT NULL,
	`measured_output` real NOT NULL,
	`expected_output` real NOT NULL,
	`unit` text NOT NULL,
	`simulated_strain` real NOT NULL,
	`tolerance_percent` real NOT NULL,
	`passed` integer NOT NULL,
	`note` text,
	`checked_by_id` integer,
	`checked_by_label` text NOT NULL,
	`created_at` integer DEFAULT (cast(unixepoch('subsec') * 1000 as integer)) NOT NULL,
	FOREIGN KEY (`gauge_id`) REFERENCES `gauges`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`checked_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `shunt_checks_gauge` ON `shunt_checks` (`gauge_id`,`time`);