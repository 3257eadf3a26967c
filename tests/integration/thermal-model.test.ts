import { beforeAll, describe, expect, it } from "vitest";
import * as modelRoute from "@/app/api/v1/structures/[code]/gauges/[tag]/thermal-model/route";
import * as fitRoute from "@/app/api/v1/structures/[code]/gauges/[tag]/thermal-model/fit/route";
import * as limitsRoute from "@/app/api/v1/structures/[code]/gauges/[tag]/limits/route";
import * as readingsRoute from "@/app/api/v1/structures/[code]/readings/route";
import * as seriesRoute from "@/app/api/v1/structures/[code]/gauges/[tag]/series/route";
import * as alertsRoute from "@/app/api/v1/structures/[code]/alerts/route";
import { getClient } from "@/db/client";
import { createGauge } from "@/lib/services/gauges";
import { ROLLUP_RESOLUTIONS } from "@/lib/series/rollup";
import { microstrainGauge } from "../fixtures/gauges";
import { apiRequest, makeTeam, params } from "./helpers";

// Synthetic physics made here, not taken from any source: a restrained steel member whose
// stress-producing strain follows its own temperature, which lags the air temperature the logger
// records by three hours: ε = a + b·T(t − lag) + step. A microstrain gauge with no compensation
// reports that strain as its raw value (ε = raw × GF_logger / GF_gauge with equal factors).
const MINUTE = 60_000;
const HOUR = 60 * MINUTE;
const DAY = 24 * HOUR;
const STEP_MS = 5 * MINUTE;
const A = 40; // µε
const B = -9.6; // µε/°C, the order of −E·α-like restraint strain per degree: a plausible value, nothing more
const LAG_MINUTES = 180;
const STEP = 25; // µε, planted at day 20
const START = Math.floor(Date.now() / DAY) * DAY - 30 * DAY;
const STEP_AT = START + 20 * DAY;

const air = (time: number) => {
  const days = (time - START) / DAY;
  return 15 + 6 * Math.sin(2 * Math.PI * days) + 3 * Math.sin((2 * Math.PI * days) / 5.3 + 1);
};

function noise() {
  let state = 987654;
  return () => {
    state = (state * 1103515245 + 12345) % 2147483648;
    return state / 2147483648 - 0.5; // ±0.5 µε, standard deviation 1/√12 ≈ 0.29 µε
  };
}

function syntheticReadings(fromDay: number, toDay: number) {
  const next = noise();
  const out: { gauge: string; time: string; value: number; temperature: number }[] = [];
  for (let time = START; time < START + toDay * DAY; time += STEP_MS) {
    const value = A + B * air(time - LAG_MINUTES * MINUTE) + (time >= STEP_AT ? STEP : 0) + next();
    if (time >= START + fromDay * DAY) out.push({ gauge: "T1", time: new Date(time).toISOString(), value: Number(value.toFixed(3)), temperature: Number(air(time).toFixed(2)) });
  }
  return out;
}

let tokens: Awaited<ReturnType<typeof makeTeam>>["tokens"];
const at = params({ code: "TH", tag: "T1" });
const iso = (time: number) => new Date(time).toISOString();
const reference = { from: iso(START + DAY), to: iso(START + 15 * DAY), lagMinutes: "auto", maxLagMinutes: 360 };

async function send(fromDay: number, toDay: number) {
  const response = await readingsRoute.POST(apiRequest("/structures/TH/readings", { token: tokens.engineer, body: { readings: syntheticReadings(fromDay, toDay) } }), params({ code: "TH" }));
  expect(response.status).toBe(200);
  return (await response.json()) as { accepted: number; alerts: { opened: number } };
}

async function residualSeries(from: number, to: number, points: number) {
  const query = `quantity=residual&from=${iso(from)}&to=${iso(to)}&points=${points}`;
  const response = await seriesRoute.GET(apiRequest(`/structures/TH/gauges/T1/series?${query}`, { token: tokens.owner }), at);
  expect(response.status).toBe(200);
  return (await response.json()) as { unit: string; source: string; t: number[]; min: number[]; max: number[]; mean: number[]; count: number[] };
}

const storedCount = async (sql: string) => Number((await getClient().execute(sql)).rows[0]![0]);

beforeAll(async () => {
  const team = await makeTeam("TH");
  tokens = team.tokens;
  await createGauge(team.users.engineer, "TH", microstrainGauge("T1", { zero: { value: 0, temperature: 15, time: iso(START - DAY) } }));
});

