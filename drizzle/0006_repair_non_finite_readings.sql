-- Data repair: readings stored with a strain, stress or temperature that is not a finite number
-- (a raw 1e308 overflowed to Infinity before ingestion rejected such readings as `not-finite`),
-- and the roll-ups and alert values they poisoned. SQLite keeps ±Infinity in REAL columns and
-- turns NaN into NULL; no finite double exceeds 1.7976931348623157e308 in magnitude.
-- 1. Note every roll-up row to rebuild: the hour and day of each poisoned reading, and any row
--    holding a non-finite or missing statistic (9e999 is how SQLite writes Infinity).
CREATE TABLE `repair_rollup_buckets` (
	`gauge_id` integer NOT NULL,
	`resolution` integer NOT NULL,
	`bucket` integer NOT NULL,
	PRIMARY KEY(`gauge_id`, `resolution`, `bucket`)
);
--> statement-breakpoint
INSERT OR IGNORE INTO `repair_rollup_buckets` (`gauge_id`, `resolution`, `bucket`)
SELECT r.`gauge_id`, res.`resolution`, (r.`t` / res.`resolution`) * res.`resolution`
FROM `readings` r, (SELECT 3600000 AS `resolution` UNION ALL SELECT 86400000) res
WHERE abs(r.`strain`) > 1.7976931348623157e308 OR abs(r.`stress`) > 1.7976931348623157e308 OR abs(r.`temperature`) > 1.7976931348623157e308;
--> statement-breakpoint
INSERT OR IGNORE INTO `repair_rollup_buckets` (`gauge_id`, `resolution`, `bucket`)
SELECT `gauge_id`, `resolution`, `bucket` FROM `rollups`
WHERE coalesce(abs(`strain_min`), 9e999) > 1.7976931348623157e308 OR coalesce(abs(`strain_max`), 9e999) > 1.7976931348623157e308
	OR coalesce(abs(`strain_sum`), 9e999) > 1.7976931348623157e308 OR coalesce(abs(`stress_min`), 9e999) > 1.7976931348623157e308
	OR coalesce(abs(`stress_max`), 9e999) > 1.7976931348623157e308 OR coalesce(abs(`stress_sum`), 9e999) > 1.7976931348623157e308
	OR (`temperature_count` > 0 AND (coalesce(abs(`temperature_min`), 9e999) > 1.7976931348623157e308
		OR coalesce(abs(`temperature_max`), 9e999) > 1.7976931348623157e308 OR coalesce(abs(`temperature_sum`), 9e999) > 1.7976931348623157e308));
--> statement-breakpoint
-- 2. Keep what each poisoned reading was in the audit trail (raw value and temperature as sent),
--    then take it out of the readings: it measured nothing, and every chart, sum and fatigue count over it broke.
INSERT INTO `audit_log` (`actor_label`, `action`, `entity_type`, `entity_key`, `structure_id`, `before`)
SELECT 'data repair: non-finite readings', 'reading.remove-non-finite', 'reading',
	s.`code` || '/' || g.`tag` || '@' || strftime('%Y-%m-%dT%H:%M:%fZ', r.`t` / 1000.0, 'unixepoch'), g.`structure_id`,
	json_object('value', CAST(r.`value` AS TEXT), 'temperature', CAST(r.`temperature` AS TEXT), 'strain', CAST(r.`strain` AS TEXT), 'stress', CAST(r.`stress` AS TEXT), 'flags', r.`flags`)
FROM `readings` r JOIN `gauges` g ON g.`id` = r.`gauge_id` JOIN `structures` s ON s.`id` = g.`structure_id`
WHERE abs(r.`strain`) > 1.7976931348623157e308 OR abs(r.`stress`) > 1.7976931348623157e308 OR abs(r.`temperature`) > 1.7976931348623157e308;
--> statement-breakpoint
DELETE FROM `readings`
WHERE abs(`strain`) > 1.7976931348623157e308 OR abs(`stress`) > 1.7976931348623157e308 OR abs(`temperature`) > 1.7976931348623157e308;
--> statement-breakpoint
-- 3. Rebuild the noted roll-up rows from the readings that remain, as the nightly maintenance does;
--    a bucket left without readings keeps no row.
DELETE FROM `rollups`
WHERE EXISTS (SELECT 1 FROM `repair_rollup_buckets` b WHERE b.`gauge_id` = `rollups`.`gauge_id` AND b.`resolution` = `rollups`.`resolution` AND b.`bucket` = `rollups`.`bucket`);
--> statement-breakpoint
INSERT INTO `rollups` (`gauge_id`, `resolution`, `bucket`, `count`, `strain_min`, `strain_max`, `strain_sum`, `stress_min`, `stress_max`, `stress_sum`,
	`temperature_count`, `temperature_min`, `temperature_max`, `temperature_sum`)
SELECT b.`gauge_id`, b.`resolution`, b.`bucket`, count(*), min(r.`strain`), max(r.`strain`), sum(r.`strain`), min(r.`stress`), max(r.`stress`), sum(r.`stress`),
	count(r.`temperature`), min(r.`temperature`), max(r.`temperature`), sum(r.`temperature`)
FROM `repair_rollup_buckets` b JOIN `readings` r ON r.`gauge_id` = b.`gauge_id` AND r.`t` >= b.`bucket` AND r.`t` < b.`bucket` + b.`resolution`
GROUP BY b.`gauge_id`, b.`resolution`, b.`bucket`;
--> statement-breakpoint
DROP TABLE `repair_rollup_buckets`;
--> statement-breakpoint
-- 4. An alert raised by such a reading keeps its history, but its peak and event values are
--    unknown rather than Infinity, so no page prints "Infinity".
UPDATE `alerts` SET `peak` = NULL WHERE abs(`peak`) > 1.7976931348623157e308;
--> statement-breakpoint
UPDATE `alert_events` SET `value` = NULL WHERE abs(`value`) > 1.7976931348623157e308;
