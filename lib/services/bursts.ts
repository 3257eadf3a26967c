import "server-only";
import { and, eq, gt, inArray, lt, sql } from "drizzle-orm";
import { getDb, writeTransaction, type WriteTx } from "@/db/client";
import { burstSummaries, bursts, dynamicEvents, dynamicStates, type StoredSampling } from "@/db/schema";
import type { Actor } from "@/lib/auth/actor";
import {
  captureEvents,
  decodeHistogram,
  encodeHistogram,
  mergeSummaries,
  readFloat32LE,
  summarizeBlock,
  writeFloat32LE,
  countCycle,
  rebinHistogram,
  type CaptureState,
  type CapturedEvent,
  type IntervalSummary,
} from "@/lib/dynamic";
import { AppError } from "@/lib/errors";
import { createRainflowStream, type RainflowResidue } from "@/lib/fatigue";
import type { GaugeConverter } from "@/lib/mechanics";
import { beforeZeroProblem, temperatureProblem } from "@/lib/ingest/plausibility";
import { FUTURE_TOLERANCE_MS, emptyRows, type GaugeEntry, type GaugeRows } from "@/lib/ingest/batch";
import {
  burstEnd,
  decodeJsonBurst,
  isBurstProblem,
  type BurstRejection,
  type BurstRejectionCode,
  type DecodedBurst,
} from "@/lib/ingest/burst-input";
import { openIngestion, storeConvertedReadings, tagsNamed, type AlertCounts, type IngestTarget } from "./ingest";

/** Per request, from the API contract. */
export const MAX_BURST_SAMPLES_PER_REQUEST = 2_000_000;
export const MAX_BURST_REQUEST_BYTES = 16_000_000;

export interface BurstIngestResult {
  /** Samples taken into summaries by this request. */
  accepted: number;
  /** Bursts stored by this request. */
  bursts: number;
  /** Bursts whose (gauge, start) was already stored, or repeated in the request. */
  duplicates: number;
  rejected: BurstRejection[];
  /** Waveforms captured and stored by this request. */
  events: number;
  alerts: AlertCounts;
}

export type DynamicSampling = Extract<StoredSampling, { mode: "dynamic" }>;

/** A burst checked, converted and ready to summarise. */
interface PreparedBurst {
  index: number;
  gauge: GaugeEntry;
  sampling: DynamicSampling;
  start: number;
  end: number;
  temperature: number | null;
  raw: ArrayLike<number>;
  /** MPa, including the initial stress. */
  stress: Float64Array;
}

const tooManySamples = () =>
  new AppError(
    "payload_too_large",
    `At most ${MAX_BURST_SAMPLES_PER_REQUEST.toLocaleString("en-US")} samples per request; send the bursts in several requests.`,
  );

const reject = (index: number, code: BurstRejectionCode, message: string): BurstRejection => ({ index, code, message });

// Rates are compared with a little slack, as a logger may write 1000 as 1000.0000001.
const sameRate = (a: number, b: number) => Math.abs(a - b) <= 1e-9 * b;

/** Sample stress through the gauge's converter (the mechanics core readings use), one temperature per burst. */
function convertSamples(index: number, gauge: GaugeEntry, values: ArrayLike<unknown>, temperature: number | null): Float64Array | BurstRejection {
  const converter = gauge.converter;
  if (!converter.ok) {
    return reject(index, "gauge-not-convertible", `Gauge "${gauge.tag}" cannot convert samples (${converter.code}): ${converter.message}`);
  }
  // A binary body is all numbers already: its own loop keeps the element access monomorphic.
  if (values instanceof Float32Array) return convertFloats(index, converter, values, temperature);
  const stress = new Float64Array(values.length);
  for (let i = 0; i < values.length; i++) {
    const value = values[i];
    if (typeof value !== "number" || !Number.isFinite(value)) return notFinite(index, i, value);
    const result = converter.convert(value, temperature);
    if (!result.ok) return reject(index, result.code, `Sample ${i}: ${result.message}`);
    if (!Number.isFinite(result.stress)) return reject(index, "not-finite", `Sample ${i} converts to a stress that is not finite; check the gauge's configuration.`);
    stress[i] = result.stress;
  }
  return stress;
}

