import { beforeAll, describe, expect, it, vi } from "vitest";
import { getClient } from "@/db/client";
import type { Structure } from "@/db/schema";
import { createGauge, resolveGauge } from "@/lib/services/gauges";
import { gaugeStatuses, structureSummaries } from "@/lib/services/status";
import { makeStructure, makeUser } from "./helpers";
import { microstrainGauge } from "../fixtures/gauges";
import { storeReadings, type StoredReading } from "../fixtures/readings";

const E_STEEL = 210_000;
const YIELD = 355;
const NOW = Date.UTC(2026, 10, 2, 12);
const HOUR = 3_600_000;
const reading = (time: number, stress: number): StoredReading => ({ time, stress, strain: (stress / E_STEEL) * 1e6, temperature: 12 });

let bridge: Structure;
let empty: Structure;
let single: Structure;

beforeAll(async () => {
  const admin = await makeUser("admin");
  empty = await makeStructure("EMPTY");
  bridge = await makeStructure("SUMM");
  single = await makeStructure("ONE");
  for (const tag of ["A", "B"]) {
    await createGauge(admin, "SUMM", microstrainGauge(tag, { material: { E: E_STEEL, nu: 0.3, alpha: 12, yield: YIELD }, zero: { value: 0, temperature: 12, time: "2026-10-01T00:00:00Z" } }));
  }
  await createGauge(admin, "ONE", microstrainGauge("C", { material: { E: E_STEEL, nu: 0.3, alpha: 12, yield: YIELD }, zero: { value: 0, temperature: 12, time: "2026-10-01T00:00:00Z" } }));
  const gaugeC = (await resolveGauge(admin, "ONE", "C", "structure:view")).gauge;
  await storeReadings(getClient(), gaugeC.id, [reading(NOW - HOUR, 20)]);
  const gaugeA = (await resolveGauge(admin, "SUMM", "A", "structure:view")).gauge;
  const gaugeB = (await resolveGauge(admin, "SUMM", "B", "structure:view")).gauge;
  // A: a tensile spike 3 h ago, then back to 50 MPa; B: its largest magnitude is compressive.
  await storeReadings(getClient(), gaugeA.id, [reading(NOW - 30 * HOUR, 300), reading(NOW - 3 * HOUR, 200), reading(NOW - 10 * 60_000, 50)]);
  await storeReadings(getClient(), gaugeB.id, [reading(NOW - 5 * HOUR, -250), reading(NOW - 20 * 60_000, 10)]);
});

describe("structure summaries in one batch", () => {
  it("keeps the order asked for and answers a structure without gauges", async () => {
    const [ofEmpty, ofBridge] = await structureSummaries([empty, bridge], NOW);
    expect(ofEmpty).toMatchObject({ gaugeCount: 0, lastReadingAt: null, peakUtilisation24h: null, stale: false });
    expect(ofBridge!.gaugeCount).toBe(2);
  });

  it("takes each gauge's newest reading and the day's largest |σ| / yield, compression included", async () => {
    const [summary] = await structureSummaries([bridge], NOW);
    expect(summary!.lastReadingAt).toBe(NOW - 10 * 60_000);
    // Utilisation is |σ| / f_y by definition; the 300 MPa reading is older than 24 h and must not count.
    expect(summary!.peakUtilisation24h).toBeCloseTo(250 / YIELD, 12);
    const statuses = await gaugeStatuses(bridge, NOW);
    expect(statuses.map((status) => [status.tag, status.latest?.stress])).toEqual([
      ["A", 50],
      ["B", 10],
    ]);
    expect(statuses[0]!.latest!.rating).toEqual({ basis: "yield", strength: YIELD, ratio: expect.closeTo(50 / YIELD, 12) });
  });

  it("asks the database the same number of times for one structure as for several", async () => {
    const client = getClient();
    const calls = () => vi.mocked(client.execute).mock.calls.length + vi.mocked(client.batch).mock.calls.length;
    vi.spyOn(client, "execute");
    vi.spyOn(client, "batch");
    await structureSummaries([bridge], NOW);
    const forOne = calls();
    await structureSummaries([bridge, single], NOW);
    const forTwo = calls() - forOne;
    vi.restoreAllMocks();
    expect(forOne).toBeGreaterThan(0);
    expect(forTwo).toBe(forOne);
  });
});
