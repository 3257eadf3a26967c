/**
 * Child process of crash-safety.test.ts: prepares a database, then stores one large batch
 * through the ingestion service until the parent kills it. Reads DATABASE_URL like the app.
 */
import { migrateDatabase } from "@/db/migrate";
import { parseWith } from "@/lib/validation";
import { gaugeInput } from "@/lib/gauges/schema";
import { createGauge } from "@/lib/services/gauges";
import { ingestDecoded, openIngestion } from "@/lib/services/ingest";
import { createStructure } from "@/lib/services/structures";
import { createUser } from "@/lib/services/users";
import { STRAIN_GAUGE } from "./readings-fixtures";

const CRASH_BATCH = Number(process.env.CRASH_BATCH);

await migrateDatabase();
await createStructure(null, { code: "CR", name: "Crash", timezone: "UTC" });
const user = await createUser(null, { email: "crash@test.example", name: "Crash", role: "admin", password: "crash-password" });
const actor = { kind: "user" as const, id: user.id, email: user.email, name: user.name, role: user.role };
await createGauge(actor, "CR", parseWith(gaugeInput, STRAIN_GAUGE));
const target = await openIngestion(actor, "CR");
const start = Date.UTC(2025, 0, 1);
const readings = Array.from({ length: CRASH_BATCH }, (_, i) => ({ gauge: "S1", time: start + i * 1000, value: i % 977, temperature: 20 }));
console.log("ingesting");
const result = await ingestDecoded(target, readings);
console.log(`stored ${result.accepted}`);
