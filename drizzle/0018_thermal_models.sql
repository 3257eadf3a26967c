CREATE TABLE `thermal_models` (
	`gauge_id` integer PRIMARY KEY NOT NULL,
	`period_from` integer NOT NULL,
	`period_to` integer NOT NULL,
	`lag_search` text NOT NULL,
	`max_lag_minutes` integer,
	`intercept` real NOT NULL,
	`slope` real NOT NULL,
	`lag_minutes` integer NOT NULL,
	`drift` real,
	`drift_origin` integer NOT NULL,
	`r2` real NOT NULL,
	`residual_std` real NOT NULL,
	`readings` integer NOT NULL,
	`temperature_min` real NOT NULL,
	`temperature_max` real NOT NULL,
	`fitted_by_id` integer,
	`fitted_by_label` text NOT NULL,
	`fitted_at` integer DEFAULT (cast(unixepoch('subsec') * 1000 as integer)) NOT NULL,
	FOREIGN KEY (`gauge_id`) REFERENCES `gauges`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`fitted_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
ALTER TABLE `readings` ADD `residual` real;--> statement-breakpoint
ALTER TABLE `rollups` ADD `residual_count` integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `rollups` ADD `residual_min` real;--> statement-breakpoint
ALTER TABLE `rollups` ADD `residual_max` real;--> statement-breakpoint
ALTER TABLE `rollups` ADD `residual_sum` real;