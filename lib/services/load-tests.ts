import "server-only";
import { and, asc, desc, eq, gt, gte, lt, lte, sql } from "drizzle-orm";
import { getDb, writeTransaction } from "@/db/client";
import { burstSummaries, gauges, loadTestPredictions, loadTests, readings, type Gauge, type LoadTest, type Structure } from "@/db/schema";
import type { LoadTestGauge, LoadTestResults, LoadTestSummary } from "@/lib/api/load-test-schemas";
import { actorLabel, type Actor } from "@/lib/auth/actor";
import { requirePermission } from "@/lib/auth/authorize";
import { AppError } from "@/lib/errors";
import {
  dataStateOf,
  gaugeResponse,
  gaugeResult,
  LOAD_TEST_CAUTION,
  resultsCsv,
  strainFromStress,
  type Baseline,
  type LoadTestInput,
  type StrainSpan,
} from "@/lib/load-tests";
import { Flag } from "@/lib/mechanics/validity";
import { recordAudit } from "./audit";
import { gaugeRowsOf } from "./gauges";
import { getVisibleStructure } from "./structures";

type Window = { start: number; end: number };
const iso = (ms: number) => new Date(ms).toISOString();

/** Readings that describe the structure: no sensor-health verdict against them, not beyond the gauge's rated range (as the report counts). */
const believed = sql`${readings.fault} = 0 and (${readings.flags} & ${Flag.outOfRange}) = 0`;

/**
 * A static gauge's baseline and the window's extremes. Only the highest and the lowest reading
 * decide the peak (lib/load-tests), so two ordered lookups on the gauge's key range replace
 * reading the window row by row, however long it is.
 */
async function readingsWindow(gaugeId: number, window: Window): Promise<{ baseline: Baseline | null; spans: StrainSpan[]; count: number }> {
  const inWindow = and(eq(readings.gaugeId, gaugeId), gte(readings.time, window.start), lt(readings.time, window.end), believed);
  const point = { time: readings.time, strain: readings.strain };
  const [before, highest, lowest, counted] = await Promise.all([
    getDb().select(point).from(readings).where(and(eq(readings.gaugeId, gaugeId), lt(readings.time, window.start), believed)).orderBy(desc(readings.time)).limit(1),
    getDb().select(point).from(readings).where(inWindow).orderBy(desc(readings.strain), asc(readings.time)).limit(1),
    getDb().select(point).from(readings).where(inWindow).orderBy(asc(readings.strain), asc(readings.time)).limit(1),
    getDb().select({ count: sql<number>`count(*)` }).from(readings).where(inWindow),
  ]);
  const spans = [...highest, ...lowest].map((row) => ({ start: row.time, end: row.time, low: row.strain, high: row.strain }));
  return { baseline: before[0] ?? null, spans, count: Number(counted[0]?.count ?? 0) };
}

/**
 * A dynamic gauge's summary intervals overlapping the window and, as baseline, the mean of the
 * last one that ended before it. Summaries hold stress; strain is read back through the gauge's
 * modulus and initial stress.
 */
async function summariesWindow(gauge: Gauge, window: Window): Promise<{ baseline: Baseline | null; spans: StrainSpan[]; count: number }> {
  const strainOf = (stress: number) => strainFromStress(stress, gauge.material.E, gauge.initialStress);
  const ends = sql<number>`${burstSummaries.start} + ${burstSummaries.length}`;
  const [before, inside] = await Promise.all([
    getDb()
      .select({ start: burstSummaries.start, length: burstSummaries.length, mean: burstSummaries.mean })
      .from(burstSummaries)
      .where(and(eq(burstSummaries.gaugeId, gauge.id), lte(ends, window.start)))
      .orderBy(desc(burstSummaries.start))
      .limit(1),
    getDb()
      .select({ start: burstSummaries.start, length: burstSummaries.length, min: burstSummaries.min, max: burstSummaries.max })
      .from(burstSummaries)
      .where(and(eq(burstSummaries.gaugeId, gauge.id), lt(burstSummaries.start, window.end), gt(ends, window.start)))
      .orderBy(asc(burstSummaries.start)),
  ]);
  const last = before[0];
  // Strain rises with stress (E > 0), so the lowest stress is the lowest strain.
  const spans = inside.map((row) => ({ start: row.start, end: row.start + row.length, low: strainOf(row.min), high: strainOf(row.max) }));
  return { baseline: last ? { time: last.start + last.length, strain: strainOf(last.mean) } : null, spans, count: spans.length };
}

async function measureGauge(gauge: Gauge, predicted: number, window: Window): Promise<LoadTestGauge> {
  const dynamic = gauge.sampling.mode === "dynamic";
  const data = dynamic ? await summariesWindow(gauge, window) : await readingsWindow(gauge.id, window);
  const response = gaugeResponse(predicted, data.baseline, data.spans);
  const result = gaugeResult({ gauge: gauge.tag, label: gauge.label, member: gauge.member, source: dynamic ? "summaries" : "readings", predicted }, response);
  return { ...result, readings: data.count };
}

async function testRows(structureId: number, where = eq(loadTests.structureId, structureId)) {
  return getDb()
    .select({ test: loadTests, gauges: sql<number>`(select count(*) from ${loadTestPredictions} where ${loadTestPredictions.loadTestId} = ${loadTests.id})` })
    .from(loadTests)
    .where(where)
    .orderBy(desc(loadTests.start), desc(loadTests.id));
}

