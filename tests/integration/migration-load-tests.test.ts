import { describe, expect, it } from "vitest";
import { getClient } from "@/db/client";
import { createLoadTest } from "@/lib/services/load-tests";
import { createGauge, resolveGauge } from "@/lib/services/gauges";
import { microstrainGauge } from "../fixtures/gauges";
import { storeReadings } from "../fixtures/readings";
import { makeStructure, makeUser } from "./helpers";
import { rerunMigration } from "./migration-sql";

const dump = async (table: string) => (await getClient().execute(`select * from ${table} order by 1, 2`)).rows.map((row) => ({ ...row }));

describe("the load_tests migration on an installation with data", () => {
  it("adds its tables without touching the structures, gauges, readings and audit trail already stored", async () => {
    const engineer = await makeUser("engineer");
    await makeStructure("MIG", [engineer]);
    await createGauge(engineer, "MIG", microstrainGauge("G1"));
    const { gauge } = await resolveGauge(engineer, "MIG", "G1", "structure:view");
    const start = Date.UTC(2026, 0, 5, 9);
    await storeReadings(getClient(), gauge.id, [0, 1, 2].map((i) => ({ time: start + i * 60_000, strain: 10 * i, stress: 2 * i, temperature: 5 })));
    const before = await Promise.all(["structures", "gauges", "readings", "rollups", "audit_log"].map(dump));

    // As an installation from before load tests meets it: the tables absent, then the migration's SQL.
    await getClient().execute("drop table load_test_predictions");
    await getClient().execute("drop table load_tests");
    await rerunMigration("load_tests");

    expect(await Promise.all(["structures", "gauges", "readings", "rollups", "audit_log"].map(dump))).toEqual(before);
    const recorded = await createLoadTest(engineer, "MIG", { title: "After", load: "Truck", start: start + 30_000, end: start + 150_000, predicted: [{ gauge: "G1", predicted: 25 }] });
    expect(recorded.gauges[0]).toMatchObject({ state: "measured", measured: 20, ratio: 0.8 });
  });
});
