import "server-only";
import { getClient } from "@/db/client";
import type { Actor } from "@/lib/auth/actor";
import { AppError } from "@/lib/errors";
import { derivedDecimals, writtenDecimals } from "@/lib/mechanics";
import { gaugeConfigOf } from "@/lib/gauges/record";
import { readingFlagWords, readingsCsvHeader, readingsCsvLine, type ReadingsCsvHeader, type StoredReadingRow } from "@/lib/series/readings-csv";
import { bucketGrid, chooseSource, createBucketAccumulator, ROLLUP_RESOLUTIONS, type SeriesSource } from "@/lib/series";
import type { SeriesQuantity } from "@/lib/api/readings-schemas";
import { resolveGauge } from "./gauges";

const UNITS: Record<SeriesQuantity, string> = { strain: "µε", stress: "MPa", temperature: "°C", residual: "µε" };

/** Temperature and residual may be absent from a reading, so each has a count of its own in the roll-ups. */
const ROLLUP_COUNT: Record<SeriesQuantity, string> = { strain: "count", stress: "count", temperature: "temperature_count", residual: "residual_count" };

export type SeriesQuery = { from: number; to: number; points: number; quantity: SeriesQuantity };

const iso = (time: number) => new Date(time).toISOString();

/**
 * SQL that folds the source rows of [start, end) into grid buckets: SQLite scans the gauge's
 * contiguous key range and returns at most one row per bucket, so a year of one-minute readings
 * never crosses into JavaScript row by row. Columns: bucket index, min, max, sum, count.
 */
function bucketQuery(source: SeriesSource, quantity: SeriesQuantity): string {
  if (source === "raw") {
    return (
      `SELECT (t - :start) / :width AS b, min(${quantity}), max(${quantity}), sum(${quantity}), count(${quantity}) ` +
      "FROM readings WHERE gauge_id = :gauge AND t >= :start AND t < :end GROUP BY b ORDER BY b"
    );
  }
  return (
    `SELECT (bucket - :start) / :width AS b, min(${quantity}_min), max(${quantity}_max), sum(${quantity}_sum), sum(${ROLLUP_COUNT[quantity]}) ` +
    "FROM rollups WHERE gauge_id = :gauge AND resolution = :resolution AND bucket >= :start AND bucket < :end GROUP BY b ORDER BY b"
  );
}

/**
 * At most `points` buckets over the range, each with the exact min and max of what is stored in
 * it: raw readings for fine buckets, hourly or daily roll-ups once a bucket spans whole hours or
 * days (lib/series chooses). The grid's first and last buckets are whole, so they may reach
 * outside [from, to).
 */
export async function getSeries(actor: Actor, code: string, tag: string, query: SeriesQuery) {
  const { gauge } = await resolveGauge(actor, code, tag, "structure:view");
  const grid = bucketGrid(query.from, query.to, query.points);
  const source = chooseSource(grid.width);
  const result = await getClient().execute({
    sql: bucketQuery(source, query.quantity),
    // JavaScript numbers bind as REAL, which would turn the bucket division fractional: bind integers.
    args: {
      gauge: gauge.id,
      start: BigInt(grid.start),
      end: grid.end,
      width: BigInt(grid.width),
      ...(source === "raw" ? {} : { resolution: ROLLUP_RESOLUTIONS[source] }),
    },
  });
  const buckets = createBucketAccumulator(grid);
  for (const row of result.rows) {
    const time = grid.start + (row[0] as number) * grid.width;
    buckets.addAggregate(time, row[1] as number, row[2] as number, row[3] as number, row[4] as number);
  }
  return {
    quantity: query.quantity,
    unit: UNITS[query.quantity],
    from: iso(query.from),
    to: iso(query.to),
    bucketWidth: grid.width,
    source,
    ...buckets.result(),
  };
}

export type ReadingsQuery = { from: number; to: number; limit: number; cursor?: string; header?: ReadingsCsvHeader };

export interface ReadingView {
  time: string;
  value: number;
  temperature: number | null;
  strain: number;
  stress: number;
  flags: string[];
}

