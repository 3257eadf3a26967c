import "server-only";
import type { Role } from "./schema";
import { createStructure, findStructureByCode } from "@/lib/services/structures";
import { addMember } from "@/lib/services/memberships";
import { createUser, findUserByEmail } from "@/lib/services/users";
import { isUniqueViolation } from "./client";
import { AppError } from "@/lib/errors";
import type { UserActor } from "@/lib/auth/actor";
import { createGauge, listGauges } from "@/lib/services/gauges";
import { createRosette } from "@/lib/services/rosettes";
import { ingestDecoded, openIngestion } from "@/lib/services/ingest";
import { gaugeConfigOf } from "@/lib/gauges/record";
import { syntheticBursts, syntheticReadings, type SyntheticReading } from "@/lib/demo";
import { ingestBursts, MAX_BURST_SAMPLES_PER_REQUEST } from "@/lib/services/bursts";
import type { IncomingBurst } from "@/lib/ingest/burst-input";
import { and, eq, inArray, min } from "drizzle-orm";
import { getDb } from "./client";
import { zeroReadings } from "./schema";
import { DEFAULT_EXPECTED_INTERVAL_S } from "@/lib/alerting/gauge-state";
import { DEMO_BURST_DAYS, DEMO_BURST_RATE_HZ, DEMO_DAYS, DEMO_DYNAMIC_GAUGES, DEMO_GAUGES, DEMO_LIMITS, DEMO_ROSETTES, demoPeriod } from "./demo-gauges";
import { listDrawings, placeGauge, uploadDrawing } from "@/lib/services/files";
import { getLimits, replaceLimits } from "@/lib/services/limits";
import { DEMO_DRAWINGS } from "./demo-drawings";

/**
 * The demo scenario, invented from end to end: the Brennock Valley Transport Trust owns a
 * steel truss footbridge and a post-tensioned concrete parking deck, watched by one
 * engineer and one technician.
 */
export const DEMO_USERS: { email: string; name: string; role: Role; password: string; structures: string[] }[] = [
  { email: "admin@hookeline.example", name: "Morgan Hale", role: "admin", password: "admin-demo", structures: [] },
  { email: "engineer@hookeline.example", name: "Priya Venn", role: "engineer", password: "engineer-demo", structures: ["MILL-FB", "ORCH-PD"] },
  { email: "technician@hookeline.example", name: "Tomas Reed", role: "technician", password: "technician-demo", structures: ["MILL-FB"] },
  { email: "owner@hookeline.example", name: "Iris Calder", role: "owner", password: "owner-demo", structures: ["MILL-FB", "ORCH-PD"] },
];

export const DEMO_STRUCTURES = [
  {
    code: "MILL-FB",
    name: "Millrace Footbridge",
    location: "Kestrel Lane, Brennock",
    timezone: "Europe/London",
    description:
      "Steel Warren-truss footbridge, 42 m span, over the Brennock millrace. Owner: Brennock Valley Transport Trust. " +
      "Monitored after a 2026 repair of the lower chord.",
  },
  {
    code: "ORCH-PD",
    name: "Orchard Street Parking Deck",
    location: "Orchard Street, Brennock",
    timezone: "Europe/London",
    description:
      "Four-level post-tensioned concrete parking deck. Owner: Brennock Valley Transport Trust. " +
      "Monitored while cracked level-2 slabs wait for strengthening.",
  },
];

async function ignoreExisting(work: Promise<unknown>) {
  try {
    await work;
  } catch (error) {
    if (error instanceof AppError && error.code === "conflict") return;
    if (isUniqueViolation(error)) return;
    throw error;
  }
}

async function actorFor(email: string): Promise<UserActor> {
  const user = await findUserByEmail(email);
  if (!user) throw new Error(`Demo user ${email} is missing`);
  return { kind: "user", id: user.id, email: user.email, name: user.name, role: user.role };
}