const notFinite = (index: number, i: number, value: unknown) =>
  reject(
    index,
    "not-finite",
    `Sample ${i} is ${typeof value === "number" ? String(value) : JSON.stringify(value ?? null)}, not a finite number; the burst is refused whole. Leave bad samples out of the logger's output or send the burst in two.`,
  );

function convertFloats(index: number, converter: GaugeConverter, values: Float32Array, temperature: number | null): Float64Array | BurstRejection {
  const stress = new Float64Array(values.length);
  const failed = converter.convertStresses(values, temperature, stress);
  if (failed === null) return stress;
  const value = values[failed.index]!;
  if (!Number.isFinite(value)) return notFinite(index, failed.index, value);
  return reject(index, failed.failure.code, `Sample ${failed.index}: ${failed.failure.message}`);
}

function prepareBurst(index: number, burst: DecodedBurst, gauges: ReadonlyMap<string, GaugeEntry>, now: number): PreparedBurst | BurstRejection {
  if (isBurstProblem(burst)) return reject(index, burst.code, burst.message);
  const gauge = gauges.get(burst.gauge);
  if (!gauge) return reject(index, "unknown-gauge", `No gauge tagged "${burst.gauge.slice(0, 40)}" on this structure; register it before sending its bursts.`);
  if (gauge.retired) return reject(index, "retired-gauge", `Gauge "${gauge.tag}" is retired and takes no more data.`);
  const sampling = gauge.row.sampling;
  if (sampling.mode !== "dynamic") {
    return reject(index, "not-dynamic", `Gauge "${gauge.tag}" is static: send its data to /readings, or set its sampling to dynamic first.`);
  }
  if (!sameRate(burst.rateHz, sampling.rateHz)) {
    return reject(index, "wrong-rate", `Gauge "${gauge.tag}" samples at ${sampling.rateHz} Hz, the burst says ${burst.rateHz} Hz; resample on the logger or change the gauge's rate.`);
  }
  const end = burstEnd(burst);
  if (end > now + FUTURE_TOLERANCE_MS) {
    return reject(index, "time-in-future", "The burst ends more than 5 minutes ahead of the server's clock; check the logger's clock and time zone.");
  }
  const implausible = beforeZeroProblem(burst.start, gauge.firstZeroTime, gauge.tag) ?? temperatureProblem(burst.temperature);
  if (implausible) return reject(index, implausible.code, implausible.message);
  const stress = convertSamples(index, gauge, burst.values, burst.temperature);
  if (!(stress instanceof Float64Array)) return stress;
  return { index, gauge, sampling, start: burst.start, end, temperature: burst.temperature, raw: burst.values as ArrayLike<number>, stress };
}

/** Bursts of a JSON body: `bursts` already parsed, each element still unchecked. */
export async function ingestJsonBursts(actor: Actor, code: string, items: readonly unknown[], now = Date.now()): Promise<BurstIngestResult> {
  let samples = 0;
  for (const item of items) {
    const values = (item as { values?: unknown } | null)?.values;
    if (Array.isArray(values)) samples += values.length;
  }
  if (samples > MAX_BURST_SAMPLES_PER_REQUEST) throw tooManySamples();
  const target = await openIngestion(actor, code, tagsNamed(items));
  return ingestBursts(target, items.map(decodeJsonBurst), now);
}

/**
 * The bytes of a binary burst as floats; a body that is not a whole number of floats is a 400,
 * since a logger that cut a float in two has sent something else than it meant.
 */