/** The cursor is opaque to clients; inside it is the time of the last reading they received. */
function encodeCursor(time: number): string {
  return Buffer.from(`t:${time}`).toString("base64url");
}

function decodeCursor(cursor: string): number {
  const match = /^t:(\d+)$/.exec(Buffer.from(cursor, "base64url").toString());
  if (!match) throw new AppError("bad_request", "The cursor is not one this API issued; pass `nextCursor` back unchanged.", { field: "cursor" });
  return Number(match[1]);
}

type StoredReading = StoredReadingRow;

/** Readings of a gauge after `after` (exclusive) and before `to`, oldest first. */
async function readingsAfter(gaugeId: number, after: number, to: number, limit: number): Promise<StoredReading[]> {
  const result = await getClient().execute({
    sql: "SELECT t, value, temperature, strain, stress, flags, fault FROM readings WHERE gauge_id = ? AND t > ? AND t < ? ORDER BY t LIMIT ?",
    args: [gaugeId, after, to, limit],
  });
  return result.rows as unknown as StoredReading[];
}

const toView = (row: StoredReading): ReadingView => ({
  time: iso(row.t),
  value: row.value,
  temperature: row.temperature,
  strain: row.strain,
  stress: row.stress,
  flags: readingFlagWords(row),
});

/** Where a listing starts: just after the cursor's reading, or at `from`. */
async function listingStart(actor: Actor, code: string, tag: string, query: ReadingsQuery) {
  const { structure, gauge } = await resolveGauge(actor, code, tag, "structure:view");
  const after = query.cursor === undefined ? query.from - 1 : Math.max(decodeCursor(query.cursor), query.from - 1);
  return { structure, gauge, after };
}

/** One page of stored readings, oldest first, with a cursor while more remain in the range. */
export async function listReadings(actor: Actor, code: string, tag: string, query: ReadingsQuery) {
  const { gauge, after } = await listingStart(actor, code, tag, query);
  const rows = await readingsAfter(gauge.id, after, query.to, query.limit + 1);
  const page = rows.slice(0, query.limit);
  const more = rows.length > query.limit;
  return { readings: page.map(toView), ...(more ? { nextCursor: encodeCursor(page[page.length - 1]!.t) } : {}) };
}

const EXPORT_PAGE = 5_000;

/**
 * Every reading of the range as CSV, read page by page as the client takes it, so an export of
 * years of data holds one page at a time. Flags are space-separated words. Strain and stress are
 * written to the resolution of the gauge's readings: the finest raw decimal of the first page
 * (or of the zero reading) taken through the gauge's conversion.
 */
export async function exportReadingsCsv(actor: Actor, code: string, tag: string, query: ReadingsQuery): Promise<ReadableStream<Uint8Array>> {
  const start = await listingStart(actor, code, tag, query);
  let after = start.after;
  const encoder = new TextEncoder();
  let headerSent = false;
  let decimals: ReturnType<typeof derivedDecimals> | undefined;
  const header = query.header ?? "names";
  const localTimeZone = header === "units" ? start.structure.timezone : null;
  return new ReadableStream<Uint8Array>({
    async pull(controller) {
      if (!headerSent) {
        headerSent = true;
        controller.enqueue(encoder.encode(readingsCsvHeader(header, start.gauge.input, start.structure.timezone)));
        return;
      }
      const rows = await readingsAfter(start.gauge.id, after, query.to, EXPORT_PAGE);
      if (rows.length === 0) return controller.close();
      after = rows[rows.length - 1]!.t;
      decimals ??= derivedDecimals(gaugeConfigOf(start.gauge), rawStep([start.gauge.zeroValue, ...rows.map((r) => r.value)]));
      controller.enqueue(encoder.encode(rows.map((row) => readingsCsvLine(row, decimals!, localTimeZone)).join("")));
    },
  });
}

/** The smallest step the logger writes: its finest decimal among these raw values (at most 9 places). */
const rawStep = (values: number[]) => 10 ** -Math.min(9, Math.max(...values.map(writtenDecimals)));
