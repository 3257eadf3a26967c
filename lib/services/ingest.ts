import "server-only";
import { inArray, min } from "drizzle-orm";
import { bulkSql, getDb, writeTransaction, type WriteTx } from "@/db/client";
import { zeroReadings, type Structure } from "@/db/schema";
import type { Actor } from "@/lib/auth/actor";
import { requirePermission } from "@/lib/auth/authorize";
import { AppError } from "@/lib/errors";
import { gaugeConfigOf } from "@/lib/gauges/record";
import { arrivalTally } from "@/lib/ingest/arrivals";
import { createBatch, rowCount, selectRows, type GaugeEntry, type GaugeRows, type PreparedBatch } from "@/lib/ingest/batch";
import { csvColumns, csvRows, type CsvRow } from "@/lib/ingest/csv";
import { decodeCsvReading, decodeJsonReading, type CsvColumns, type DecodedReading } from "@/lib/ingest/reading-input";
import type { Rejection } from "@/lib/ingest/rejections";
import { appendRollupValues, ROLLUP_COLUMNS } from "@/lib/ingest/rollup-rows";
import { prepareGauge } from "@/lib/mechanics";
import { isTimeZone } from "@/lib/validation";
import { gaugeRowsOf } from "./gauges";
import { getVisibleStructure } from "./structures";
import { evaluateInsertedReadings, type FaultTimesByGauge } from "./alert-raising";
import { evaluateRosetteLimits } from "./rosette-alert-raising";
import { withResiduals } from "./thermal";

/** Per request, as the API documents them; bigger logger files go through /uploads. */
export const MAX_READINGS_PER_REQUEST = 50_000;
export const MAX_REQUEST_BYTES = 10_000_000;
/** An upload is streamed, so its ceiling only guards the disk against a runaway client. */
export const MAX_UPLOAD_BYTES = 2_000_000_000;

export type AlertCounts = { opened: number; escalated: number; cleared: number };

export interface IngestResult {
  accepted: number;
  duplicates: number;
  rejected: Rejection[];
  alerts: AlertCounts;
}

/** A structure readings go to, with its gauges' converters prepared once for the whole request. */
export interface IngestTarget {
  structure: Structure;
  gauges: ReadonlyMap<string, GaugeEntry>;
}

/**
 * The structure and its gauges, ready to convert; with `tags`, only those gauges: a logger's batch
 * names a few of a structure's gauges, and each costs a row to read and a converter to prepare.
 */
export async function openIngestion(actor: Actor, code: string, tags?: readonly string[]): Promise<IngestTarget> {
  const structure = await getVisibleStructure(actor, code);
  await requirePermission(actor, "readings:ingest", structure);
  const gauges = new Map<string, GaugeEntry>();
  const rows = await gaugeRowsOf(structure.id, tags);
  const firstZeros = await firstZeroTimes(rows.map((row) => row.id));
  for (const row of rows) {
    gauges.set(row.tag, {
      id: row.id,
      tag: row.tag,
      retired: row.status === "retired",
      firstZeroTime: Math.min(firstZeros.get(row.id) ?? Infinity, row.zeroTime.getTime()),
      converter: prepareGauge(gaugeConfigOf(row)),
      row,
    });
  }
  return { structure, gauges };
}

/** Each gauge's earliest zero reading: the one in force at installation, or an earlier one typed later as a correction. */
async function firstZeroTimes(gaugeIds: number[]): Promise<Map<number, number>> {
  if (gaugeIds.length === 0) return new Map();
  const rows = await getDb()
    .select({ gaugeId: zeroReadings.gaugeId, time: min(zeroReadings.time) })
    .from(zeroReadings)
    .where(inArray(zeroReadings.gaugeId, gaugeIds))
    .groupBy(zeroReadings.gaugeId);
  return new Map(rows.flatMap((row) => (row.time ? [[row.gaugeId, row.time.getTime()] as const] : [])));
}

