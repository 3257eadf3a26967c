import "server-only";
import { randomBytes } from "node:crypto";
import os from "node:os";
import { and, eq, isNull, lt, or } from "drizzle-orm";
import { getDb } from "@/db/client";
import { jobLeases } from "@/db/schema";

/** Who this process is in lease rows: readable in the admin's eyes, unique across restarts. */
export const PROCESS_HOLDER = `${os.hostname()}:${process.pid}:${randomBytes(3).toString("hex")}`;

/** Renew well before the lease runs out, so a slow database round trip never lets it lapse. */
export function renewEveryMs(ttlMs: number): number {
  return Math.max(1_000, Math.floor(ttlMs / 3));
}

/** Runs under way in this process, by job and holder: the lease row cannot tell two runs of one holder apart. */
const running = new Set<string>();

/** The leases this process holds now, with the signal that stops their runs. */
const held = new Map<string, { name: string; holder: string; stop: AbortController }>();

/**
 * Takes the lease `name` in one statement: a new row, or the existing one when its lease has
 * run out or is already ours. SQLite runs the statement under its write lock, so of two
 * processes racing here exactly one gets the row back. With a `slot` (the scheduled instant
 * the run is for), the row is also refused once a run for that instant or a later one started:
 * two instances whose timers fire a moment apart would otherwise run the job one after the
 * other, as the first gives the lease back before the second asks.
 */
async function acquire(name: string, holder: string, ttlMs: number, slot: Date | null): Promise<boolean> {
  const now = Date.now();
  const free = or(lt(jobLeases.leaseUntil, new Date(now)), eq(jobLeases.holder, holder));
  const taken = await getDb()
    .insert(jobLeases)
    .values({ name, holder, leaseUntil: new Date(now + ttlMs), lastStartedAt: new Date(now), lastSlot: slot })
    .onConflictDoUpdate({
      target: jobLeases.name,
      set: { holder, leaseUntil: new Date(now + ttlMs), lastStartedAt: new Date(now), ...(slot ? { lastSlot: slot } : {}) },
      setWhere: slot ? and(free, or(isNull(jobLeases.lastSlot), lt(jobLeases.lastSlot, slot))) : free,
    })
    .returning({ name: jobLeases.name });
  return taken.length > 0;
}

async function renew(name: string, holder: string, ttlMs: number): Promise<boolean> {
  const renewed = await getDb()
    .update(jobLeases)
    .set({ leaseUntil: new Date(Date.now() + ttlMs) })
    .where(and(eq(jobLeases.name, name), eq(jobLeases.holder, holder)))
    .returning({ name: jobLeases.name });
  return renewed.length > 0;
}

async function release(name: string, holder: string, outcome: string) {
  const now = new Date();
  await getDb()
    .update(jobLeases)
    .set({ leaseUntil: now, lastFinishedAt: now, lastOutcome: outcome })
    .where(and(eq(jobLeases.name, name), eq(jobLeases.holder, holder)));
}

/**
 * Runs `fn` only if this process holds the database lease `name`, so that of several app
 * instances only one runs a job at a time. The lease is renewed while `fn` runs; if it is lost
 * anyway (the database was unreachable longer than the lease), `signal` aborts and `fn` should
 * stop at its next safe point. A scheduled run names its `slot`, the instant it was scheduled
 * for, and runs only if no instance has started a run for that instant (or a later one) yet.
 * Answers `fn`'s summary, or null when another holder has the lease or the slot was run.
 */
export async function withLease(
  name: string,
  ttlMs: number,
  fn: (signal: AbortSignal) => Promise<string>,
  holder: string = PROCESS_HOLDER,
  slot: Date | null = null,
): Promise<string | null> {
  const run = `${name}\n${holder}`;
  if (running.has(run)) return null;
  running.add(run);
  try {
    if (!(await acquire(name, holder, ttlMs, slot))) return null;
    const lost = new AbortController();
    held.set(run, { name, holder, stop: lost });
    const timer = setInterval(() => {
      renew(name, holder, ttlMs).then(
        (held) => held || lost.abort(new Error(`Lease "${name}" was lost.`)),
        (error: unknown) => console.error(`Renewing lease "${name}":`, error),
      );
    }, renewEveryMs(ttlMs));
    timer.unref();
    // A stop may have released the lease already (releaseHeldLeases); its outcome stands.
    try {
      const summary = await fn(lost.signal);
      if (held.delete(run)) await release(name, holder, `ok: ${summary}`);
      return summary;
    } catch (error) {
      if (held.delete(run)) await release(name, holder, `error: ${error instanceof Error ? error.message : String(error)}`);
      throw error;
    } finally {
      clearInterval(timer);
      held.delete(run);
    }
  } finally {
    running.delete(run);
  }
}

/**
 * A stopping process gives its leases back at once, rather than leaving another instance to wait
 * out their time: each run is told to stop at its next safe point and its lease row is freed.
 * Answers how many were released.
 */
export async function releaseHeldLeases(reason: string): Promise<number> {
  const leases = [...held.entries()];
  for (const [run, { name, holder, stop }] of leases) {
    held.delete(run);
    await release(name, holder, `stopped: ${reason}`);
    stop.abort(new Error(`Stopping: ${reason}.`));
  }
  return leases.length;
}

const globalForStop = globalThis as unknown as { hookelineStopHandlers?: boolean };

/**
 * On SIGTERM or SIGINT, releases this process's leases, then lets the signal do what it would have
 * done: other handlers (the web server's) run as before, and with none the process ends.
 */
export function releaseLeasesOnStop(): void {
  if (globalForStop.hookelineStopHandlers) return;
  globalForStop.hookelineStopHandlers = true;
  for (const signal of ["SIGTERM", "SIGINT"] as const) {
    const onStop = () => {
      void releaseHeldLeases(signal)
        .catch((error: unknown) => console.error("Releasing job leases:", error))
        .finally(() => {
          if (process.listenerCount(signal) === 0) process.kill(process.pid, signal);
        });
    };
    process.once(signal, onStop);
  }
}
