/**
 * Child process of scheduled-jobs.test.ts: an app instance's scheduler, reduced to what it does
 * at each tick. Once the parent says go, it runs the named job for each scheduled instant given
 * (epoch ms, in order) as node-cron's callback would, the i-th at i × step + offset ms after the
 * go: the offset is how much later than the other instance its timer fires. Prints one JSON line
 * per instant with what the run answered (null when another instance had the lease or had run
 * that instant). Reads DATABASE_URL like the app.
 */
import { setTimeout as sleep } from "node:timers/promises";
import { migrateDatabase } from "@/db/migrate";
import { JOBS, runJob } from "@/jobs/registry";

const [name, offset, step, ...slots] = process.argv.slice(2);
const job = JOBS.find((candidate) => candidate.name === name);
if (!job) throw new Error(`No job named ${name}`);
await migrateDatabase();
console.log("ready");
await new Promise((resolve) => process.stdin.once("data", resolve));
const go = performance.now();
for (const [i, slot] of slots.entries()) {
  await sleep(Math.max(0, go + i * Number(step) + Number(offset) - performance.now()));
  console.log(JSON.stringify({ slot: Number(slot), outcome: await runJob(job, new Date(Number(slot))) }));
}
process.exit(0);
