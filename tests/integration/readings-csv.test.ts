import { parse } from "csv-parse/sync";
import { beforeAll, describe, expect, it } from "vitest";
import * as readingsRoute from "@/app/api/v1/structures/[code]/gauges/[tag]/readings/route";
import { apiRequest, makeUser, params, userToken } from "./helpers";
import { makeIngestStructure, postReadings } from "./readings-fixtures";

let token: string;
const TIMES = ["2026-05-04T08:00:00.000Z", "2026-05-04T08:10:00.000Z", "2026-05-04T08:20:00.000Z"];
// S1 (readings-fixtures) reads microstrain with zero 0: strain = value, and σ = E·ε (Hooke's law)
// with E = 200 000 MPa is 0.2 MPa per µε. The logger writes tenths of a µε.
const VALUES = [120.5, -40.5, 250];

beforeAll(async () => {
  const engineer = await makeUser("engineer");
  token = await userToken(engineer.email);
  await makeIngestStructure("CSV-R", [engineer]);
  const readings = TIMES.map((time, i) => ({ gauge: "S1", time, value: VALUES[i], temperature: 18.25 }));
  expect((await postReadings("CSV-R", token, { readings })).status).toBe(200);
});

async function exportCsv(query = "") {
  const range = `from=2026-05-04T00:00:00Z&to=2026-05-05T00:00:00Z${query}`;
  const response = await readingsRoute.GET(
    apiRequest(`/structures/CSV-R/gauges/S1/readings?${range}`, { token, headers: { accept: "text/csv" } }),
    params({ code: "CSV-R", tag: "S1" }),
  );
  expect(response.status).toBe(200);
  return new Uint8Array(await response.arrayBuffer());
}

describe("readings exported as CSV", () => {
  it("keeps the contract's columns and writes strain and stress to the gauge's resolution", async () => {
    const rows = parse(Buffer.from(await exportCsv()), { columns: true }) as Record<string, string>[];
    expect(Object.keys(rows[0]!)).toEqual(["time", "value", "temperature", "strain", "stress", "flags"]);
    // A 0.1 µε step: strain to 0.1 µε, stress (0.02 MPa per step) to 0.01 MPa.
    expect(rows.map((row) => [row.time, row.value, row.temperature, row.strain, row.stress])).toEqual([
      [TIMES[0], "120.5", "18.25", "120.5", "24.10"],
      [TIMES[1], "-40.5", "18.25", "-40.5", "-8.10"],
      [TIMES[2], "250", "18.25", "250.0", "50.00"],
    ]);
  });

  it("names each column with its unit for spreadsheets when asked, after a UTF-8 byte-order mark", async () => {
    const bytes = await exportCsv("&header=units");
    expect([...bytes.slice(0, 3)]).toEqual([0xef, 0xbb, 0xbf]);
    const rows = parse(Buffer.from(bytes), { columns: true, bom: true }) as Record<string, string>[];
    expect(Object.keys(rows[0]!)).toEqual(["time (UTC)", "local time (UTC)", "value (µε)", "temperature (°C)", "strain (µε)", "stress (MPa)", "flags"]);
    expect(rows.map((row) => Number(row["stress (MPa)"]))).toEqual([24.1, -8.1, 50]);
    // The structure keeps UTC: the local column is the same instant, read as a person would.
    expect(rows.map((row) => row["local time (UTC)"])).toEqual(TIMES.map((time) => `${time.slice(0, 10)} ${time.slice(11, 23)} UTC`));
  });

  it("refuses an unknown header choice with a 400 naming it", async () => {
    const response = await readingsRoute.GET(
      apiRequest("/structures/CSV-R/gauges/S1/readings?header=fancy", { token, headers: { accept: "text/csv" } }),
      params({ code: "CSV-R", tag: "S1" }),
    );
    expect(response.status).toBe(400);
    expect(JSON.stringify(await response.json())).toContain("header");
  });
});
