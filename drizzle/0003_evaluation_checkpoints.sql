CREATE TABLE `evaluation_checkpoints` (
	`gauge_id` integer NOT NULL,
	`time` integer NOT NULL,
	`state` text NOT NULL,
	PRIMARY KEY(`gauge_id`, `time`),
	FOREIGN KEY (`gauge_id`) REFERENCES `gauges`(`id`) ON UPDATE no action ON DELETE cascade
);
