-- Messages queued before attempts were logged keep what is known of theirs: the last failed answer
-- (its time was not kept) and, for a sent message, the send itself.
UPDATE `mail_outbox` SET `attempt_log` = json_array(json_object('at', NULL, 'outcome', 'failed', 'answer', `last_error`))
WHERE `attempt_log` IS NULL AND `last_error` IS NOT NULL;
--> statement-breakpoint
UPDATE `mail_outbox` SET `attempt_log` = json_insert(coalesce(`attempt_log`, json_array()), '$[#]',
  json_object('at', strftime('%Y-%m-%dT%H:%M:%fZ', `sent_at` / 1000.0, 'unixepoch'), 'outcome', 'sent'))
WHERE `state` = 'sent' AND `sent_at` IS NOT NULL;
