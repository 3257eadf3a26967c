import { spawn } from "node:child_process";
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { getDb } from "@/db/client";
import { alerts, jobLeases } from "@/db/schema";
import { JOBS, runJob } from "@/jobs/registry";
import { loggerToken, makeUser } from "./helpers";
import { makeIngestStructure, postReadings, strainReadings } from "./readings-fixtures";

const MINUTE = 60_000;
const staleWatch = JOBS.find((job) => job.name === "stale-watch")!;

beforeAll(async () => {
  // Gauge S1 reported a day ago and fell silent: the first run of the stale watch raises its alert.
  await makeIngestStructure("QUIET", [await makeUser("engineer")]);
  const response = await postReadings("QUIET", await loggerToken("QUIET"), { readings: strainReadings(Date.now() - 86_400_000, 3, MINUTE, () => 10) });
  expect(response.status).toBe(200);
});

type Tick = { slot: number; outcome: string | null };

/** Ticks of the scheduler children: a run of the stale watch on this small database takes a few tens of ms. */
const STEP_MS = 1_500;

/** Starts an instance's scheduler child, its timer `offsetMs` behind; `ready` once it is migrated and waiting for the go. */
function instance(job: string, offsetMs: number, slots: number[]) {
  const args = ["--conditions=react-server", "--import", "tsx", "tests/integration/scheduled-job-child.ts", job, String(offsetMs), String(STEP_MS), ...slots.map(String)];
  const child = spawn(process.execPath, args, { env: { ...process.env } });
  let output = "";
  child.stderr.on("data", (chunk) => (output += chunk));
  const ready = new Promise<void>((resolve, reject) => {
    child.stdout.on("data", (chunk) => {
      output += chunk;
      if (output.includes("ready")) resolve();
    });
    child.on("exit", () => reject(new Error(output)));
  });
  const ticks = new Promise<Tick[]>((resolve, reject) =>
    child.on("exit", (code) => {
      if (code !== 0) return reject(new Error(`exit ${code}: ${output}`));
      resolve(output.split("\n").filter((line) => line.startsWith("{")).map((line) => JSON.parse(line) as Tick));
    }),
  );
  return { ready, go: () => child.stdin.end("go\n"), ticks };
}

describe("a once-a-minute job with two app instances on one database", () => {
  it("runs the stale watch exactly once per minute slot, whichever instance gets there first", async () => {
    // Three scheduled minutes, ticked a second and a half apart rather than a minute. Both
    // instances tick on each: A's timer fires first, B's at once (racing A for the lease) or later
    // (when A may have finished and given the lease back), as two servers' timers do.
    const first = Math.floor(Date.now() / MINUTE) * MINUTE + 10 * MINUTE;
    const slots = [first, first + MINUTE, first + 2 * MINUTE];
    const [a, b] = [instance("stale-watch", 0, slots), instance("stale-watch", 700, slots)];
    await Promise.all([a.ready, b.ready]);
    a.go();
    b.go();
    const [ticksA, ticksB] = await Promise.all([a.ticks, b.ticks]);
    expect(ticksA.map((tick) => tick.slot)).toEqual(slots);
    expect(ticksB.map((tick) => tick.slot)).toEqual(slots);
    slots.forEach((slot, i) => {
      const ran = [ticksA[i]!.outcome, ticksB[i]!.outcome].filter((outcome) => outcome !== null);
      expect(ran, `slot ${new Date(slot).toISOString()}: ${JSON.stringify([ticksA[i], ticksB[i]])}`).toHaveLength(1);
      expect(ran[0]).toMatch(/structures checked/);
    });
    // The work itself: one run raised the silent structure's alert, the two after it found it open.
    const runs = [...ticksA, ...ticksB].map((tick) => tick.outcome).filter((outcome) => outcome !== null);
    expect(runs.filter((outcome) => /1 newly stale/.test(outcome!))).toHaveLength(1);
    expect(await getDb().select().from(alerts).where(eq(alerts.code, "stale"))).toHaveLength(1);
    const [lease] = await getDb().select().from(jobLeases).where(eq(jobLeases.name, "stale-watch"));
    expect(lease!.lastSlot?.getTime()).toBe(slots.at(-1));
    expect(lease!.lastOutcome).toMatch(/^ok: /);
  }, 60_000);

  it("skips an instant already run, and runs a later one or an unscheduled run (npm run jobs -- --once)", async () => {
    const [lease] = await getDb().select().from(jobLeases).where(eq(jobLeases.name, "stale-watch"));
    const last = lease!.lastSlot!.getTime();
    expect(await runJob(staleWatch, new Date(last))).toBeNull();
    expect(await runJob(staleWatch, new Date(last - MINUTE))).toBeNull();
    expect(await runJob(staleWatch, new Date(last + MINUTE))).toMatch(/structures checked/);
    expect(await runJob(staleWatch)).toMatch(/structures checked/);
  });
});
