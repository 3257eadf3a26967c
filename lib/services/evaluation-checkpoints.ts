import "server-only";
import { and, desc, eq, gt, inArray, lt } from "drizzle-orm";
import type { WriteTx } from "@/db/client";
import type { evaluationCheckpoints } from "@/db/schema";

/** A gauge's or a rosette's checkpoints: `evaluationCheckpoints` or `rosetteEvaluationCheckpoints`. */
export type CheckpointTable = typeof evaluationCheckpoints;

/** A state saved after a batch, so a late reading can be evaluated from the state just before it. */
export type Checkpoint<State> = { time: number; state: State };

const CHECKPOINT_SPACING_MS = 3_600_000;
/** Three days of hourly checkpoints: readings later than that are stored but not evaluated for alerts. */
export const CHECKPOINTS_KEPT_MS = 3 * 86_400_000;

/** After a batch ending at `lastTime`: the state is a checkpoint once an hour, rather than after every batch. */
export function nextCheckpoint<State>(
  lastTime: number | null,
  lastCheckpointAt: number | null,
  state: State,
): { lastCheckpointAt: number | null; checkpoint: Checkpoint<State> | null } {
  const due = lastTime !== null && (lastCheckpointAt === null || lastTime - lastCheckpointAt >= CHECKPOINT_SPACING_MS);
  return due ? { lastCheckpointAt: lastTime, checkpoint: { time: lastTime, state } } : { lastCheckpointAt, checkpoint: null };
}

/** Stores the checkpoints of a request and drops those older than three days, with one statement for all owners. */
export async function saveCheckpoints(tx: WriteTx, table: CheckpointTable, checkpoints: readonly (Checkpoint<unknown> & { ownerId: number })[]) {
  if (checkpoints.length === 0) return;
  await tx.insert(table).values([...checkpoints]).onConflictDoNothing();
  // One cut-off for all: the earliest keeps at least three days for every owner.
  const cutoff = Math.min(...checkpoints.map(({ time }) => time)) - CHECKPOINTS_KEPT_MS;
  const ownerIds = checkpoints.map(({ ownerId }) => ownerId);
  await tx.delete(table).where(and(inArray(table.ownerId, ownerIds), lt(table.time, cutoff)));
}

async function checkpointBefore<State>(tx: WriteTx, table: CheckpointTable, ownerId: number, time: number): Promise<Checkpoint<State> | undefined> {
  const [row] = await tx
    .select()
    .from(table)
    .where(and(eq(table.ownerId, ownerId), lt(table.time, time)))
    .orderBy(desc(table.time))
    .limit(1);
  return row && { time: row.time, state: row.state as State };
}

/** The checkpoint before `time` if `parse` (the state's schema check) can read it; an older build's is passed over as if absent. */
export async function readableCheckpointBefore<State>(
  tx: WriteTx,
  table: CheckpointTable,
  ownerId: number,
  time: number,
  parse: (stored: unknown) => State | null,
): Promise<Checkpoint<State> | undefined> {
  const checkpoint = await checkpointBefore<unknown>(tx, table, ownerId, time);
  const state = checkpoint && parse(checkpoint.state);
  return state ? { time: checkpoint!.time, state } : undefined;
}

/** A replay rewrites what happened after its checkpoint, so later checkpoints no longer hold. */
export async function dropCheckpointsAfter(tx: WriteTx, table: CheckpointTable, ownerId: number, time: number) {
  await tx.delete(table).where(and(eq(table.ownerId, ownerId), gt(table.time, time)));
}
