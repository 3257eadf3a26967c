import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { createClient } from "@libsql/client";
import { drizzle } from "drizzle-orm/libsql";
import { migrate } from "drizzle-orm/libsql/migrator";
import { afterAll, describe, expect, it } from "vitest";
import { migrationsBefore } from "./migration-sql";

// Migrations as a database made before dynamic channels had them: every one up to the one that adds
// `sampling`, then that one on top of stored gauges.
const folder = fs.mkdtempSync(path.join(os.tmpdir(), "hookeline-migration-"));
afterAll(() => fs.rmSync(folder, { recursive: true, force: true }));

describe("migration 0010_dynamic_channels", () => {
  it("makes every stored gauge static and keeps its readings", async () => {
    const client = createClient({ url: `file:${path.join(folder, "old.db")}` });
    const db = drizzle(client);
    await migrate(db, { migrationsFolder: migrationsBefore("_dynamic_channels", folder) });
    await client.execute("INSERT INTO structures (code, name) VALUES ('OLD', 'Old structure')");
    await client.execute(
      `INSERT INTO gauges (structure_id, tag, kind, input, gauge_factor, thermal, material, zero_value, zero_time)
       VALUES (1, 'G1', 'foil', 'microstrain', 2, '{"method":"none"}', '{"E":200000,"nu":0.3,"alpha":12}', 0, 0)`,
    );
    await client.execute("INSERT INTO readings (gauge_id, t, value, strain, stress, flags) VALUES (1, 1000, 5, 5, 1, 0)");
    await migrate(db, { migrationsFolder: path.join(process.cwd(), "drizzle") });
    const gauge = await client.execute("SELECT sampling FROM gauges WHERE tag = 'G1'");
    expect(JSON.parse(gauge.rows[0]!.sampling as string)).toEqual({ mode: "static" });
    const readings = await client.execute("SELECT t, value, stress FROM readings");
    expect(readings.rows.map((row) => [row.t, row.value, row.stress])).toEqual([[1000, 5, 1]]);
    client.close();
  });
});