describe("thermal model through the API", () => {
  it("refuses a period a fit cannot use, saying what is needed, and stores nothing", async () => {
    await send(0, 19);
    const put = (body: unknown) => modelRoute.PUT(apiRequest("/structures/TH/gauges/T1/thermal-model", { token: tokens.engineer, method: "PUT", body }), at);
    const short = await put({ from: iso(START + DAY), to: iso(START + DAY + HOUR) });
    expect(short.status).toBe(400);
    expect((await short.json()).error.message).toMatch(/holds 13 readings with a temperature; a thermal fit needs at least 24/);
    const searchTooLong = await put({ from: iso(START + DAY), to: iso(START + 2 * DAY), lagMinutes: "auto", maxLagMinutes: 2 * 24 * 60 });
    expect(searchTooLong.status).toBe(400);
    expect((await searchTooLong.json()).error.message).toMatch(/lag search up to 2880 min is longer than the reference period \(1440 min\)/);
    const fixedTooLong = await put({ from: iso(START + DAY), to: iso(START + 2 * DAY), lagMinutes: 2000 });
    expect((await fixedTooLong.json()).error.message).toMatch(/lag of 2000 min is longer than the reference period/);
    // An hour of the daily swing near its trough spans little temperature: less than 3 °C.
    const flat = await put({ from: iso(START + DAY + 17 * HOUR), to: iso(START + DAY + 20 * HOUR) });
    expect(flat.status).toBe(400);
    expect((await flat.json()).error.message).toMatch(/spans only [0-2]\.[0-9] °C; a thermal fit needs at least 3 °C of range/);
    const residualLimit = await limitsRoute.PUT(
      apiRequest("/structures/TH/gauges/T1/limits", { token: tokens.engineer, method: "PUT", body: { limits: [{ quantity: "residual", level: "warning", upper: 10 }] } }),
      at,
    );
    expect(residualLimit.status).toBe(400);
    expect((await residualLimit.json()).error.message).toMatch(/Residual limits need the gauge's thermal model/);
    expect(await storedCount("SELECT count(*) FROM thermal_models")).toBe(0);
    expect(await storedCount("SELECT count(*) FROM readings WHERE residual IS NOT NULL")).toBe(0);
    expect(await storedCount("SELECT count(*) FROM audit_log WHERE action LIKE 'thermal-model.%'")).toBe(0);
    const refused = await modelRoute.PUT(apiRequest("/structures/TH/gauges/T1/thermal-model", { token: tokens.technician, method: "PUT", body: reference }), at);
    expect(refused.status).toBe(403);
  });

  it("recovers the planted coefficient and lag by best fit, and the stored residual stays near zero", async () => {
    const preview = await fitRoute.POST(apiRequest("/structures/TH/gauges/T1/thermal-model/fit", { token: tokens.owner, body: reference }), at);
    expect(preview.status).toBe(200);
    const previewed = (await preview.json()) as { slope: number; scatter: unknown[] };
    expect(previewed.scatter.length).toBeGreaterThan(1000);
    expect(previewed.scatter.length).toBeLessThanOrEqual(2000);
    expect(await storedCount("SELECT count(*) FROM thermal_models")).toBe(0);

    const response = await modelRoute.PUT(apiRequest("/structures/TH/gauges/T1/thermal-model", { token: tokens.engineer, method: "PUT", body: reference }), at);
    expect(response.status).toBe(200);
    const model = (await response.json()) as { intercept: number; slope: number; lagMinutes: number; r2: number; residualStd: number; readings: number; fittedBy: string };
    console.info(`thermal fit via API: slope ${model.slope.toFixed(4)} µε/°C (planted ${B}), lag ${model.lagMinutes} min (planted ${LAG_MINUTES}), intercept ${model.intercept.toFixed(2)} µε (planted ${A}), R² ${model.r2.toFixed(5)}, σ ${model.residualStd.toFixed(3)} µε, ${model.readings} readings`);
    expect(model.lagMinutes).toBe(LAG_MINUTES);
    expect(model.slope).toBeCloseTo(B, 2);
    expect(model.intercept).toBeCloseTo(A, 0);
    expect(model.r2).toBeGreaterThan(0.999);
    // The noise alone: uniform on ±0.5 µε has σ = 1/√12 = 0.289 µε.
    expect(model.residualStd).toBeGreaterThan(0.25);
    expect(model.residualStd).toBeLessThan(0.33);
    expect(model.fittedBy).toMatch(/engineer/);

    // Residuals of readings already stored (19 days of 5-minute readings: more than one recomputation chunk).
    const stored = await storedCount("SELECT count(*) FROM readings WHERE residual IS NOT NULL");
    expect(stored).toBeGreaterThan(5000);
    // Every healthy reading's residual is in its hour's and its day's roll-up (sums of counts agree).
    const healthy = await storedCount("SELECT count(*) FROM readings WHERE residual IS NOT NULL AND fault = 0");
    for (const resolution of Object.values(ROLLUP_RESOLUTIONS)) {
      expect(await storedCount(`SELECT sum(residual_count) FROM rollups WHERE resolution = ${resolution}`), `resolution ${resolution}`).toBe(healthy);
    }
    const worst = await storedCount(`SELECT max(abs(residual)) FROM readings WHERE t >= ${START + DAY}`);
    expect(worst).toBeLessThan(1);
    const got = (await (await modelRoute.GET(apiRequest("/structures/TH/gauges/T1/thermal-model", { token: tokens.owner }), at)).json()) as { slope: number; lagSearch: string };
    expect(got).toMatchObject({ slope: model.slope, lagSearch: "auto" });
    expect(await storedCount("SELECT count(*) FROM audit_log WHERE action = 'thermal-model.create'")).toBe(1);
  });

  it("computes the residual on ingest: the planted step shows in it and opens a residual limit's alert", async () => {
    const limits = await limitsRoute.PUT(
      apiRequest("/structures/TH/gauges/T1/limits", { token: tokens.engineer, method: "PUT", body: { limits: [{ quantity: "residual", level: "warning", upper: 12, hysteresis: 2 }] } }),
      at,
    );
    expect(limits.status).toBe(200);
    const result = await send(19, 30);
    expect(result.alerts.opened).toBe(1);

    const before = await residualSeries(START + DAY, STEP_AT, 1000);
    const after = await residualSeries(STEP_AT, START + 30 * DAY, 1000);
    const mean = (series: { mean: number[]; count: number[] }) => series.mean.reduce((sum, m, i) => sum + m * series.count[i]!, 0) / series.count.reduce((a, b) => a + b, 0);
    console.info(`residual via API: before the step mean ${mean(before).toFixed(3)} µε, largest |r| ${Math.max(...before.max.map(Math.abs), ...before.min.map(Math.abs)).toFixed(3)} µε; after it mean ${mean(after).toFixed(3)} µε (planted step ${STEP} µε)`);
    expect(before.unit).toBe("µε");
    expect(Math.max(...before.max, ...before.min.map((v) => -v))).toBeLessThan(1);
    expect(mean(before)).toBeCloseTo(0, 1);
    expect(mean(after)).toBeCloseTo(STEP, 0);
    // Daily buckets are read from the roll-ups: they agree with the raw readings.
    const daily = await residualSeries(START, START + 30 * DAY, 30);
    expect(daily.source).toBe("daily");
    expect(daily.mean.at(-1)).toBeCloseTo(STEP, 0);

    const alerts = (await (await alertsRoute.GET(apiRequest("/structures/TH/alerts?state=open", { token: tokens.owner }), params({ code: "TH" }))).json()) as {
      alerts: { quantity: string; openedAt: string; level: string }[];
    };
    const residualAlert = alerts.alerts.find((alert) => alert.quantity === "residual");
    expect(residualAlert?.level).toBe("warning");
    expect(Date.parse(residualAlert!.openedAt)).toBe(STEP_AT);
  });

  it("refuses to remove a model that residual limits rely on, then removes it with the residuals", async () => {
    const remove = () => modelRoute.DELETE(apiRequest("/structures/TH/gauges/T1/thermal-model", { token: tokens.engineer, method: "DELETE" }), at);
    expect((await remove()).status).toBe(409);
    await limitsRoute.PUT(apiRequest("/structures/TH/gauges/T1/limits", { token: tokens.engineer, method: "PUT", body: { limits: [] } }), at);
    expect((await remove()).status).toBe(204);
    expect(await storedCount("SELECT count(*) FROM readings WHERE residual IS NOT NULL")).toBe(0);
    expect(await storedCount("SELECT count(*) FROM rollups WHERE residual_count > 0")).toBe(0);
    expect((await modelRoute.GET(apiRequest("/structures/TH/gauges/T1/thermal-model", { token: tokens.owner }), at)).status).toBe(404);
  });
});