export function binaryBurstValues(body: Uint8Array): Float32Array {
  if (body.byteLength % 4 !== 0) {
    throw new AppError("bad_request", `The body has ${body.byteLength} bytes, not a whole number of 4-byte floats; send the samples as 32-bit little-endian floats.`);
  }
  if (body.byteLength / 4 > MAX_BURST_SAMPLES_PER_REQUEST) throw tooManySamples();
  return readFloat32LE(body);
}

/** `POST /bursts` with a binary body: one burst, its fields from the query. */
export async function ingestBinaryBurst(actor: Actor, code: string, burst: DecodedBurst, now = Date.now()): Promise<BurstIngestResult> {
  const target = await openIngestion(actor, code, isBurstProblem(burst) ? [] : [burst.gauge]);
  return ingestBursts(target, [burst], now);
}

const NO_ALERTS: AlertCounts = Object.freeze({ opened: 0, escalated: 0, cleared: 0 });

/** Half a sample's time: ends and starts that close are the same instant. */
const slack = (rateHz: number) => 500 / rateHz;

/**
 * Stores the valid bursts of one request in one transaction: each gauge's bursts in time order
 * through summaries, rainflow and event capture, then their extremes and last samples as
 * readings, which limits evaluate like any others.
 *
 * Summaries, rainflow and events are worked out before the transaction, against what is stored
 * then, so the one write transaction at a time only checks that nothing changed and writes. A
 * request for the same gauge that committed in between changes the basis; the gauge's plan is
 * then made again inside the transaction, against what is stored now.
 */
export async function ingestBursts(target: IngestTarget, decoded: readonly DecodedBurst[], now = Date.now()): Promise<BurstIngestResult> {
  const rejected: BurstRejection[] = [];
  const byGauge = new Map<number, PreparedBurst[]>();
  decoded.forEach((burst, index) => {
    const prepared = prepareBurst(index, burst, target.gauges, now);
    if ("code" in prepared) return rejected.push(prepared);
    const list = byGauge.get(prepared.gauge.id) ?? [];
    list.push(prepared);
    byGauge.set(prepared.gauge.id, list);
  });
  const result: BurstIngestResult = { accepted: 0, bursts: 0, duplicates: 0, rejected, events: 0, alerts: { ...NO_ALERTS } };
  if (byGauge.size === 0) return result;
  const plans = new Map<number, GaugePlan>();
  for (const [gaugeId, list] of byGauge) {
    list.sort((a, b) => a.start - b.start || a.index - b.index);
    plans.set(gaugeId, planGauge(await readBasis(getDb(), list)));
  }
  await writeTransaction(async (tx) => {
    const extremes: GaugeRows[] = [];
    for (const [gaugeId, list] of byGauge) {
      const basis = await readBasis(tx, list);
      const planned = plans.get(gaugeId)!;
      const plan = sameBasis(planned.basis, basis) ? planned : planGauge(basis);
      result.duplicates += plan.basis.duplicates;
      result.rejected.push(...plan.basis.rejected);
      if (plan.basis.kept.length === 0) continue;
      extremes.push(await writeGaugePlan(tx, target, plan, result));
    }
    if (extremes.length > 0) result.alerts = (await storeConvertedReadings(tx, target, extremes)).alerts;
  });
  result.rejected.sort((a, b) => a.index - b.index);
  return result;
}

/** What a gauge's plan was made against: the bursts left after duplicates and overlaps, and the stored rainflow and capture state. */
interface PlanBasis {
  kept: PreparedBurst[];
  duplicates: number;
  rejected: BurstRejection[];
  state: StoredState | null;
}

/** The write transaction, or the shared client before it opens: both read through Drizzle alike. */
type Reader = Pick<WriteTx, "select">;

async function readBasis(reader: Reader, list: PreparedBurst[]): Promise<PlanBasis> {
  const gaugeId = list[0]!.gauge.id;
  return { ...(await leaveOutStored(reader, list)), state: await loadState(reader, gaugeId) };
}

