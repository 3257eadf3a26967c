import { beforeAll, describe, expect, it } from "vitest";
import * as fatigueRoute from "@/app/api/v1/structures/[code]/gauges/[tag]/fatigue/route";
import * as seriesRoute from "@/app/api/v1/structures/[code]/gauges/[tag]/series/route";
import { getClient } from "@/db/client";
import type { UserActor } from "@/lib/auth/actor";
import { structureReport } from "@/lib/services/report";
import { apiRequest, makeUser, params, userToken } from "./helpers";
import { makeIngestStructure, postReadings, rollupMismatches, storedCount } from "./readings-fixtures";

let token: string;
let engineer: UserActor;
const T0 = Date.UTC(2026, 2, 1, 12);
const at = (minutes: number) => new Date(T0 + minutes * 60_000).toISOString();

beforeAll(async () => {
  engineer = await makeUser("engineer");
  token = await userToken(engineer.email);
  await makeIngestStructure("PV", [engineer]);
});

async function post(readings: unknown[]) {
  const response = await postReadings("PV", token, { readings });
  return { status: response.status, body: await response.json() };
}

type Rejected = { index: number; code: string; message: string };
const codes = (rejected: Rejected[]) => rejected.map(({ index, code }) => [index, code]);

/** Any roll-up row holding a value that is not a finite number: SQLite keeps ±Infinity, and NaN arrives as NULL. */
async function poisonedRollups() {
  const result = await getClient().execute(`SELECT count(*) FROM rollups WHERE
    abs(strain_min) > 1.7976931348623157e308 OR abs(strain_max) > 1.7976931348623157e308 OR abs(strain_sum) > 1.7976931348623157e308 OR
    abs(stress_min) > 1.7976931348623157e308 OR abs(stress_max) > 1.7976931348623157e308 OR abs(stress_sum) > 1.7976931348623157e308 OR
    strain_sum IS NULL OR stress_sum IS NULL OR (temperature_count > 0 AND temperature_sum IS NULL)`);
  return Number(result.rows[0]![0]);
}

describe("a value that overflows on conversion", () => {
  it("is rejected on its own as not-finite, and the next mixed batch stores every valid reading", async () => {
    // S1 reads microstrain, E = 200 000 MPa: 1e308 µε × 200 000 MPa overflows double precision
    // (largest double about 1.8e308, IEEE 754), so the stress would be Infinity.
    const alone = await post([{ gauge: "S1", time: at(0), value: 1e308, temperature: 20 }]);
    expect(alone.status).toBe(200);
    expect(alone.body.accepted).toBe(0);
    expect(codes(alone.body.rejected)).toEqual([[0, "not-finite"]]);
    expect(alone.body.rejected[0].message).toMatch(/too large|overflow/);

    const mixed = await post([
      { gauge: "S1", time: at(10), value: 100, temperature: 20 },
      { gauge: "S1", time: at(20), value: -1e308, temperature: 20 },
      { gauge: "VW", time: at(10), value: 805, temperature: 13 },
      { gauge: "S1", time: at(30), value: 50, temperature: 21 },
    ]);
    expect(mixed.status).toBe(200);
    expect(mixed.body.accepted).toBe(3);
    expect(codes(mixed.body.rejected)).toEqual([[1, "not-finite"]]);
    expect(await storedCount("PV", "S1")).toBe(2);
    expect(await storedCount("PV", "VW")).toBe(1);
    expect(await poisonedRollups()).toBe(0);
    expect(await rollupMismatches()).toEqual([]);
  });

  it("leaves series and fatigue finite and answering", async () => {
    const query = `from=${at(-60)}&to=${at(60)}`;
    const series = await seriesRoute.GET(apiRequest(`/structures/PV/gauges/S1/series?${query}&quantity=stress`, { token }), params({ code: "PV", tag: "S1" }));
    expect(series.status).toBe(200);
    const body = await series.json();
    // By hand: strains 100 and 50 µε at 0.2 MPa per µε are 20 and 10 MPa.
    expect(Math.max(...body.max)).toBeCloseTo(20, 9);
    expect(JSON.stringify(body)).not.toMatch(/null|Infinity/);
    const fatigue = await fatigueRoute.GET(apiRequest(`/structures/PV/gauges/S1/fatigue?${query}&category=71`, { token }), params({ code: "PV", tag: "S1" }));
    expect(fatigue.status).toBe(200);
    expect(JSON.stringify(await fatigue.json())).not.toMatch(/Infinity|NaN/);
    const report = await structureReport(engineer, "PV", { firstDay: "2026-03-01", lastDay: "2026-03-01" }, new Date(Date.UTC(2026, 2, 3)));
    const s1 = report.gauges.find((gauge) => gauge.tag === "S1")!;
    expect(s1.stress).toMatchObject({ max: expect.closeTo(20, 9), min: expect.closeTo(10, 9) });
    expect(JSON.stringify(report)).not.toMatch(/Infinity|NaN/);
  });
});

describe("plausibility", () => {
  it("rejects a reading earlier than the gauge's first zero reading as before-zero", async () => {
    // S1 and VW were zeroed at 2024-01-01T00:00:00Z (readings-fixtures).
    const { body } = await post([
      { gauge: "S1", time: "2023-12-31T23:59:00Z", value: 5, temperature: 20 },
      { gauge: "S1", time: "2024-01-01T00:00:00Z", value: 0, temperature: 20 },
      { gauge: "VW", time: "1971-06-01T00:00:00Z", value: 805, temperature: 13 },
    ]);
    expect(body.accepted).toBe(1);
    expect(codes(body.rejected)).toEqual([
      [0, "before-zero"],
      [2, "before-zero"],
    ]);
    expect(body.rejected[0].message).toMatch(/2024-01-01T00:00:00.000Z/);
  });

  it("rejects temperatures outside −80…+150 °C as temperature-out-of-range", async () => {
    const { body } = await post([
      { gauge: "S1", time: at(100), value: 5, temperature: 500 },
      // Below absolute zero, −273.15 °C (physics).
      { gauge: "S1", time: at(101), value: 5, temperature: -300 },
      { gauge: "S1", time: at(102), value: 5, temperature: 149.9 },
      { gauge: "VW", time: at(103), value: 805, temperature: -80.5 },
      { gauge: "VW", time: at(104), value: 805, temperature: -79 },
    ]);
    expect(body.accepted).toBe(2);
    expect(codes(body.rejected)).toEqual([
      [0, "temperature-out-of-range"],
      [1, "temperature-out-of-range"],
      [3, "temperature-out-of-range"],
    ]);
    expect(body.rejected[0].message).toMatch(/°C/);
  });
});
