CREATE TABLE `load_test_predictions` (
	`load_test_id` integer NOT NULL,
	`gauge_id` integer NOT NULL,
	`predicted` real NOT NULL,
	PRIMARY KEY(`load_test_id`, `gauge_id`),
	FOREIGN KEY (`load_test_id`) REFERENCES `load_tests`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`gauge_id`) REFERENCES `gauges`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE TABLE `load_tests` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`structure_id` integer NOT NULL,
	`title` text NOT NULL,
	`load` text NOT NULL,
	`start` integer NOT NULL,
	`end` integer NOT NULL,
	`created_by_id` integer,
	`created_by_label` text NOT NULL,
	`created_at` integer DEFAULT (cast(unixepoch('subsec') * 1000 as integer)) NOT NULL,
	FOREIGN KEY (`structure_id`) REFERENCES `structures`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `load_tests_structure` ON `load_tests` (`structure_id`,`start`);