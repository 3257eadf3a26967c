ALTER TABLE `gauges` RENAME COLUMN "batch_factor" TO "calibration_factor";--> statement-breakpoint
ALTER TABLE `mail_outbox` ADD `attempt_log` text;