/** The technician registered the footbridge's gauges; the engineer those of the parking deck. */
async function installers(): Promise<Record<string, UserActor>> {
  return {
    "MILL-FB": await actorFor("technician@hookeline.example"),
    "ORCH-PD": await actorFor("engineer@hookeline.example"),
  };
}

const INSTALLED_BEFORE_READINGS_MS = 86_400_000;

async function seedGauges(now: number) {
  const installedAt = new Date(demoPeriod(now).start - INSTALLED_BEFORE_READINGS_MS).toISOString();
  const installerOf = await installers();
  for (const { structure, input } of [...DEMO_GAUGES, ...DEMO_DYNAMIC_GAUGES]) {
    const installer = installerOf[structure]!;
    const existing = await listGauges(installer, structure);
    if (existing.some((gauge) => gauge.tag === input.tag)) continue;
    await createGauge(installer, structure, { ...input, zero: { ...input.zero, time: installedAt } });
  }
  for (const rosette of DEMO_ROSETTES) {
    const engineer = await actorFor("engineer@hookeline.example");
    await ignoreExisting(createRosette(engineer, rosette.structure, rosette));
  }
}

/** Each structure gets its drawing once, with the demo gauges placed where they are installed. */
async function seedDrawings() {
  const engineer = await actorFor("engineer@hookeline.example");
  for (const drawing of DEMO_DRAWINGS) {
    if ((await listDrawings(engineer, drawing.structure)).length > 0) continue;
    const uploaded = await uploadDrawing(engineer, drawing.structure, { bytes: drawing.png(), fields: { title: drawing.title } });
    for (const [tag, [x, y]] of Object.entries(drawing.placements)) {
      await placeGauge(engineer, drawing.structure, tag, { drawingId: uploaded.id, x, y });
    }
  }
}

/** The engineer's example limits, set before the readings arrive so the demo raises real alerts. */
async function seedLimits() {
  const engineer = await actorFor("engineer@hookeline.example");
  for (const { structure, tag, limits } of DEMO_LIMITS) {
    if ((await getLimits(engineer, structure, tag)).length > 0) continue;
    await replaceLimits(engineer, structure, tag, limits);
  }
}

/**
 * Creates what is missing of the demo scenario; running it again changes nothing. Without
 * `readings`, the gauges stay silent until a logger (jobs/demo-logger.ts) reports.
 */
export async function seedDemo(now = Date.now(), { readings = true }: { readings?: boolean } = {}): Promise<void> {
  for (const structure of DEMO_STRUCTURES) {
    if (!(await findStructureByCode(structure.code))) await createStructure(null, structure);
  }
  for (const user of DEMO_USERS) {
    if (!(await findUserByEmail(user.email))) {
      await createUser(null, { email: user.email, name: user.name, role: user.role, password: user.password });
    }
    for (const code of user.structures) await ignoreExisting(addMember(null, user.email, code));
  }
  await seedGauges(now);
  await seedDrawings();
  await seedLimits();
  if (readings) {
    await seedReadings();
    await seedBursts();
  }
}

/** Fixed, so every seeded database holds the same invented readings. */
export const DEMO_SEED = 20_260_301;
const SEED_BATCH = 5_000;

/**
 * The demo period starts a day after the gauges' installation, as stored at the first run, so a
 * later run regenerates exactly the same readings and stores nothing new: they are duplicates.
 */
async function readingsStart(structureCode: string, gaugeIds: number[]): Promise<number> {
  const [row] = await getDb()
    .select({ installed: min(zeroReadings.time) })
    .from(zeroReadings)
    .where(and(inArray(zeroReadings.gaugeId, gaugeIds), eq(zeroReadings.reason, "installation")));
  if (!row?.installed) throw new Error(`Demo gauges of ${structureCode} have no installation zero`);
  return row.installed.getTime() + INSTALLED_BEFORE_READINGS_MS;
}

export const DEMO_STRUCTURE_CODES = DEMO_STRUCTURES.map((structure) => structure.code);

/**
 * What tells a demo structure's story: the ingestion target its installer sends to, the time the
 * story starts, and each demo gauge's synthetic source with its expected interval.
 */
