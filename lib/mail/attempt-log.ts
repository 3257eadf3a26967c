import type { MailAttempt } from "@/db/schema";

/** A message retried for days keeps its latest attempts; the first ones say little more. */
export const KEPT_ATTEMPTS = 20;

export function withAttempt(log: readonly MailAttempt[] | null | undefined, attempt: MailAttempt): MailAttempt[] {
  return [...(log ?? []), attempt].slice(-KEPT_ATTEMPTS);
}

const OUTCOME_WORDS: Record<MailAttempt["outcome"], string> = {
  sent: "sent",
  refused: "refused by the relay (not retried)",
  later: "relay asked to try later",
  relay: "relay not reached",
  failed: "failed",
};

/** "2026-12-03 10:05 UTC: relay not reached — connect ECONNREFUSED", newest last. */
export function attemptLines(log: readonly MailAttempt[] | null | undefined, when: (iso: string) => string): string[] {
  return (log ?? []).map((attempt) => {
    const time = attempt.at ? when(attempt.at) : "earlier (time not kept)";
    return `${time}: ${OUTCOME_WORDS[attempt.outcome]}${attempt.answer ? ` — ${attempt.answer}` : ""}`;
  });
}
