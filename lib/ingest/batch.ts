import type { Gauge } from "@/db/schema";
import type { Failure, GaugeConfigErrorCode, GaugeConverter } from "@/lib/mechanics";
import { failure } from "@/lib/mechanics/result";
import { MINUTE } from "@/lib/series";
import { beforeZeroProblem, temperatureProblem } from "./plausibility";
import { isProblem, type DecodedReading } from "./reading-input";
import type { Rejection } from "./rejections";

/** Readings may run ahead of the server's clock by this much (logger clocks drift, common practice); later ones are refused. */
export const FUTURE_TOLERANCE_MS = 5 * MINUTE;

/** A gauge of the structure as ingestion needs it: its converter is prepared once per batch. */
export interface GaugeEntry {
  id: number;
  tag: string;
  retired: boolean;
  /** Epoch ms of the gauge's earliest zero reading: readings before it have no reference. */
  firstZeroTime: number;
  converter: GaugeConverter | Failure<GaugeConfigErrorCode>;
  /** The stored gauge, for what evaluation needs beyond conversion (limits, yield, input). */
  row: Gauge;
}

/**
 * Converted readings of one gauge as columns, in time order with one reading per time. Columns
 * rather than an object per reading keep a large batch cheap to hold and to bind as SQL
 * parameters.
 */
export interface GaugeRows {
  gaugeId: number;
  tag: string;
  time: number[];
  value: number[];
  temperature: (number | null)[];
  /** Stress-producing strain, µε. */
  strain: number[];
  /** MPa, including the initial stress. */
  stress: number[];
  /** Bitmask of lib/mechanics Flag. */
  flags: number[];
  /** Measured − thermal model, µε; null until ingestion applies the gauge's thermal model, or where it cannot. */
  residual: (number | null)[];
}

export interface PreparedBatch {
  /** Gauges with at least one valid reading. */
  gauges: GaugeRows[];
  rejected: Rejection[];
  /** Readings repeating the (gauge, time) of an earlier reading of the same batch: the first is kept. */
  repeats: number;
}

export function emptyRows(gaugeId: number, tag: string): GaugeRows {
  return { gaugeId, tag, time: [], value: [], temperature: [], strain: [], stress: [], flags: [], residual: [] };
}

export function rowCount(gauges: readonly GaugeRows[]): number {
  return gauges.reduce((sum, rows) => sum + rows.time.length, 0);
}

/** Collects a batch reading by reading (JSON array or CSV rows), then sorts each gauge's readings. */
export interface BatchBuilder {
  /** `position` is what a rejection reports: the array index, or the CSV row. */
  add(position: number, reading: DecodedReading): void;
  finish(): PreparedBatch;
}

const unknownGauge = (tag: string) =>
  failure("unknown-gauge", `No gauge tagged "${tag.slice(0, 40)}" on this structure; register it before sending its readings.`);
const retiredGauge = (tag: string) => failure("retired-gauge", `Gauge "${tag}" is retired and takes no more readings.`);
const TIME_IN_FUTURE = failure(
  "time-in-future",
  "The time is more than 5 minutes ahead of the server's clock; check the logger's clock and time zone.",
);

export function createBatch(gauges: ReadonlyMap<string, GaugeEntry>, now: number): BatchBuilder {
  const latest = now + FUTURE_TOLERANCE_MS;
  const collected = new Map<string, GaugeRows>();
  const rejected: Rejection[] = [];

  function reject(position: number, problem: { code: Rejection["code"]; message: string }) {
    rejected.push({ index: position, code: problem.code, message: problem.message });
  }

  function add(position: number, reading: DecodedReading) {
    if (isProblem(reading)) return reject(position, reading);
    const gauge = gauges.get(reading.gauge);
    if (!gauge) return reject(position, unknownGauge(reading.gauge));
    if (gauge.retired) return reject(position, retiredGauge(gauge.tag));
    if (!gauge.converter.ok) {
      return reject(position, {
        code: "gauge-not-convertible",
        message: `Gauge "${gauge.tag}" cannot convert readings (${gauge.converter.code}): ${gauge.converter.message}`,
      });
    }
    if (reading.time > latest) return reject(position, TIME_IN_FUTURE);
    const implausible = beforeZeroProblem(reading.time, gauge.firstZeroTime, gauge.tag) ?? temperatureProblem(reading.temperature);
    if (implausible) return reject(position, implausible);
    const result = gauge.converter.convert(reading.value, reading.temperature);
    if (!result.ok) return reject(position, result);
    let rows = collected.get(gauge.tag);
    if (!rows) collected.set(gauge.tag, (rows = emptyRows(gauge.id, gauge.tag)));
    rows.time.push(reading.time);
    rows.value.push(reading.value);
    rows.temperature.push(reading.temperature);
    // The converter reuses its result object: copy the numbers now.
    rows.strain.push(result.strain);
    rows.stress.push(result.stress);
    rows.flags.push(result.flags);
    rows.residual.push(null);
  }

  function finish(): PreparedBatch {
    let repeats = 0;
    const sorted: GaugeRows[] = [];
    for (const rows of collected.values()) {
      const ordered = inTimeOrder(rows);
      repeats += rows.time.length - ordered.time.length;
      sorted.push(ordered);
    }
    return { gauges: sorted, rejected, repeats };
  }

  return { add, finish };
}

/** The rows sorted by time, keeping the first of readings that share a time. */
function inTimeOrder(rows: GaugeRows): GaugeRows {
  const { time } = rows;
  let ordered = true;
  for (let i = 1; i < time.length && ordered; i++) ordered = time[i]! > time[i - 1]!;
  if (ordered) return rows;
  // Array.prototype.sort is stable, so among equal times the one sent first stays first.
  const order = Array.from(time.keys()).sort((a, b) => time[a]! - time[b]!);
  return selectRows(rows, order.filter((i, k) => k === 0 || time[i] !== time[order[k - 1]!]));
}

/** The rows at the given positions, in that order. */
export function selectRows(rows: GaugeRows, positions: readonly number[]): GaugeRows {
  const out = emptyRows(rows.gaugeId, rows.tag);
  for (const i of positions) {
    out.time.push(rows.time[i]!);
    out.value.push(rows.value[i]!);
    out.temperature.push(rows.temperature[i]!);
    out.strain.push(rows.strain[i]!);
    out.stress.push(rows.stress[i]!);
    out.flags.push(rows.flags[i]!);
    out.residual.push(rows.residual[i]!);
  }
  return out;
}
