import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { getClient, getDb } from "@/db/client";
import { gauges } from "@/db/schema";
import { gaugeConfigOf } from "@/lib/gauges/record";
import { prepareGauge } from "@/lib/mechanics";
import { gaugeAuditTrail } from "@/lib/services/gauges";
import type { UserActor } from "@/lib/auth/actor";
import { makeStructure, makeUser } from "./helpers";
import { rerunMigration } from "./migration-sql";

let engineer: UserActor;

/**
 * Rows as an installation held them before the renaming: a wire read in "digits" that relied on
 * the former 12.2 µε/°C default, one with its coefficient typed, and a gauge's audit row.
 */
beforeAll(async () => {
  engineer = await makeUser("engineer");
  const structure = await makeStructure("WIRE", [engineer]);
  const client = getClient();
  const insert = (tag: string, input: string, thermal: string) =>
    client.execute({
      sql: `INSERT INTO gauges (structure_id, tag, kind, input, gauge_factor, calibration_factor, polarity, thermal, material, initial_stress, zero_value, zero_temperature, zero_time, status, created_at)
            VALUES (?, ?, 'vibrating-wire', ?, 3.5325, 0.97, 1, ?, '{"E":30000,"nu":0.2,"alpha":10}', 0, 640, 12, 0, 'active', 0)`,
      args: [structure.id, tag, input, thermal],
    });
  await insert("R-OLD", "digits", '{"method":"cte","gaugeCte":null}');
  await insert("R-TYPED", "digits", '{"method":"cte","gaugeCte":11.5}');
  await insert("HZ", "Hz", '{"method":"none"}');
  await client.execute({
    sql: `INSERT INTO audit_log (created_at, actor_label, action, entity_type, entity_key, structure_id, before, after)
          VALUES (0, 'engineer', 'gauge.update', 'gauge', 'WIRE/R-OLD', ?, '{"batchFactor":1,"input":"Hz"}', '{"batchFactor":0.97,"input":"digits"}')`,
    args: [structure.id],
  });
  await rerunMigration("vibrating_wire_input_names_and_wire_coefficient");
});

const row = async (tag: string) => (await getDb().select().from(gauges).where(eq(gauges.tag, tag)))[0]!;

describe("migration of vibrating-wire names", () => {
  it("names f²/1000 inputs frequency-squared and leaves Hz alone", async () => {
    expect((await row("R-OLD")).input).toBe("frequency-squared");
    expect((await row("HZ")).input).toBe("Hz");
  });

  // R = f²/1000, ε_app = K·C·(R − R₀), ε_mech = ε_app + (α_wire − α_host)·ΔT (common practice):
  // 700 against a zero of 640 at ΔT = 8 °C: 3.5325 × 0.97 × 60 = 205.5915 µε, + (12.2 − 10) × 8 = 223.1915 µε.
  it("keeps the 12.2 µε/°C a gauge relied on, so its readings convert as before", async () => {
    const gauge = await row("R-OLD");
    expect(gauge.thermal).toEqual({ method: "cte", gaugeCte: 12.2 });
    expect((await row("R-TYPED")).thermal).toEqual({ method: "cte", gaugeCte: 11.5 });
    const converter = prepareGauge(gaugeConfigOf(gauge));
    if (!converter.ok) throw new Error(converter.message);
    const result = converter.convert(700, 20);
    expect(result.ok && result.strain).toBeCloseTo(223.1915, 9);
  });

  it("renames the calibration multiplier and the input in the audit trail", async () => {
    const [entry] = await gaugeAuditTrail(engineer, "WIRE", "R-OLD");
    expect(entry).toMatchObject({ before: { calibrationFactor: 1, input: "Hz" }, after: { calibrationFactor: 0.97, input: "frequency-squared" } });
    expect(entry!.after).not.toHaveProperty("batchFactor");
  });
});

describe("migration of outbox messages to an attempt history", () => {
  it("keeps an old message's last failed answer and its send as its history", async () => {
    const client = getClient();
    await client.execute(
      `INSERT INTO mail_outbox (to_address, kind, dedupe_key, subject, text, html, state, attempts, next_attempt_at, last_error, created_at, sent_at)
       VALUES ('ada@hookeline.example', 'alert', 'old-1', 'S', 'T', 'H', 'sent', 2, 0, 'connect ECONNREFUSED', 0, 1764756000000)`,
    );
    await rerunMigration("mail_attempt_log_from_last_answers");
    const row = (await client.execute("SELECT attempt_log FROM mail_outbox WHERE dedupe_key = 'old-1'")).rows[0]!;
    // 1764756000000 ms is 2025-12-03T10:00:00Z (Unix time).
    expect(JSON.parse(row.attempt_log as string)).toEqual([
      { at: null, outcome: "failed", answer: "connect ECONNREFUSED" },
      { at: "2025-12-03T10:00:00.000Z", outcome: "sent" },
    ]);
  });
});
