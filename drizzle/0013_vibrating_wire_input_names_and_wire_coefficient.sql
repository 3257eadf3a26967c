-- Vibrating-wire gauges read f²/1000 are now named by what they send, `frequency-squared`.
UPDATE `gauges` SET `input` = 'frequency-squared' WHERE `kind` = 'vibrating-wire' AND `input` = 'digits';
--> statement-breakpoint
-- The steel wire's default expansion coefficient changes from 12.2 to 12 µε/°C: gauges that relied
-- on the default keep the coefficient their stored strains were converted with.
UPDATE `gauges` SET `thermal` = json_set(`thermal`, '$.gaugeCte', 12.2)
WHERE `kind` = 'vibrating-wire' AND json_extract(`thermal`, '$.method') = 'cte' AND json_extract(`thermal`, '$.gaugeCte') IS NULL;
--> statement-breakpoint
-- The audit trail speaks the same names: a changed field reads as the field it is today.
UPDATE `audit_log` SET `before` = json_remove(json_set(`before`, '$.calibrationFactor', json_extract(`before`, '$.batchFactor')), '$.batchFactor')
WHERE `entity_type` = 'gauge' AND json_valid(`before`) AND json_type(`before`, '$.batchFactor') IS NOT NULL;
--> statement-breakpoint
UPDATE `audit_log` SET `after` = json_remove(json_set(`after`, '$.calibrationFactor', json_extract(`after`, '$.batchFactor')), '$.batchFactor')
WHERE `entity_type` = 'gauge' AND json_valid(`after`) AND json_type(`after`, '$.batchFactor') IS NOT NULL;
--> statement-breakpoint
UPDATE `audit_log` SET `before` = json_set(`before`, '$.input', 'frequency-squared')
WHERE `entity_type` = 'gauge' AND json_valid(`before`) AND json_extract(`before`, '$.input') = 'digits';
--> statement-breakpoint
UPDATE `audit_log` SET `after` = json_set(`after`, '$.input', 'frequency-squared')
WHERE `entity_type` = 'gauge' AND json_valid(`after`) AND json_extract(`after`, '$.input') = 'digits';