const tooManyReadings = () =>
  new AppError(
    "payload_too_large",
    `At most ${MAX_READINGS_PER_REQUEST.toLocaleString("en-US")} readings per request; split the batch, or upload a large logger file to /uploads.`,
  );

/**
 * Stores the valid readings of one request in one transaction. Readings come decoded (from
 * JSON, CSV, or the demo seed); their position in the request is what a rejection reports.
 */
export async function ingestDecoded(target: IngestTarget, readings: Iterable<DecodedReading>, now = Date.now()): Promise<IngestResult> {
  const batch = createBatch(target.gauges, now);
  let position = 0;
  for (const reading of readings) batch.add(position++, reading);
  return storeBatch(target, batch.finish());
}

/** Past this many different tags a request loads every gauge of the structure rather than a list of tags. */
const MAX_TAGS_LOOKED_UP = 500;

/** The gauge tags a JSON batch names, or undefined when it names too many to look up one by one. */
export function tagsNamed(readings: readonly unknown[]): string[] | undefined {
  const tags = new Set<string>();
  for (const reading of readings) {
    const gauge = (reading as { gauge?: unknown } | null)?.gauge;
    if (typeof gauge === "string") tags.add(gauge);
  }
  return tags.size > MAX_TAGS_LOOKED_UP ? undefined : [...tags];
}

/** `POST /readings` with a JSON body: `readings` already parsed, each element still unchecked. */
export async function ingestJson(actor: Actor, code: string, readings: readonly unknown[]): Promise<IngestResult> {
  if (readings.length > MAX_READINGS_PER_REQUEST) throw tooManyReadings();
  const target = await openIngestion(actor, code, tagsNamed(readings));
  return ingestDecoded(target, readings.map(decodeJsonReading));
}

/** The zone for CSV times without an offset: the caller's choice, else the structure's. */
function csvZone(structure: Structure, timezone: string | undefined): string {
  if (timezone === undefined) return structure.timezone;
  if (!isTimeZone(timezone)) {
    throw new AppError("bad_request", `Unknown time zone "${timezone.slice(0, 60)}"; use an IANA name such as Europe/London or UTC.`, {
      field: "timezone",
    });
  }
  return timezone;
}

/** A CSV body's header, checked before any row is read, and the rows after it. */
async function openCsv(body: AsyncIterable<Uint8Array>) {
  const rows = csvRows(body);
  const first = await rows.next();
  if (first.done) throw new AppError("bad_request", "The CSV is empty; its first line is the header gauge,time,value,temperature.");
  return { columns: csvColumns(first.value.fields), rows };
}

/** `POST /readings` with a CSV body (at most 50 000 rows, one transaction); `index` counts data rows from 0. */
export async function ingestCsv(actor: Actor, code: string, body: AsyncIterable<Uint8Array>, timezone?: string): Promise<IngestResult> {
  const target = await openIngestion(actor, code);
  const zone = csvZone(target.structure, timezone);
  const { columns, rows } = await openCsv(body);
  const decoded: DecodedReading[] = [];
  for await (const row of rows) {
    if (decoded.length === MAX_READINGS_PER_REQUEST) throw tooManyReadings();
    decoded.push(decodeCsvReading(row.fields, columns, zone));
  }
  return ingestDecoded(target, decoded);
}

const NO_ALERTS: AlertCounts = Object.freeze({ opened: 0, escalated: 0, cleared: 0 });

/** One write transaction: readings, their roll-ups and the limit evaluation commit together or not at all. */
async function storeBatch(target: IngestTarget, batch: PreparedBatch, onStored?: (inserted: readonly GaugeRows[]) => void): Promise<IngestResult> {
  const valid = rowCount(batch.gauges);
  if (valid === 0) return { accepted: 0, duplicates: batch.repeats, rejected: batch.rejected, alerts: { ...NO_ALERTS } };
  const { inserted, accepted, alerts } = await writeTransaction((tx) => storeConvertedReadings(tx, target, batch.gauges));
  // Told only once committed, so a batch that failed is never counted as arrived.
  onStored?.(inserted);
  return { accepted, duplicates: valid - accepted + batch.repeats, rejected: batch.rejected, alerts };
}

