import "server-only";
import { auditLog } from "@/db/schema";
import type { WriteTx } from "@/db/client";
import { actorLabel, type Actor } from "@/lib/auth/actor";

type Writer = Pick<WriteTx, "insert">;

export type AuditRecord = {
  actor: Actor | null;
  action: string;
  entityType: string;
  entityKey: string;
  structureId?: number | null;
  before?: unknown;
  after?: unknown;
};

/** Records a configuration change with who, when and old → new; call it inside the change's transaction. */
export function recordAudit(writer: Writer, record: AuditRecord) {
  const actor = record.actor;
  return writer.insert(auditLog).values({
    actorId: actor?.kind === "user" ? actor.id : null,
    actorLabel: actor ? actorLabel(actor) : "command line",
    action: record.action,
    entityType: record.entityType,
    entityKey: record.entityKey,
    structureId: record.structureId ?? null,
    before: record.before ?? null,
    after: record.after ?? null,
  });
}
