import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { createClient } from "@libsql/client";
import { drizzle } from "drizzle-orm/libsql";
import { migrate } from "drizzle-orm/libsql/migrator";
import { afterAll, describe, expect, it } from "vitest";

const folder = fs.mkdtempSync(path.join(os.tmpdir(), "hookeline-migration-"));
afterAll(() => fs.rmSync(folder, { recursive: true, force: true }));

/** The committed migrations up to and including `lastTag`, as a folder of their own. */
function migrationsUpTo(lastTag: string): string {
  const target = path.join(folder, lastTag);
  fs.cpSync(path.join(process.cwd(), "drizzle"), target, { recursive: true });
  const journalFile = path.join(target, "meta", "_journal.json");
  const journal = JSON.parse(fs.readFileSync(journalFile, "utf8")) as { entries: { tag: string }[] };
  const last = journal.entries.findIndex((entry) => entry.tag === lastTag);
  journal.entries = journal.entries.slice(0, last + 1);
  fs.writeFileSync(journalFile, JSON.stringify(journal));
  return target;
}

describe("the quarantine and mail-priority migrations", () => {
  it("keep stored readings, alerts and queued mail valid: readings healthy, peaks timed at opening, queued mail ranked by kind and level", async () => {
    const client = createClient({ url: `file:${path.join(folder, "old.db")}` });
    const db = drizzle(client);
    await migrate(db, { migrationsFolder: migrationsUpTo("0007_sign_in_lock_and_session_version") });
    await client.executeMultiple(`
      INSERT INTO structures (id, code, name) VALUES (1, 'OLD', 'Old structure');
      INSERT INTO gauges (id, structure_id, tag, kind, input, gauge_factor, thermal, material, zero_value, zero_time)
        VALUES (1, 1, 'G1', 'foil', 'microstrain', 2, '{"method":"none"}', '{"E":200000,"nu":0.3,"alpha":12}', 0, 0);
      INSERT INTO readings (gauge_id, t, value, strain, stress, flags) VALUES (1, 1000, 10, 10, 2, 0);
      INSERT INTO alerts (structure_id, gauge_id, kind, level, quantity, opened_at, bound, peak) VALUES (1, 1, 'limit', 'watch', 'strain', 5000, 100, 120);
      INSERT INTO mail_outbox (to_address, kind, dedupe_key, subject, text, html) VALUES
        ('a@x.example', 'alert', 'k1', 'CRITICAL: OLD G1 strain crossed the critical limit (300 µε)', 't', 'h'),
        ('a@x.example', 'alert', 'k2', 'WATCH: OLD G1 strain crossed the watch limit (120 µε)', 't', 'h'),
        ('a@x.example', 'alert', 'k3', 'Sensor fault: OLD G1 flat line (stuck reading)', 't', 'h'),
        ('a@x.example', 'digest', 'k4', 'Hookeline daily summary', 't', 'h');
    `);
    await migrate(db, { migrationsFolder: path.join(process.cwd(), "drizzle") });
    const reading = await client.execute("SELECT value, strain, fault FROM readings");
    expect(reading.rows.map((row) => [row.value, row.strain, row.fault])).toEqual([[10, 10, 0]]);
    const alert = await client.execute("SELECT peak, peak_at, openings, flapping_since FROM alerts");
    expect(alert.rows.map((row) => [row.peak, row.peak_at, row.openings, row.flapping_since])).toEqual([[120, 5000, 1, null]]);
    const mail = await client.execute("SELECT dedupe_key, priority FROM mail_outbox ORDER BY dedupe_key");
    // lib/mail/priority.ts: critical 0, watch 2, sensor 3, digests 4.
    expect(mail.rows.map((row) => [row.dedupe_key, row.priority])).toEqual([
      ["k1", 0],
      ["k2", 2],
      ["k3", 3],
      ["k4", 4],
    ]);
    const members = await client.execute("SELECT count(*) AS n FROM pragma_table_info('structure_members') WHERE name = 'sensor_mail'");
    expect(members.rows[0]!.n).toBe(1);
    client.close();
  });
});