/**
 * Inside the caller's transaction: stores converted readings (per gauge in time order, one per
 * time) that are not stored yet, their roll-ups and the limit evaluation. Bursts use it for
 * their extremes, which limits take as readings at their own instants.
 */
export async function storeConvertedReadings(tx: WriteTx, target: IngestTarget, gauges: readonly GaugeRows[]): Promise<{ inserted: readonly GaugeRows[]; accepted: number; alerts: AlertCounts }> {
  const inserted = await insertReadings(tx, await withResiduals(tx, gauges));
  const evaluation = await evaluateLimits(tx, target, inserted);
  await mergeRollups(tx, withoutQuarantined(inserted, evaluation.quarantined));
  return { inserted, accepted: rowCount(inserted), alerts: evaluation.counts };
}

/**
 * Runs inside the ingestion transaction with exactly the readings this request stored (never
 * duplicates), per gauge in time order, then for the rosettes those gauges belong to, so alerts
 * open, escalate and clear, and their e-mails are queued, atomically with the readings that caused them.
 */
async function evaluateLimits(tx: WriteTx, target: IngestTarget, inserted: readonly GaugeRows[]): Promise<{ counts: AlertCounts; quarantined: FaultTimesByGauge }> {
  const total = { ...NO_ALERTS };
  const add = (counts: AlertCounts) => {
    total.opened += counts.opened;
    total.escalated += counts.escalated;
    total.cleared += counts.cleared;
  };
  const gauges = await evaluateInsertedReadings(
    tx,
    inserted.map((rows) => ({
      gauge: target.gauges.get(rows.tag)!.row,
      readings: rows.time.map((time, i) => ({ time, raw: rows.value[i]!, strain: rows.strain[i]!, stress: rows.stress[i]!, flags: rows.flags[i]!, residual: rows.residual[i]! })),
    })),
  );
  add(gauges.counts);
  const gaugesById = new Map([...target.gauges.values()].map((entry) => [entry.id, entry.row]));
  const times = inserted.filter((rows) => rows.time.length > 0).map((rows) => ({ gaugeId: rows.gaugeId, times: rows.time }));
  add(await evaluateRosetteLimits(tx, target.structure.id, gaugesById, times, gauges.faultTimes));
  return { counts: total, quarantined: gauges.quarantined };
}

/**
 * Roll-ups summarise what the structure did, so readings sensor health found faulty stay out of
 * their extremes, sums and counts (they stay stored, marked by `readings.fault`). A replay may change
 * the verdict of readings rolled up by an earlier request; those roll-ups are left as they were.
 */
function withoutQuarantined(inserted: readonly GaugeRows[], quarantined: FaultTimesByGauge): GaugeRows[] {
  return inserted.map((rows) => {
    const faulty = quarantined.get(rows.gaugeId);
    if (!faulty) return rows;
    const kept = rows.time.flatMap((time, i) => (faulty.has(time) ? [] : [i]));
    return selectRows(rows, kept);
  });
}

const READING_COLUMNS = 8;

/** Statement texts by row count: a batch reuses one text per chunk size instead of rebuilding it. */
const statementCache = new Map<string, string>();

function statement(kind: "readings" | "rollups", rows: number): string {
  const key = `${kind}:${rows}`;
  let sql = statementCache.get(key);
  if (!sql) {
    sql = kind === "readings" ? insertReadingsSql(rows) : mergeRollupsSql(rows);
    statementCache.set(key, sql);
  }
  return sql;
}

const placeholders = (rows: number, columns: number) => {
  const row = `(${Array(columns).fill("?").join(",")})`;
  return Array(rows).fill(row).join(",");
};

function insertReadingsSql(rows: number): string {
  return `INSERT INTO readings (gauge_id, t, value, temperature, strain, stress, flags, residual) VALUES ${placeholders(rows, READING_COLUMNS)}`;
}