/**
 * A stored state only changes when a burst is stored in time, which moves its end; the residue
 * is compared too, so a state rebuilt in between is never taken for the one planned against.
 */
function sameBasis(a: PlanBasis, b: PlanBasis): boolean {
  const indices = (basis: PlanBasis) => basis.kept.map((burst) => burst.index).join(",") + "/" + basis.rejected.map((r) => r.index).join(",");
  return (
    indices(a) === indices(b) &&
    a.duplicates === b.duplicates &&
    a.state?.end === b.state?.end &&
    JSON.stringify(a.state?.residue ?? null) === JSON.stringify(b.state?.residue ?? null)
  );
}

/**
 * Drops duplicates (a (gauge, start) stored, or earlier in the request) and refuses overlaps,
 * against what is stored and what this request keeps. Inside the write transaction, which holds
 * SQLite's write lock, nothing can be stored between this look-up and the insert.
 */
async function leaveOutStored(reader: Reader, list: PreparedBurst[]): Promise<Omit<PlanBasis, "state">> {
  const gaugeId = list[0]!.gauge.id;
  const stored = await reader
    .select({ start: bursts.start, end: bursts.end })
    .from(bursts)
    .where(and(eq(bursts.gaugeId, gaugeId), lt(bursts.start, Math.max(...list.map((b) => b.end))), gt(bursts.end, list[0]!.start)));
  const storedStarts = new Set(stored.map((row) => row.start));
  const kept: PreparedBurst[] = [];
  const rejected: BurstRejection[] = [];
  let duplicates = 0;
  for (const burst of list) {
    const eps = slack(burst.sampling.rateHz);
    if (storedStarts.has(burst.start) || kept.some((other) => other.start === burst.start)) {
      duplicates++;
      continue;
    }
    const clash = [...stored, ...kept].find((other) => other.start < burst.end - eps && other.end > burst.start + eps);
    if (clash) {
      rejected.push(
        reject(burst.index, "overlap", `The burst (${new Date(burst.start).toISOString()} to ${new Date(burst.end).toISOString()}) overlaps one from ${new Date(clash.start).toISOString()} to ${new Date(clash.end).toISOString()}; a resend must start at the same instant.`),
      );
      continue;
    }
    kept.push(burst);
  }
  return { kept, duplicates, rejected };
}

type StoredState = { end: number; residue: RainflowResidue; capture: CaptureState | null };

const float32Bytes = (values: Float32Array) => Buffer.from(writeFloat32LE(values));
const floatsOf = (bytes: Uint8Array | null) => (bytes ? Float32Array.from(readFloat32LE(bytes)) : new Float32Array(0));

async function loadState(reader: Reader, gaugeId: number): Promise<StoredState | null> {
  const [row] = await reader.select().from(dynamicStates).where(eq(dynamicStates.gaugeId, gaugeId)).limit(1);
  if (!row) return null;
  const capture: CaptureState | null =
    row.captureNextTime === null
      ? null
      : {
          nextTime: row.captureNextTime,
          recent: floatsOf(row.captureRecent),
          open: row.openEvent ? { ...row.openEvent, stress: floatsOf(row.openEventStress) } : null,
        };
  return { end: row.end, residue: row.residue, capture };
}

async function saveState(tx: WriteTx, gaugeId: number, state: StoredState) {
  const values = {
    gaugeId,
    end: state.end,
    residue: state.residue,
    captureNextTime: state.capture?.nextTime ?? null,
    captureRecent: state.capture ? float32Bytes(state.capture.recent) : null,
    openEvent: state.capture?.open ? { start: state.capture.open.start, trigger: state.capture.open.trigger, peak: state.capture.open.peak, peakAt: state.capture.open.peakAt, quietSamples: state.capture.open.quietSamples } : null,
    openEventStress: state.capture?.open ? float32Bytes(state.capture.open.stress) : null,
  };
  const { gaugeId: _key, ...changes } = values;
  await tx.insert(dynamicStates).values(values).onConflictDoUpdate({ target: dynamicStates.gaugeId, set: changes });
}

