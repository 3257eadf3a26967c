import "server-only";
import { and, asc, eq, gte, lt } from "drizzle-orm";
import { getDb } from "@/db/client";
import { readings, zeroReadings, type Gauge } from "@/db/schema";
import type { z } from "zod";
import type { gaugeFatigueSchema } from "@/lib/api/schemas";
import type { Actor } from "@/lib/auth/actor";
import { AppError } from "@/lib/errors";
import { DEFAULT_EXPECTED_INTERVAL_S, STALE_AFTER_INTERVALS } from "@/lib/alerting/gauge-state";
import {
  createFatigueHistory,
  createFatigueTally,
  damageRatePerYear,
  equivalentRange,
  minerDamage,
  rainflowMatrix,
  totalCycleCount,
  yearsToReachDamage,
  type RainflowMatrix,
} from "@/lib/fatigue";
import { histogramCells, mergeHistograms, occupiedBins, type RangeHistogram } from "@/lib/dynamic";
import { dailyHistograms } from "./dynamic-data";
import { Flag, isOutOfRange } from "@/lib/mechanics";
import { resolveGauge } from "./gauges";
import { dayOf } from "@/lib/time-format";

/** Range bins of 1 MPa: fine beside the usual categories' cut-offs of about 15 to 65 MPa. */
const FATIGUE_RANGE_BIN_MPA = 1;
/** Mean bins of 10 MPa: the mean matters to the engineer's own analysis, not to the S-N curve. */
const FATIGUE_MEAN_BIN_MPA = 10;
/** Readings per query: a year of 10-minute readings is under three pages. */
const PAGE_SIZE = 20_000;

/** The fatigue endpoint's body; the fields are documented on the schema. */
export type GaugeFatigue = z.output<typeof gaugeFatigueSchema>;

type StressReading = { time: number; stress: number; flags: number; fault: number };

/** A gauge's readings in [from, to) in time order, a page at a time by keyset on t. */
async function* readingPages(gaugeId: number, from: number, to: number, pageSize: number): AsyncGenerator<StressReading[]> {
  for (let after = from; ; ) {
    const page = await getDb()
      .select({ time: readings.time, stress: readings.stress, flags: readings.flags, fault: readings.fault })
      .from(readings)
      .where(and(eq(readings.gaugeId, gaugeId), gte(readings.time, after), lt(readings.time, to)))
      .orderBy(asc(readings.time))
      .limit(pageSize);
    if (page.length > 0) yield page;
    if (page.length < pageSize) return;
    // t is whole milliseconds and unique per gauge, so the next page starts 1 ms after the last.
    after = page.at(-1)!.time + 1;
  }
}

/**
 * The one rule for which stored readings fatigue leaves out as faulty: beyond the gauge's rated
 * range, or carrying the sensor-health verdict stored at ingestion (a jump, a flat line, a raw
 * value outside the sensor's range, or held after a jump until an engineer resolves it). Reading
 * the stored verdict, not running the detectors again, is what sees the hold: the detectors alone
 * would take the plausible readings after a jump as healthy.
 */
function isFaultyReading(reading: StressReading): boolean {
  return isOutOfRange(reading.flags) || reading.fault !== 0;
}

/**
 * Times after which stress comes from another zero reading: for every zero but the one in force
 * at installation, both when it was read on site and when it was recorded, since readings stored
 * between the two were converted with the previous zero.
 */
async function zeroEpochStarts(gauge: Gauge): Promise<number[]> {
  const zeros = await getDb()
    .select({ time: zeroReadings.time, setAt: zeroReadings.setAt })
    .from(zeroReadings)
    .where(eq(zeroReadings.gaugeId, gauge.id))
    .orderBy(asc(zeroReadings.id));
  return zeros.slice(1).flatMap((zero) => [zero.time.getTime(), zero.setAt.getTime()]);
}

/** Intervals between readings longer than this are outages, not covered time: the stale-data rule's silence. */
const longestCoveredIntervalMs = (gauge: Gauge) => STALE_AFTER_INTERVALS * (gauge.expectedInterval ?? DEFAULT_EXPECTED_INTERVAL_S) * 1000;

/**
 * Fatigue of one gauge over [from, to): rainflow counting (ASTM E1049) over the stored stress,
 * S-N curve of the detail category, Miner sum. The history streams through in pages and is never
 * held whole; the residue at the end of the period counts as half cycles, as the standard says.
 * A dynamic gauge sums the histograms stored from its bursts instead (source "bursts").
 * Category: the one asked for, else the gauge's own, else the caller must choose one.
 */
export async function gaugeFatigue(
  actor: Actor,
  code: string,
  tag: string,
  query: { from: Date; to: Date; category?: number },
  options: { pageSize?: number } = {},
): Promise<{ fatigue: GaugeFatigue; matrix: RainflowMatrix }> {
  const { structure, gauge } = await resolveGauge(actor, code, tag, "structure:view");
  const category = query.category ?? gauge.detailCategory;
  if (category == null) {
    throw new AppError(
      "bad_request",
      `Gauge "${gauge.tag}" has no fatigue detail category: choose one with category=<Δσ_C in MPa>, or set it in the gauge's registry entry.`,
      { field: "category" },
    );
  }

  if (gauge.sampling.mode === "dynamic") return burstFatigue(gauge, category, query, structure.timezone);
  return readingFatigue(gauge, category, query, options.pageSize ?? PAGE_SIZE);
}