/**
 * Merges roll-up rows into stored ones. SQLite's two-argument min() and max() are NULL when either
 * side is, so the temperature columns (NULL while no reading had one) fall back to the other side.
 */
function mergeRollupsSql(rows: number): string {
  const nullable = (column: string, combined: string) => `${column} = coalesce(${combined}, ${column}, excluded.${column})`;
  return (
    `INSERT INTO rollups (${ROLLUP_COLUMNS.join(", ")}) VALUES ${placeholders(rows, ROLLUP_COLUMNS.length)} ` +
    "ON CONFLICT (gauge_id, resolution, bucket) DO UPDATE SET " +
    [
      "count = count + excluded.count",
      "strain_min = min(strain_min, excluded.strain_min)",
      "strain_max = max(strain_max, excluded.strain_max)",
      "strain_sum = strain_sum + excluded.strain_sum",
      "stress_min = min(stress_min, excluded.stress_min)",
      "stress_max = max(stress_max, excluded.stress_max)",
      "stress_sum = stress_sum + excluded.stress_sum",
      "temperature_count = temperature_count + excluded.temperature_count",
      nullable("temperature_min", "min(temperature_min, excluded.temperature_min)"),
      nullable("temperature_max", "max(temperature_max, excluded.temperature_max)"),
      nullable("temperature_sum", "temperature_sum + excluded.temperature_sum"),
      "residual_count = residual_count + excluded.residual_count",
      nullable("residual_min", "min(residual_min, excluded.residual_min)"),
      nullable("residual_max", "max(residual_max, excluded.residual_max)"),
      nullable("residual_sum", "residual_sum + excluded.residual_sum"),
    ].join(", ")
  );
}

/**
 * Leaves out readings whose (gauge, time) is already stored, then inserts the rest in chunks under
 * the parameter limit. The write transaction holds SQLite's write lock from its start, so nothing
 * can be stored between the look-up and the insert. Looking up the batch's own times (one index
 * probe each, usually finding nothing) costs less than asking every insert to return its keys.
 * Returns the rows inserted, per gauge in time order.
 */
async function insertReadings(tx: WriteTx, gauges: readonly GaugeRows[]): Promise<GaugeRows[]> {
  const raw = bulkSql(tx);
  const fresh: GaugeRows[] = [];
  for (const rows of gauges) {
    // Loggers mostly send what comes after what is stored: one range probe settles that case
    // without looking up every time.
    const overlap = await raw.rows("SELECT 1 FROM readings WHERE gauge_id = ? AND t >= ? AND t <= ? LIMIT 1", [rows.gaugeId, rows.time[0]!, rows.time.at(-1)!]);
    if (overlap.length === 0) {
      fresh.push(rows);
      continue;
    }
    const stored = await raw.rows("SELECT t FROM readings WHERE gauge_id = ? AND t IN (SELECT value FROM json_each(?))", [rows.gaugeId, JSON.stringify(rows.time)]);
    if (stored.length === 0) {
      fresh.push(rows);
      continue;
    }
    const known = new Set(stored.map((row) => row[0] as number));
    const kept = rows.time.flatMap((time, i) => (known.has(time) ? [] : [i]));
    if (kept.length > 0) fresh.push(selectRows(rows, kept));
  }
  const values: (number | null)[] = [];
  for (const rows of fresh) {
    for (let i = 0; i < rows.time.length; i++) {
      values.push(rows.gaugeId, rows.time[i]!, rows.value[i]!, rows.temperature[i]!, rows.strain[i]!, rows.stress[i]!, rows.flags[i]!, rows.residual[i]!);
    }
  }
  await raw.insertRows((count) => statement("readings", count), READING_COLUMNS, values);
  return fresh;
}

async function mergeRollups(tx: WriteTx, inserted: readonly GaugeRows[]): Promise<void> {
  const values: (number | null)[] = [];
  for (const rows of inserted) appendRollupValues(rows, values);
  await bulkSql(tx).insertRows((count) => statement("rollups", count), ROLLUP_COLUMNS.length, values);
}

