import { closeDb } from "@/db/client";
import { migrateDatabase } from "@/db/migrate";
import { JOBS, runJob, startJobs } from "@/jobs/registry";
import { startMailCatcher } from "@/lib/mail/local-smtp-server";

/**
 * `npm run jobs`: the background jobs in a process of their own, for installations whose web
 * servers run with JOBS=off. Leases in the database keep this and any app instance from running
 * the same job twice. `npm run jobs -- --once [name…]` runs the jobs (or the named ones) once and exits.
 */
const args = process.argv.slice(2);
await migrateDatabase();

if (args[0] === "--once") {
  const names = args.slice(1);
  const unknown = names.filter((name) => !JOBS.some((job) => job.name === name));
  if (unknown.length) {
    console.error(`Unknown job ${unknown.join(", ")}; the jobs are: ${JOBS.map((job) => job.name).join(", ")}.`);
    process.exit(2);
  }
  for (const job of JOBS.filter((j) => names.length === 0 || names.includes(j.name))) {
    console.log(`${job.name}: ${(await runJob(job)) ?? "skipped, another process holds its lease"}`);
  }
  closeDb();
} else {
  await startMailCatcher();
  if (!startJobs()) {
    console.error("JOBS=off: no jobs to run in this process.");
    process.exit(1);
  }
  console.log(`Running jobs: ${JOBS.map((job) => `${job.name} (${job.schedule} ${job.timezone})`).join(", ")}.`);
}