/** The block's residue closed as half cycles into its last interval, for a burst that no later burst will continue. */
function closeResidue(residue: RainflowResidue, interval: IntervalSummary) {
  createRainflowStream((from, to, count) => countCycle(interval, from, to, count), residue).finish();
}

/** One gauge's kept bursts worked through: what the transaction writes for them. */
interface GaugePlan {
  basis: PlanBasis;
  sampling: DynamicSampling;
  /** The rainflow and capture state after the last burst in time; null when none was. */
  state: StoredState | null;
  intervals: Map<number, IntervalSummary>;
  events: CapturedEvent[];
  readings: { time: number; index: number; burst: PreparedBurst }[];
  samples: number;
}

/** One gauge's new bursts, in time order, through summaries, residue and event capture; no database. */
function planGauge(basis: PlanBasis): GaugePlan {
  const list = basis.kept;
  const sampling = list.at(-1)?.sampling ?? null;
  const plan: GaugePlan = { basis, sampling: sampling!, state: basis.state, intervals: new Map(), events: [], readings: [], samples: 0 };
  if (!sampling) return plan;
  const trigger = sampling.trigger ? { rateHz: sampling.rateHz, ...sampling.trigger } : null;
  let state = basis.state;
  for (const burst of list) {
    const config = { rateHz: sampling.rateHz, summaryMinutes: sampling.summaryMinutes, rangeBin: sampling.rangeBin };
    // A burst older than the newest one stored cannot join the signal the residue belongs to (its
    // neighbours may arrive later still): it is counted on its own, its residue closed as half
    // cycles, and it captures events without the recent samples.
    const inTime = state === null || burst.start >= state.end - slack(sampling.rateHz);
    const block = summarizeBlock(burst.stress, burst.start, config, inTime ? state?.residue : undefined);
    if (!inTime) closeResidue(block.residue, block.intervals.at(-1)!);
    for (const interval of block.intervals) {
      const earlier = plan.intervals.get(interval.start);
      plan.intervals.set(interval.start, earlier ? mergeSummaries(earlier, interval) : interval);
    }
    let capture = inTime ? (state?.capture ?? null) : null;
    if (trigger) {
      const captured = captureEvents(burst.stress, burst.start, trigger, capture);
      plan.events.push(...captured.events);
      capture = captured.state;
    }
    if (inTime) state = { end: burst.end, residue: block.residue, capture };
    plan.samples += burst.stress.length;
    // The last sample shows where the burst ends, so an alert opened on a peak can clear in it.
    for (const index of new Set([block.minIndex, block.maxIndex, burst.stress.length - 1])) {
      plan.readings.push({ time: Math.round(burst.start + (index * 1000) / sampling.rateHz), index, burst });
    }
  }
  plan.state = state;
  return plan;
}

/** Writes one gauge's plan (burst rows, merged summaries, state, events); returns the extremes (and last samples) as reading rows. */
async function writeGaugePlan(tx: WriteTx, target: IngestTarget, plan: GaugePlan, result: BurstIngestResult): Promise<GaugeRows> {
  const list = plan.basis.kept;
  const { gauge } = list[0]!;
  await tx.insert(bursts).values(list.map((b) => ({ gaugeId: gauge.id, start: b.start, end: b.end, samples: b.stress.length, temperature: b.temperature })));
  await mergeStoredSummaries(tx, gauge.id, plan.sampling, plan.intervals);
  if (plan.state && plan.state !== plan.basis.state) await saveState(tx, gauge.id, plan.state);
  if (plan.events.length > 0) {
    await tx.insert(dynamicEvents).values(plan.events.map((event) => eventRow(target, gauge.id, plan.sampling, event)));
    result.events += plan.events.length;
  }
  result.accepted += plan.samples;
  result.bursts += list.length;
  return extremeRows(gauge, plan.readings);
}

