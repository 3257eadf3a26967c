CREATE TABLE `rosette_evaluation_checkpoints` (
	`rosette_id` integer NOT NULL,
	`time` integer NOT NULL,
	`state` text NOT NULL,
	PRIMARY KEY(`rosette_id`, `time`),
	FOREIGN KEY (`rosette_id`) REFERENCES `rosettes`(`id`) ON UPDATE no action ON DELETE cascade
);