/** The static path: rainflow over the stored readings, paged. */
async function readingFatigue(gauge: Gauge, category: number, query: { from: Date; to: Date }, pageSize: number): Promise<{ fatigue: GaugeFatigue; matrix: RainflowMatrix }> {
  const history = createFatigueHistory(await zeroEpochStarts(gauge), longestCoveredIntervalMs(gauge));
  const tally = createFatigueTally(category, FATIGUE_RANGE_BIN_MPA, FATIGUE_MEAN_BIN_MPA);
  let readingsUsed = 0;
  let readingsSkipped = 0;
  let readingsOutsideLinearRange = 0;
  let first: number | null = null;
  let last: number | null = null;
  for await (const page of readingPages(gauge.id, query.from.getTime(), query.to.getTime(), pageSize)) {
    for (const reading of page) {
      if (isFaultyReading(reading)) {
        readingsSkipped++;
        continue;
      }
      if (reading.flags & Flag.outsideLinearRange) readingsOutsideLinearRange++;
      history.push(reading.time, reading.stress);
      readingsUsed++;
      first ??= reading.time;
      last = reading.time;
    }
    tally.add(history.takeCounted());
  }
  tally.add(history.finish());

  const summary = tally.summary();
  const coverage = history.coverage();
  const observedSeconds = first === null || last === null ? 0 : (last - first) / 1000;
  const coveredSeconds = coverage.coveredMs / 1000;
  const rate = coveredSeconds > 0 ? damageRatePerYear(summary.damage, coveredSeconds) : null;
  const years = rate === null ? null : yearsToReachDamage(rate);
  return {
    fatigue: {
      ...summary,
      source: "readings",
      equivalentRange: equivalentRange(summary.cycles),
      damagePerDay: [],
      from: query.from.toISOString(),
      to: query.to.toISOString(),
      periodSeconds: (query.to.getTime() - query.from.getTime()) / 1000,
      firstReading: first === null ? null : new Date(first).toISOString(),
      lastReading: last === null ? null : new Date(last).toISOString(),
      observedSeconds,
      coveredSeconds,
      gapsLeftOut: coverage.gaps,
      gapSeconds: coverage.gapMs / 1000,
      longestCoveredIntervalSeconds: longestCoveredIntervalMs(gauge) / 1000,
      zeroEpochs: coverage.epochs,
      readingsUsed,
      readingsOutsideLinearRange,
      readingsSkipped,
      rangeBinWidth: FATIGUE_RANGE_BIN_MPA,
      damageRatePerYear: rate,
      yearsToDamageOne: years !== null && Number.isFinite(years) ? years : null,
    },
    matrix: tally.matrix(),
  };
}

function burstMatrix(total: RangeHistogram | null, binWidth: number): RainflowMatrix {
  const { cells, withoutMean } = total ? histogramCells(total) : { cells: [], withoutMean: [] };
  return rainflowMatrix(cells, binWidth, binWidth, withoutMean);
}

/**
 * The dynamic path: the rainflow histograms stored from the gauge's bursts over the period,
 * summed. Ranges are the bins' upper edges, so damage errs on the safe side of the binning;
 * the half cycles still open in the newest burst's residue are not in any histogram yet.
 * The matrix's mean bins are the histograms' own (the gauge's range bin width); cycles of
 * intervals stored before means were kept go to its "mean not recorded" column. Bursts are the
 * covered time: the rate divides by the seconds of samples, not the span between them.
 */
async function burstFatigue(gauge: Gauge, category: number, query: { from: Date; to: Date }, timeZone: string): Promise<{ fatigue: GaugeFatigue; matrix: RainflowMatrix }> {
  const stored = await dailyHistograms(gauge.id, { from: query.from.getTime(), to: query.to.getTime() }, timeZone);
  const days = stored ? [...stored.days] : [];
  const total = days.length === 0 ? null : days.slice(1).reduce((sum, [, histogram]) => mergeHistograms(sum, histogram), days[0]![1]);
  const cycles = total ? occupiedBins(total) : [];
  const damage = minerDamage(cycles, category);
  const rateHz = gauge.sampling.mode === "dynamic" ? gauge.sampling.rateHz : 1;
  const coveredSeconds = stored ? stored.samples / rateHz : 0;
  const rate = coveredSeconds > 0 ? damageRatePerYear(damage, coveredSeconds) : null;
  const years = rate === null ? null : yearsToReachDamage(rate);
  const binWidth = total?.binWidth ?? (gauge.sampling.mode === "dynamic" ? gauge.sampling.rangeBin : FATIGUE_RANGE_BIN_MPA);
  return {
    fatigue: {
      cycles,
      damage,
      category,
      cyclesCounted: totalCycleCount(cycles),
      source: "bursts",
      equivalentRange: equivalentRange(cycles),
      damagePerDay: days.map(([day, histogram]) => ({ day: dayOf(day, timeZone), damage: minerDamage(occupiedBins(histogram), category) })),
      from: query.from.toISOString(),
      to: query.to.toISOString(),
      periodSeconds: (query.to.getTime() - query.from.getTime()) / 1000,
      firstReading: stored ? new Date(stored.first).toISOString() : null,
      lastReading: stored ? new Date(stored.last).toISOString() : null,
      observedSeconds: stored ? (stored.last - stored.first) / 1000 : 0,
      coveredSeconds,
      gapsLeftOut: 0,
      gapSeconds: 0,
      longestCoveredIntervalSeconds: longestCoveredIntervalMs(gauge) / 1000,
      zeroEpochs: 1,
      readingsUsed: 0,
      readingsOutsideLinearRange: 0,
      readingsSkipped: 0,
      samplesCounted: stored?.samples ?? 0,
      rangeBinWidth: binWidth,
      damageRatePerYear: rate,
      yearsToDamageOne: years !== null && Number.isFinite(years) ? years : null,
    },
    matrix: burstMatrix(total, binWidth),
  };
}