/** Rows rejected in an upload; past this many only the count grows, so a wrong file cannot fill the memory. */
export const MAX_REPORTED_REJECTIONS = 10_000;

export interface UploadRejection {
  /** Line of the file (the header is line 1). */
  line: number;
  code: Rejection["code"];
  message: string;
}

export interface UploadProgress {
  /** Bytes of the file read so far. */
  bytes: number;
  rows: number;
  accepted: number;
  duplicates: number;
  rejected: number;
}

export interface UploadReport extends UploadProgress {
  /** Per gauge: the readings stored (duplicates left out) and the times they span, UTC. */
  gauges: { gauge: string; readings: number; from: string; to: string }[];
  rejections: UploadRejection[];
  /** True when more rows were rejected than `rejections` lists. */
  rejectionsTruncated: boolean;
  alerts: AlertCounts;
}

/** Rows per transaction of an upload: big enough to insert fast, small enough to hold and to report progress. */
export const UPLOAD_BATCH_ROWS = 5_000;

/**
 * A logger file of any size, streamed: the header is checked at once (so a wrong file is a
 * 400 before anything is stored), then `run` reads the rows and stores them in batches of
 * 5 000, each its own transaction. A file that fails half-way keeps the batches already
 * reported; sending it again is safe, since stored readings come back as duplicates.
 */
export async function startCsvUpload(actor: Actor, code: string, body: AsyncIterable<Uint8Array>, timezone?: string) {
  const target = await openIngestion(actor, code);
  const zone = csvZone(target.structure, timezone);
  let bytes = 0;
  async function* counted() {
    for await (const chunk of body) {
      bytes += chunk.byteLength;
      yield chunk;
    }
  }
  const { columns, rows } = await openCsv(counted());
  return {
    zone,
    run: (onProgress: (progress: UploadProgress) => void) =>
      runUpload(target, columns, zone, rows, (progress) => onProgress({ ...progress, bytes })),
  };
}

async function runUpload(
  target: IngestTarget,
  columns: CsvColumns,
  zone: string,
  rows: AsyncIterable<CsvRow>,
  onProgress: (progress: Omit<UploadProgress, "bytes">) => void,
): Promise<Omit<UploadReport, "bytes">> {
  const report: Omit<UploadReport, "bytes"> = { rows: 0, accepted: 0, duplicates: 0, rejected: 0, gauges: [], rejections: [], rejectionsTruncated: false, alerts: { ...NO_ALERTS } };
  const arrivals = arrivalTally();
  const tally = (inserted: readonly GaugeRows[]) => inserted.forEach((rows) => arrivals.add(rows.tag, rows.time));
  let batch = createBatch(target.gauges, Date.now());
  let inBatch = 0;
  const store = async () => {
    const result = await storeBatch(target, batch.finish(), tally);
    report.accepted += result.accepted;
    report.duplicates += result.duplicates;
    report.rejected += result.rejected.length;
    for (const { index, code, message } of result.rejected) {
      if (report.rejections.length < MAX_REPORTED_REJECTIONS) report.rejections.push({ line: index, code, message });
      else report.rejectionsTruncated = true;
    }
    for (const key of Object.keys(report.alerts) as (keyof AlertCounts)[]) report.alerts[key] += result.alerts[key];
    onProgress({ rows: report.rows, accepted: report.accepted, duplicates: report.duplicates, rejected: report.rejected });
    batch = createBatch(target.gauges, Date.now());
    inBatch = 0;
  };
  for await (const row of rows) {
    batch.add(row.line, decodeCsvReading(row.fields, columns, zone));
    report.rows++;
    if (++inBatch === UPLOAD_BATCH_ROWS) await store();
  }
  if (inBatch > 0) await store();
  report.gauges = arrivals.arrivals().map(({ gauge, readings, first, last }) => ({ gauge, readings, from: new Date(first).toISOString(), to: new Date(last).toISOString() }));
  return report;
}
