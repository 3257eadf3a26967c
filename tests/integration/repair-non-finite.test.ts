import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { createClient, type Client } from "@libsql/client";
import { drizzle } from "drizzle-orm/libsql";
import { migrate } from "drizzle-orm/libsql/migrator";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { rollupMismatches } from "./readings-fixtures";
import { migrationsBefore } from "./migration-sql";

/**
 * The repair migration on a database that already holds what ingestion used to store: the
 * migrations before it are applied, poisoned rows written the way SQLite kept them (9e999 is
 * Infinity), then the remaining migrations run as on a real upgrade.
 */
// Found by name, so the migration may be renumbered when branches merge.
const REPAIR = "_repair_non_finite_readings";
const folder = fs.mkdtempSync(path.join(os.tmpdir(), "hookeline-repair-"));
let client: Client;

const H = 3_600_000;
const T0 = Date.UTC(2026, 2, 1, 12);

const rows = async (sql: string) => (await client.execute(sql)).rows.map((row) => ({ ...row }));

beforeAll(async () => {
  client = createClient({ url: `file:${path.join(folder, "old.db")}` });
  await migrate(drizzle(client), { migrationsFolder: migrationsBefore(REPAIR, folder) });
  await client.batch([
    "INSERT INTO structures (id, code, name) VALUES (1, 'PV', 'Poisoned')",
    `INSERT INTO gauges (id, structure_id, tag, kind, input, gauge_factor, thermal, material, zero_value, zero_time)
       VALUES (1, 1, 'S1', 'foil', 'microstrain', 2, '{"method":"none"}', '{"E":200000,"nu":0.3,"alpha":12}', 0, ${T0 - 30 * 24 * H})`,
    // Hour 0: a good reading and a 1e308 one stored as infinite strain and stress.
    `INSERT INTO readings (gauge_id, t, value, temperature, strain, stress, flags) VALUES
       (1, ${T0}, 50, 20, 50, 10, 0), (1, ${T0 + 600_000}, 1e308, 20, 1e308, 9e999, 0), (1, ${T0 + 1_200_000}, -1e308, NULL, -9e999, -9e999, 0),
       (1, ${T0 + H}, 20, 21, 20, 4, 0)`,
    // Roll-ups as the merges left them: Infinity, and the NaN of Infinity − Infinity stored as NULL temperature sum.
    `INSERT INTO rollups VALUES
       (1, ${H}, ${T0}, 3, -9e999, 1e308, 9e999, -9e999, 9e999, 9e999, 2, 20, 20, 40),
       (1, ${H}, ${T0 + H}, 1, 20, 20, 20, 4, 4, 4, 1, 21, 21, NULL),
       (1, 86400000, ${Math.floor(T0 / (24 * H)) * 24 * H}, 4, -9e999, 1e308, 9e999, -9e999, 9e999, 9e999, 3, 20, 21, 61)`,
    `INSERT INTO alerts (id, structure_id, gauge_id, kind, level, quantity, opened_at, bound, peak) VALUES (1, 1, 1, 'limit', 'critical', 'stress', ${T0 + 600_000}, 240, 9e999)`,
    `INSERT INTO alert_events (alert_id, type, at, level, value) VALUES (1, 'opened', ${T0 + 600_000}, 'critical', 9e999)`,
  ]);
  await migrate(drizzle(client), { migrationsFolder: path.join(process.cwd(), "drizzle") });
});

afterAll(() => {
  client.close();
  fs.rmSync(folder, { recursive: true, force: true });
});

describe("repair of non-finite values already stored", () => {
  it("removes the readings whose strain or stress is not finite and keeps the others unchanged", async () => {
    expect(await rows("SELECT t, value, temperature, strain, stress FROM readings ORDER BY t")).toEqual([
      { t: T0, value: 50, temperature: 20, strain: 50, stress: 10 },
      { t: T0 + H, value: 20, temperature: 21, strain: 20, stress: 4 },
    ]);
  });

  it("rebuilds every poisoned roll-up row from the readings left, so none holds Infinity, NaN or NULL", async () => {
    expect(await rollupMismatches(client)).toEqual([]);
    const stats = await rows("SELECT count, strain_sum, stress_sum, temperature_count, temperature_sum FROM rollups ORDER BY resolution, bucket");
    // By hand: hour 0 keeps the 50 µε / 10 MPa reading at 20 °C; hour 1 the 20 µε / 4 MPa one at 21 °C; the day both.
    expect(stats).toEqual([
      { count: 1, strain_sum: 50, stress_sum: 10, temperature_count: 1, temperature_sum: 20 },
      { count: 1, strain_sum: 20, stress_sum: 4, temperature_count: 1, temperature_sum: 21 },
      { count: 2, strain_sum: 70, stress_sum: 14, temperature_count: 2, temperature_sum: 41 },
    ]);
  });

  it("keeps what each removed reading was in the audit trail", async () => {
    const audit = await rows("SELECT actor_label, action, entity_key, structure_id, before FROM audit_log ORDER BY entity_key");
    expect(audit.map(({ entity_key }) => entity_key)).toEqual(["PV/S1@2026-03-01T12:10:00.000Z", "PV/S1@2026-03-01T12:20:00.000Z"]);
    expect(JSON.parse(String(audit[0]!.before))).toEqual({ value: "1.0e+308", temperature: "20.0", strain: "1.0e+308", stress: "Inf", flags: 0 });
    expect(audit[0]).toMatchObject({ actor_label: "data repair: non-finite readings", action: "reading.remove-non-finite", structure_id: 1 });
  });

  it("leaves the alert and its history, with an unknown peak instead of Infinity", async () => {
    expect(await rows("SELECT peak FROM alerts")).toEqual([{ peak: null }]);
    expect(await rows("SELECT type, value FROM alert_events")).toEqual([{ type: "opened", value: null }]);
  });

  it("leaves no table behind", async () => {
    expect(await rows("SELECT name FROM sqlite_master WHERE name = 'repair_rollup_buckets'")).toEqual([]);
  });
});