function eventRow(target: IngestTarget, gaugeId: number, sampling: DynamicSampling, event: CapturedEvent) {
  const level = event.trigger === "above" ? sampling.trigger?.above : sampling.trigger?.below;
  return {
    structureId: target.structure.id,
    gaugeId,
    start: event.start,
    end: event.start + (event.stress.length * 1000) / event.rateHz,
    rateHz: event.rateHz,
    trigger: event.trigger,
    triggerLevel: level ?? event.peak,
    peak: event.peak,
    peakAt: event.peakAt,
    truncated: event.truncated,
    waveform: float32Bytes(event.stress),
  };
}

/** Extremes and last sample of each burst as readings (time order, one per millisecond), converted again for their strain and flags. */
function extremeRows(gauge: GaugeEntry, readings: { time: number; index: number; burst: PreparedBurst }[]): GaugeRows {
  const rows = emptyRows(gauge.id, gauge.tag);
  const converter = gauge.converter;
  if (!converter.ok) return rows;
  readings.sort((a, b) => a.time - b.time);
  for (const { time, index, burst } of readings) {
    if (rows.time.at(-1) === time) continue;
    const result = converter.convert(burst.raw[index]!, burst.temperature);
    if (!result.ok) continue;
    rows.time.push(time);
    rows.value.push(burst.raw[index]!);
    rows.temperature.push(burst.temperature);
    rows.strain.push(result.strain);
    rows.stress.push(result.stress);
    rows.flags.push(result.flags);
    rows.residual.push(null);
  }
  return rows;
}

function summaryOfRow(row: typeof burstSummaries.$inferSelect): IntervalSummary {
  return {
    start: row.start,
    samples: row.samples,
    min: row.min,
    max: row.max,
    mean: row.mean,
    m2: row.m2,
    maxRange: row.maxRange,
    cycles: row.cycles,
    histogram: decodeHistogram(row.histogram),
  };
}

/** Adds the request's intervals to those stored (late bursts land in intervals already there). */
async function mergeStoredSummaries(tx: WriteTx, gaugeId: number, sampling: DynamicSampling, intervals: Map<number, IntervalSummary>) {
  const starts = [...intervals.keys()];
  const stored = await tx.select().from(burstSummaries).where(and(eq(burstSummaries.gaugeId, gaugeId), inArray(burstSummaries.start, starts)));
  const length = sampling.summaryMinutes * 60_000;
  const lengths = new Map(stored.map((row) => [row.start, row.length]));
  for (const row of stored) {
    const fresh = intervals.get(row.start)!;
    const earlier = summaryOfRow(row);
    intervals.set(row.start, mergeSummaries(earlier, { ...fresh, histogram: rebinHistogram(fresh.histogram, earlier.histogram.binWidth) }));
  }
  const rows = [...intervals.values()].map((s) => ({
    gaugeId,
    start: s.start,
    length: Math.max(length, lengths.get(s.start) ?? 0),
    samples: s.samples,
    min: s.min,
    max: s.max,
    mean: s.mean,
    m2: s.m2,
    maxRange: s.maxRange,
    cycles: s.cycles,
    histogram: Buffer.from(encodeHistogram(s.histogram)),
  }));
  await tx
    .insert(burstSummaries)
    .values(rows)
    .onConflictDoUpdate({
      target: [burstSummaries.gaugeId, burstSummaries.start],
      set: {
        length: sql`excluded.length`,
        samples: sql`excluded.samples`,
        min: sql`excluded.min`,
        max: sql`excluded.max`,
        mean: sql`excluded.mean`,
        m2: sql`excluded.m2`,
        maxRange: sql`excluded.max_range`,
        cycles: sql`excluded.cycles`,
        histogram: sql`excluded.histogram`,
      },
    });
}
