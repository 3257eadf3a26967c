import { beforeAll, describe, expect, it } from "vitest";
import { getClient } from "@/db/client";
import { DEMO_GAUGES } from "@/db/demo-gauges";
import { DEMO_SEED, demoStory, seedDemo } from "@/db/seed";
import { runDemoLogger } from "@/jobs/demo-logger";
import { withLease } from "@/jobs/lease";
import { JOBS } from "@/jobs/registry";
import { syntheticReadings } from "@/lib/demo";

const INTERVAL = 600_000;
// On the demo's 10-minute grid (demoPeriod aligns to it), so exactly one reading of each gauge is due.
const NOW = Math.floor(Date.now() / INTERVAL) * INTERVAL;
const LEASE_MS = 5 * 60_000;

/** Two app instances running the job at the same moment, each under its own lease holder. */
const bothInstances = (now: number) =>
  Promise.all(["instance-a", "instance-b"].map((holder) => withLease("demo-logger", LEASE_MS, () => runDemoLogger(now), holder)));

async function readingTimes(): Promise<Map<string, number[]>> {
  const result = await getClient().execute("SELECT g.tag, r.t FROM readings r JOIN gauges g ON g.id = r.gauge_id ORDER BY g.tag, r.t");
  const times = new Map<string, number[]>();
  for (const row of result.rows) times.set(String(row.tag), [...(times.get(String(row.tag)) ?? []), Number(row.t)]);
  return times;
}

beforeAll(async () => {
  await seedDemo(NOW, { readings: false });
});

describe("the demo logger job", () => {
  it("is not scheduled unless the demo turns it on", () => {
    expect(JOBS.map((job) => job.name)).not.toContain("demo-logger");
  });

  it("sends one reading per gauge per interval, once, with two instances running", async () => {
    const first = await bothInstances(NOW);
    // One instance holds the lease; the other skips (null).
    expect(first.filter((summary) => summary === null)).toHaveLength(1);
    expect(first).toContain(`${DEMO_GAUGES.length} demo readings sent`);
    let times = await readingTimes();
    expect([...times.keys()].sort()).toEqual(DEMO_GAUGES.map((gauge) => gauge.input.tag).sort());
    for (const tag of times.keys()) expect(times.get(tag)).toEqual([NOW]);

    // Five minutes later nothing is due; ten minutes later one more each, sent by one instance only.
    expect(await runDemoLogger(NOW + 5 * 60_000)).toBe("0 demo readings sent");
    await bothInstances(NOW + INTERVAL);
    expect(await runDemoLogger(NOW + INTERVAL)).toBe("0 demo readings sent");
    // 35 minutes after the first: the 20- and 30-minute readings are due, not the 40-minute one.
    await bothInstances(NOW + 35 * 60_000);
    times = await readingTimes();
    for (const tag of times.keys()) expect(times.get(tag)).toEqual([NOW, NOW + INTERVAL, NOW + 2 * INTERVAL, NOW + 3 * INTERVAL]);
  });

  it("continues the seeded story: the readings are the ones the seed's generator makes for those times", async () => {
    const { start, gauges } = await demoStory("ORCH-PD");
    const expected = [...syntheticReadings({ start, seed: DEMO_SEED, gauges, from: NOW, until: NOW + 35 * 60_000 })];
    const stored = await getClient().execute({
      sql: "SELECT g.tag, r.t, r.value FROM readings r JOIN gauges g ON g.id = r.gauge_id JOIN structures s ON s.id = g.structure_id WHERE s.code = 'ORCH-PD' ORDER BY r.t, g.tag",
      args: [],
    });
    const byKey = new Map(stored.rows.map((row) => [`${row.tag}@${row.t}`, Number(row.value)]));
    expect(byKey.size).toBe(expected.length);
    for (const reading of expected) expect(byKey.get(`${reading.gauge}@${reading.time}`)).toBe(reading.value);
  });
});
