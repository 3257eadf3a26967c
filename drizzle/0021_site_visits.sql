CREATE TABLE `site_visit_gauges` (
	`visit_id` integer NOT NULL,
	`gauge_id` integer NOT NULL,
	PRIMARY KEY(`visit_id`, `gauge_id`),
	FOREIGN KEY (`visit_id`) REFERENCES `site_visits`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`gauge_id`) REFERENCES `gauges`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `site_visit_gauges_gauge` ON `site_visit_gauges` (`gauge_id`);--> statement-breakpoint
CREATE TABLE `site_visit_photos` (
	`visit_id` integer NOT NULL,
	`file_id` integer NOT NULL,
	PRIMARY KEY(`visit_id`, `file_id`),
	FOREIGN KEY (`visit_id`) REFERENCES `site_visits`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`file_id`) REFERENCES `files`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `site_visit_photos_file_id_unique` ON `site_visit_photos` (`file_id`);--> statement-breakpoint
CREATE TABLE `site_visits` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`structure_id` integer NOT NULL,
	`visited_at` integer NOT NULL,
	`visitor` text NOT NULL,
	`work_done` text NOT NULL,
	`created_by_id` integer,
	`created_by_label` text NOT NULL,
	`created_at` integer DEFAULT (cast(unixepoch('subsec') * 1000 as integer)) NOT NULL,
	FOREIGN KEY (`structure_id`) REFERENCES `structures`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `site_visits_structure` ON `site_visits` (`structure_id`,`visited_at`);