export async function demoStory(structureCode: string) {
  const installer = (await installers())[structureCode]!;
  const target = await openIngestion(installer, structureCode);
  const start = await readingsStart(structureCode, [...target.gauges.values()].map((gauge) => gauge.id));
  const gauges = DEMO_GAUGES.filter((gauge) => gauge.structure === structureCode && target.gauges.has(gauge.input.tag)).map(({ input, story }) => {
    const { id, retired, row } = target.gauges.get(input.tag)!;
    return { tag: input.tag, gaugeId: id, retired, intervalMs: (row.expectedInterval ?? DEFAULT_EXPECTED_INTERVAL_S) * 1000, config: gaugeConfigOf(row), story: story(start) };
  });
  return { target, start, gauges };
}

/** 90 days of 10-minute readings per demo gauge, through the ingestion service like any logger's. */
async function seedReadings() {
  for (const structureCode of DEMO_STRUCTURE_CODES) {
    const { target, start, gauges } = await demoStory(structureCode);
    let batch: SyntheticReading[] = [];
    for (const reading of syntheticReadings({ start, days: DEMO_DAYS, seed: DEMO_SEED, gauges })) {
      batch.push(reading);
      if (batch.length === SEED_BATCH) {
        await ingestDecoded(target, batch);
        batch = [];
      }
    }
    if (batch.length > 0) await ingestDecoded(target, batch);
  }
}

/** How the demo's dynamic loggers record: a minute at 100 Hz every five minutes. */
export const DEMO_BURSTS = { rateHz: DEMO_BURST_RATE_HZ, burstSeconds: 60, everyMinutes: 5 } as const;
const BURST_STEP_MS = DEMO_BURSTS.everyMinutes * 60_000;

/**
 * A demo structure's dynamic gauges, as their logger sends to them: the ingestion target, when
 * their bursts start (the last few days of the demo period), and each gauge's synthetic source.
 * Null when the structure has none.
 */
export async function demoBurstStory(structureCode: string) {
  const demo = DEMO_DYNAMIC_GAUGES.filter((gauge) => gauge.structure === structureCode);
  if (demo.length === 0) return null;
  const installer = (await installers())[structureCode]!;
  const target = await openIngestion(installer, structureCode, demo.map((gauge) => gauge.input.tag));
  const readingsFrom = await readingsStart(structureCode, [...target.gauges.values()].map((gauge) => gauge.id));
  const start = readingsFrom + (DEMO_DAYS - DEMO_BURST_DAYS) * 86_400_000;
  const gauges = demo.flatMap(({ input, story }) => {
    const entry = target.gauges.get(input.tag);
    return entry ? [{ tag: input.tag, gaugeId: entry.id, retired: entry.retired, config: gaugeConfigOf(entry.row), story }] : [];
  });
  return { target, start, gauges };
}

/**
 * The last few days of the demo period as bursts of the dynamic gauges, through the burst service
 * like any logger's, requests of up to the contract's sample limit, in time order so rainflow
 * carries its residue from burst to burst.
 */
async function seedBursts() {
  for (const structureCode of DEMO_STRUCTURE_CODES) {
    const story = await demoBurstStory(structureCode);
    if (!story) continue;
    const { target, start, gauges: gaugesToFeed } = story;
    let batch: IncomingBurst[] = [];
    let samples = 0;
    const count = (DEMO_BURST_DAYS * 86_400_000) / BURST_STEP_MS;
    const bursts = syntheticBursts({ start, count, seed: DEMO_SEED, ...DEMO_BURSTS, gauges: gaugesToFeed });
    for (const burst of bursts) {
      if (samples + burst.values.length > MAX_BURST_SAMPLES_PER_REQUEST / 4) {
        await ingestBursts(target, batch);
        batch = [];
        samples = 0;
      }
      batch.push(burst);
      samples += burst.values.length;
    }
    if (batch.length > 0) await ingestBursts(target, batch);
  }
}
