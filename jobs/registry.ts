import "server-only";
import { createTask } from "node-cron";
import { PROCESS_HOLDER, releaseLeasesOnStop, withLease } from "./lease";
import { describeSenderResult, runOutboxSender } from "./outbox-sender";
import { runDailyDigest } from "./daily-digest";
import { runRollupMaintenance } from "./rollup-maintenance";
import { runMonthlyReport } from "./monthly-report";
import { runStaleWatch } from "./stale-watch";
import { sweepFileStore } from "@/lib/services/files";
import { runFlappingSettle } from "./flapping-settle";
import { runCertificateReminders } from "./certificate-reminders";
import { digestTimeZone } from "@/lib/time-zone-config";

/**
 * A background job: its node-cron schedule (seconds field first), how long its database lease
 * lasts before another instance may take over, and what one run does (answering a summary for
 * job_leases.last_outcome). To add a job, write its module in jobs/ and list it in JOBS.
 */
export type Job = {
  name: string;
  schedule: string;
  leaseMs: number;
  /** IANA zone the schedule is read in: named for every job, so no schedule follows the server's own zone. */
  timezone: string;
  run: (signal: AbortSignal) => Promise<string>;
};

export const JOBS: Job[] = [
  {
    name: "mail-outbox",
    schedule: "*/5 * * * * *",
    timezone: "UTC",
    leaseMs: 60_000,
    run: async (signal) => describeSenderResult(await runOutboxSender({ holder: PROCESS_HOLDER, signal })),
  },
  { name: "stale-watch", schedule: "0 * * * * *", timezone: "UTC", leaseMs: 5 * 60_000, run: () => runStaleWatch() },
  { name: "flapping-settle", schedule: "30 * * * * *", timezone: "UTC", leaseMs: 5 * 60_000, run: () => runFlappingSettle() },
  // 06:00 in DIGEST_TIMEZONE (UTC by default); the digest covers the day before in that zone.
  { name: "daily-digest", schedule: "0 0 6 * * *", timezone: digestTimeZone(), leaseMs: 15 * 60_000, run: () => runDailyDigest() },
  { name: "rollup-maintenance", schedule: "0 30 2 * * *", timezone: "UTC", leaseMs: 30 * 60_000, run: () => runRollupMaintenance() },
  { name: "file-store-sweep", schedule: "0 45 2 * * *", timezone: "UTC", leaseMs: 15 * 60_000, run: () => sweepFileStore() },
  // Daily at 06:30 UTC; each certificate's days are counted on its structure's clock.
  { name: "certificate-reminders", schedule: "0 30 6 * * *", timezone: "UTC", leaseMs: 15 * 60_000, run: () => runCertificateReminders() },
  // Every half hour: each structure's report leaves at 07:00 on the 1st of its own clocks (runMonthlyReport decides which are due).
  { name: "monthly-report", schedule: "0 */30 * * * *", timezone: "UTC", leaseMs: 25 * 60_000, run: (signal) => runMonthlyReport(Date.now(), signal) },
  // Loaded only when enabled: it carries the whole demo scenario.
  ...(demoLoggerEnabled()
    ? [{ name: "demo-logger", schedule: "15 * * * * *", timezone: "UTC", leaseMs: 5 * 60_000, run: async (signal: AbortSignal) => (await import("./demo-logger")).runDemoLogger(Date.now(), signal) }]
    : []),
];

/** DEMO_LOGGER=on, set by `npm run demo` alone, keeps the demo's gauges reporting; never on a real installation. */
export function demoLoggerEnabled(): boolean {
  return process.env.DEMO_LOGGER === "on";
}

/** JOBS=off keeps a process from running jobs: tests, benchmarks, or web servers beside a separate `npm run jobs`. */
export function jobsEnabled(): boolean {
  return process.env.JOBS !== "off";
}

/**
 * One run under the job's lease: its summary, null when another holder has the lease (or, for a
 * scheduled run, another instance already ran its `slot`), or the error logged (never thrown
 * into the scheduler) and answered as "error".
 */
export async function runJob(job: Job, slot: Date | null = null): Promise<string | null> {
  try {
    return await withLease(job.name, job.leaseMs, job.run, PROCESS_HOLDER, slot);
  } catch (error) {
    console.error(`Job "${job.name}" failed:`, error);
    return "error";
  }
}

const globalForJobs = globalThis as unknown as { hookelineJobsStarted?: boolean };

/** Schedules every job once per process (Next may evaluate this module more than once). */
export function startJobs(): boolean {
  if (!jobsEnabled() || globalForJobs.hookelineJobsStarted) return false;
  globalForJobs.hookelineJobsStarted = true;
  releaseLeasesOnStop();
  for (const job of JOBS) {
    // createTask, then start: node-cron 4's schedule() starts at once and ignores v3's `scheduled: false`.
    // node-cron's context.date is the scheduled instant, the same on every instance whose clock agrees to within the schedule's period.
    const task = createTask(job.schedule, (context) => runJob(job, context.date), { name: job.name, noOverlap: true, timezone: job.timezone });
    void task.start();
  }
  return true;
}