function summaryOf(test: LoadTest, gaugeCount: number): LoadTestSummary {
  return {
    id: test.id,
    title: test.title,
    load: test.load,
    start: iso(test.start),
    end: iso(test.end),
    gauges: Number(gaugeCount),
    createdAt: test.createdAt.toISOString(),
    createdBy: test.createdByLabel,
  };
}

/** The structure's load tests, newest window first. */
export async function listLoadTests(actor: Actor, code: string): Promise<LoadTestSummary[]> {
  const structure = await getVisibleStructure(actor, code);
  await requirePermission(actor, "structure:view", structure);
  return (await testRows(structure.id)).map((row) => summaryOf(row.test, row.gauges));
}

/** Per gauge of the test, measured now from what is stored: a logger file uploaded after the test counts. */
async function resultsOf(structure: Structure, test: LoadTest): Promise<LoadTestResults> {
  const rows = await getDb()
    .select({ gauge: gauges, predicted: loadTestPredictions.predicted })
    .from(loadTestPredictions)
    .innerJoin(gauges, eq(gauges.id, loadTestPredictions.gaugeId))
    .where(eq(loadTestPredictions.loadTestId, test.id))
    .orderBy(asc(gauges.tag));
  const measured: LoadTestGauge[] = [];
  for (const row of rows) measured.push(await measureGauge(row.gauge, row.predicted, test));
  const { gauges: _gaugeCount, ...summary } = summaryOf(test, rows.length);
  return { ...summary, structure: structure.code, dataState: dataStateOf(measured), gauges: measured, caution: LOAD_TEST_CAUTION };
}

async function testOf(actor: Actor, code: string, id: number) {
  const structure = await getVisibleStructure(actor, code);
  await requirePermission(actor, "structure:view", structure);
  const [test] = await getDb()
    .select()
    .from(loadTests)
    .where(and(eq(loadTests.id, id), eq(loadTests.structureId, structure.id)))
    .limit(1);
  if (!test) throw new AppError("not_found", `Structure "${structure.code}" has no load test ${id}.`);
  return { structure, test };
}

export async function getLoadTestResults(actor: Actor, code: string, id: number): Promise<LoadTestResults> {
  const { structure, test } = await testOf(actor, code, id);
  return resultsOf(structure, test);
}

/** The results table as CSV, with the file name it is offered under. */
export async function loadTestResultsCsv(actor: Actor, code: string, id: number): Promise<{ filename: string; csv: string }> {
  const results = await getLoadTestResults(actor, code, id);
  return { filename: `${results.structure}-load-test-${results.id}.csv`, csv: resultsCsv(results) };
}

/**
 * Records a load test (engineers and admins; audited). Every gauge named must be the structure's:
 * unknown tags are all named in one refusal and nothing is stored. A window without data is
 * stored all the same, since the logger's file often arrives after the test; its results say
 * "no data in window" per gauge until it does.
 */
export async function createLoadTest(actor: Actor, code: string, input: LoadTestInput): Promise<LoadTestResults> {
  const structure = await getVisibleStructure(actor, code);
  await requirePermission(actor, "load-test:record", structure);
  const known = new Map((await gaugeRowsOf(structure.id)).map((gauge) => [gauge.tag, gauge]));
  const unknown = input.predicted.filter((row) => !known.has(row.gauge)).map((row) => row.gauge);
  if (unknown.length > 0) {
    throw new AppError(
      "validation_failed",
      `Structure ${structure.code} has no gauge tagged ${unknown.map((tag) => `"${tag}"`).join(", ")}; correct the tag${unknown.length > 1 ? "s" : ""} or leave ${unknown.length > 1 ? "them" : "it"} out.`,
      { field: "predicted", unknownGauges: unknown },
    );
  }
  const test = await writeTransaction(async (tx) => {
    const [row] = await tx
      .insert(loadTests)
      .values({
        structureId: structure.id,
        title: input.title,
        load: input.load,
        start: input.start,
        end: input.end,
        createdById: actor.kind === "user" ? actor.id : null,
        createdByLabel: actor.kind === "user" ? actor.name : actorLabel(actor),
      })
      .returning();
    await tx.insert(loadTestPredictions).values(input.predicted.map((p) => ({ loadTestId: row!.id, gaugeId: known.get(p.gauge)!.id, predicted: p.predicted })));
    await recordAudit(tx, {
      actor,
      action: "load-test.create",
      entityType: "load-test",
      entityKey: `${structure.code}/${row!.id}`,
      structureId: structure.id,
      after: { title: input.title, load: input.load, start: iso(input.start), end: iso(input.end), predicted: input.predicted },
    });
    return row!;
  });
  return resultsOf(structure, test);
}

/** The load tests whose window overlaps a report's period, oldest first, with their results. */
export async function loadTestsOfPeriod(structure: Structure, period: Window): Promise<LoadTestResults[]> {
  const rows = await testRows(structure.id, and(eq(loadTests.structureId, structure.id), lt(loadTests.start, period.end), gt(loadTests.end, period.start)));
  const results: LoadTestResults[] = [];
  for (const row of rows.reverse()) results.push(await resultsOf(structure, row.test));
  return results;
}
