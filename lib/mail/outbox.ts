import "server-only";
import type { WriteTx } from "@/db/client";
import { mailOutbox, type MailAttachment, type MailKind } from "@/db/schema";
import type { BuiltMail } from "./message";
import { priorityOfKind } from "./priority";

/** Anything that can insert: the caller's transaction, so the message commits with what caused it. */
type Writer = Pick<WriteTx, "insert">;

export type QueuedMail = BuiltMail & {
  to: string;
  toUserId?: number | null;
  kind: MailKind;
  /**
   * Names the message for its purpose and recipient, e.g. `alert:<id>:<event>:<user>`: a second
   * queueMail with the same key is a no-op, so retried work never mails anyone twice.
   */
  dedupeKey: string;
  attachments?: MailAttachment[];
  /** Lower is sent first; by default from the kind (lib/mail/priority.ts). */
  priority?: number;
};

/**
 * Puts a message in the outbox; the outbox sender job delivers it. Never send mail from a
 * request: a slow or absent relay would hold the request, and a rollback could not take it back.
 * Returns false when a message with the same dedupe key was already queued.
 */
export async function queueMail(tx: Writer, message: QueuedMail): Promise<boolean> {
  const inserted = await tx
    .insert(mailOutbox)
    .values({
      toAddress: message.to,
      toUserId: message.toUserId ?? null,
      kind: message.kind,
      dedupeKey: message.dedupeKey,
      subject: message.subject,
      text: message.text,
      html: message.html,
      attachments: message.attachments ?? null,
      priority: message.priority ?? priorityOfKind(message.kind),
    })
    .onConflictDoNothing({ target: mailOutbox.dedupeKey })
    .returning({ id: mailOutbox.id });
  return inserted.length > 0;
}
