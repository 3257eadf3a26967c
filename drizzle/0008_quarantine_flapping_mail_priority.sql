DROP INDEX `mail_outbox_due`;--> statement-breakpoint
ALTER TABLE `mail_outbox` ADD `priority` integer DEFAULT 2 NOT NULL;--> statement-breakpoint
CREATE INDEX `mail_outbox_due` ON `mail_outbox` (`state`,`priority`,`next_attempt_at`);--> statement-breakpoint
ALTER TABLE `alert_events` ADD `deferred_at` integer;--> statement-breakpoint
CREATE INDEX `alert_events_deferred` ON `alert_events` (`deferred_at`);--> statement-breakpoint
ALTER TABLE `alerts` ADD `peak_at` integer;--> statement-breakpoint
ALTER TABLE `alerts` ADD `openings` integer DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE `alerts` ADD `flapping_since` integer;--> statement-breakpoint
ALTER TABLE `alerts` ADD `settled_at` integer;--> statement-breakpoint
ALTER TABLE `readings` ADD `fault` integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `structure_members` ADD `sensor_mail` text;