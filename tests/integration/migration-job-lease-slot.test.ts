import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { createClient } from "@libsql/client";
import { drizzle } from "drizzle-orm/libsql";
import { migrate } from "drizzle-orm/libsql/migrator";
import { afterAll, describe, expect, it } from "vitest";
import { migrationsBefore } from "./migration-sql";

const folder = fs.mkdtempSync(path.join(os.tmpdir(), "hookeline-lease-slot-"));
afterAll(() => fs.rmSync(folder, { recursive: true, force: true }));

describe("migration job_lease_slot", () => {
  it("keeps every stored lease as it was, with no slot run yet, so the next scheduled run goes ahead", async () => {
    const client = createClient({ url: `file:${path.join(folder, "old.db")}` });
    const db = drizzle(client);
    await migrate(db, { migrationsFolder: migrationsBefore("_job_lease_slot", folder) });
    await client.execute(
      "INSERT INTO job_leases (name, holder, lease_until, last_started_at, last_finished_at, last_outcome) VALUES ('stale-watch', 'host:1:abc', 1000, 900, 950, 'ok: 1 structures checked, 0 newly stale')",
    );
    await migrate(db, { migrationsFolder: path.join(process.cwd(), "drizzle") });
    const { rows } = await client.execute("SELECT name, holder, lease_until, last_started_at, last_finished_at, last_outcome, last_slot FROM job_leases");
    expect(rows.map((row) => ({ ...row }))).toEqual([
      { name: "stale-watch", holder: "host:1:abc", lease_until: 1000, last_started_at: 900, last_finished_at: 950, last_outcome: "ok: 1 structures checked, 0 newly stale", last_slot: null },
    ]);
    client.close();
  });
});
