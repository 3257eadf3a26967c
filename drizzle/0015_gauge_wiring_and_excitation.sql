ALTER TABLE `gauges` ADD `wiring` text;--> statement-breakpoint
ALTER TABLE `gauges` ADD `excitation_voltage` real;