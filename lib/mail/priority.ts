import type { MailKind } from "@/db/schema";
import type { Level } from "@/lib/limits/limit";

/**
 * The outbox sends lower numbers first. The more severe a structural alert, the sooner it must
 * reach someone; an invitation or password reset has a person waiting, so it goes with warnings; a
 * sensor fault asks for maintenance, not action on the structure; digests, reports and certificate reminders (weeks ahead) can wait.
 */
export const MAIL_PRIORITY = { critical: 0, warning: 1, account: 1, watch: 2, sensor: 3, summary: 4 } as const;

export function priorityOfKind(kind: MailKind): number {
  if (kind === "digest" || kind === "report" || kind === "certificate-reminder") return MAIL_PRIORITY.summary;
  if (kind === "invitation" || kind === "password-reset") return MAIL_PRIORITY.account;
  return MAIL_PRIORITY.watch;
}

/** A limit alert's e-mail by the level it tells; "back within" at any level is no longer urgent. */
export function priorityOfLimitMail(level: Level, cleared: boolean): number {
  return cleared ? MAIL_PRIORITY.watch : MAIL_PRIORITY[level];
}
