-- Messages already queued get the priority lib/mail/priority.ts gives their kind and level; alert
-- e-mails name their level first in the subject.
UPDATE `mail_outbox` SET `priority` = CASE
  WHEN `kind` IN ('digest', 'report') THEN 4
  WHEN `kind` IN ('invitation', 'password-reset') THEN 1
  WHEN `subject` LIKE 'CRITICAL:%' THEN 0
  WHEN `subject` LIKE 'WARNING:%' THEN 1
  WHEN `subject` LIKE 'Sensor fault:%' OR `subject` LIKE 'Resolved:%' THEN 3
  ELSE 2
END;--> statement-breakpoint
-- An alert stored before peaks were timed: its peak was taken at its last event, at the latest when it opened.
UPDATE `alerts` SET `peak_at` = `opened_at` WHERE `peak` IS NOT NULL AND `peak_at` IS NULL;
