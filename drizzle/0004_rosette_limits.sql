CREATE TABLE `rosette_evaluation_states` (
	`rosette_id` integer PRIMARY KEY NOT NULL,
	`state` text NOT NULL,
	FOREIGN KEY (`rosette_id`) REFERENCES `rosettes`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE TABLE `rosette_limits` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`rosette_id` integer NOT NULL,
	`quantity` text NOT NULL,
	`level` text NOT NULL,
	`upper` real,
	`lower` real,
	`hysteresis` real DEFAULT 0 NOT NULL,
	`persistence` integer DEFAULT 1 NOT NULL,
	FOREIGN KEY (`rosette_id`) REFERENCES `rosettes`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `rosette_limits_level` ON `rosette_limits` (`rosette_id`,`quantity`,`level`);--> statement-breakpoint
ALTER TABLE `alerts` ADD `rosette_id` integer REFERENCES rosettes(id);