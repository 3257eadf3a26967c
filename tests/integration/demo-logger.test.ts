import { beforeAll, describe, expect, it } from "vitest";
import { getClient } from "@/db/client";
import { DEMO_DYNAMIC_GAUGES, DEMO_GAUGES } from "@/db/demo-gauges";
import { DEMO_SEED, demoBurstStory, demoStory, seedDemo } from "@/db/seed";
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

const STATIC_TAGS = new Set(DEMO_GAUGES.map((gauge) => gauge.input.tag));
const DYNAMIC_TAGS = DEMO_DYNAMIC_GAUGES.map((gauge) => gauge.input.tag);

/** Reading times of the static demo gauges (a dynamic gauge's bursts also store their extremes as readings). */
async function readingTimes(): Promise<Map<string, number[]>> {
  const result = await getClient().execute("SELECT g.tag, r.t FROM readings r JOIN gauges g ON g.id = r.gauge_id ORDER BY g.tag, r.t");
  const times = new Map<string, number[]>();
  for (const row of result.rows) {
    const tag = String(row.tag);
    if (STATIC_TAGS.has(tag)) times.set(tag, [...(times.get(tag) ?? []), Number(row.t)]);
  }
  return times;
}

/** Each dynamic demo gauge's stored bursts: start and sample count. */
async function burstsByGauge(): Promise<Map<string, { start: number; samples: number }[]>> {
  const result = await getClient().execute("SELECT g.tag, b.start, b.samples FROM bursts b JOIN gauges g ON g.id = b.gauge_id ORDER BY g.tag, b.start");
  const stored = new Map<string, { start: number; samples: number }[]>(DYNAMIC_TAGS.map((tag) => [tag, []]));
  for (const row of result.rows) stored.get(String(row.tag))!.push({ start: Number(row.start), samples: Number(row.samples) });
  return stored;
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
    // The dynamic gauges send the last burst that has ended: the one of five minutes before.
    expect(first).toContain(`${DEMO_GAUGES.length} demo readings and ${DYNAMIC_TAGS.length} bursts sent`);
    let times = await readingTimes();
    expect([...times.keys()].sort()).toEqual(DEMO_GAUGES.map((gauge) => gauge.input.tag).sort());
    for (const tag of times.keys()) expect(times.get(tag)).toEqual([NOW]);

    // Five minutes later no reading is due, only the burst that just ended; ten minutes later one more reading each, sent by one instance only.
    expect(await runDemoLogger(NOW + 5 * 60_000)).toBe(`0 demo readings and ${DYNAMIC_TAGS.length} bursts sent`);
    await bothInstances(NOW + INTERVAL);
    expect(await runDemoLogger(NOW + INTERVAL)).toBe("0 demo readings and 0 bursts sent");
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
    const staticRows = stored.rows.filter((row) => STATIC_TAGS.has(String(row.tag)));
    const byKey = new Map(staticRows.map((row) => [`${row.tag}@${row.t}`, Number(row.value)]));
    expect(byKey.size).toBe(expected.length);
    for (const reading of expected) expect(byKey.get(`${reading.gauge}@${reading.time}`)).toBe(reading.value);
  });

  it("keeps the dynamic gauges fed: a minute's burst at their rate every five minutes, so they never go stale", async () => {
    const stored = await burstsByGauge();
    const step = 5 * 60_000;
    for (const tag of DYNAMIC_TAGS) {
      const starts = stored.get(tag)!.map((burst) => burst.start);
      // Every five minutes from the first burst (5 min before NOW) to the last ended by NOW + 35 min (started at NOW + 30 min).
      expect(starts).toEqual(Array.from({ length: 8 }, (_, i) => NOW - step + i * step));
      // 60 s at 100 Hz: 6 000 samples each, a modest rate beside the contract's 2 000 000 per request.
      expect(stored.get(tag)!.every((burst) => burst.samples === 6_000)).toBe(true);
    }
    const { gauges } = (await demoBurstStory("ORCH-PD"))!;
    expect(gauges.map((gauge) => gauge.tag)).toEqual(DYNAMIC_TAGS.filter((tag) => tag.startsWith("L2")));
  });

  it("resumes the dynamic gauges after a long stop with the last hour only", async () => {
    const later = NOW + 2 * 86_400_000;
    await runDemoLogger(later);
    for (const bursts of (await burstsByGauge()).values()) {
      const resumed = bursts.filter((burst) => burst.start > NOW + 35 * 60_000);
      // Twelve bursts of five minutes: the hour before `later`, the last one ended by then.
      expect(resumed.map((burst) => burst.start)).toEqual(Array.from({ length: 12 }, (_, i) => later - 12 * 5 * 60_000 + i * 5 * 60_000));
    }
  }, 60_000);
});
