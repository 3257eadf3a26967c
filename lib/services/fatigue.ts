import { and, asc, eq, gte, lt } from "drizzle-orm";
import { getDb } from "@/db/client";
import { readings } from "@/db/schema";
import type { z } from "zod";
import type { gaugeFatigueSchema } from "@/lib/api/schemas";
import type { Actor } from "@/lib/auth/actor";
import { AppError } from "@/lib/errors";
import {
  createFatigueTally,
  createRainflowCounter,
  damageRatePerYear,
  yearsToReachDamage,
  type RainflowMatrix,
} from "@/lib/fatigue";
import { Flag } from "@/lib/mechanics";
import { resolveGauge } from "./gauges";

/** Range bins of 1 MPa: fine beside the usual categories' cut-offs of about 15 to 65 MPa. */
const FATIGUE_RANGE_BIN_MPA = 1;
/** Mean bins of 10 MPa: the mean matters to the engineer's own analysis, not to the S-N curve. */
const FATIGUE_MEAN_BIN_MPA = 10;
/** Readings per query: a year of 10-minute readings is under three pages. */
const PAGE_SIZE = 20_000;

/** The fatigue endpoint's body; the fields are documented on the schema. */
export type GaugeFatigue = z.output<typeof gaugeFatigueSchema>;

type StressReading = { time: number; stress: number; flags: number };

/** A gauge's readings in [from, to) in time order, a page at a time by keyset on t. */
async function* readingPages(gaugeId: number, from: number, to: number, pageSize: number): AsyncGenerator<StressReading[]> {
  for (let after = from; ; ) {
    const page = await getDb()
      .select({ time: readings.time, stress: readings.stress, flags: readings.flags })
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
 * Fatigue of one gauge over [from, to): rainflow counting (ASTM E1049) over the stored stress,
 * S-N curve of the detail category, Miner sum. The history streams through in pages and is never
 * held whole; the residue at the end of the period counts as half cycles, as the standard says.
 * Category: the one asked for, else the gauge's own, else the caller must choose one.
 */
export async function gaugeFatigue(
  actor: Actor,
  code: string,
  tag: string,
  query: { from: Date; to: Date; category?: number },
  options: { pageSize?: number } = {},
): Promise<{ fatigue: GaugeFatigue; matrix: RainflowMatrix }> {
  const { gauge } = await resolveGauge(actor, code, tag, "structure:view");
  const category = query.category ?? gauge.detailCategory;
  if (category == null) {
    throw new AppError(
      "bad_request",
      `Gauge "${gauge.tag}" has no fatigue detail category: choose one with category=<Δσ_C in MPa>, or set it in the gauge's registry entry.`,
      { field: "category" },
    );
  }

  const counter = createRainflowCounter();
  const tally = createFatigueTally(category, FATIGUE_RANGE_BIN_MPA, FATIGUE_MEAN_BIN_MPA);
  let readingsUsed = 0;
  let readingsSkipped = 0;
  let readingsOutsideLinearRange = 0;
  let first: number | null = null;
  let last: number | null = null;
  for await (const page of readingPages(gauge.id, query.from.getTime(), query.to.getTime(), options.pageSize ?? PAGE_SIZE)) {
    for (const { time, stress, flags } of page) {
      if (flags & Flag.outOfRange) {
        readingsSkipped++;
        continue;
      }
      if (flags & Flag.outsideLinearRange) readingsOutsideLinearRange++;
      counter.push(stress);
      readingsUsed++;
      first ??= time;
      last = time;
    }
    tally.add(counter.takeCounted());
  }
  tally.add(counter.finish());

  const summary = tally.summary();
  const observedSeconds = first === null || last === null ? 0 : (last - first) / 1000;
  const rate = observedSeconds > 0 ? damageRatePerYear(summary.damage, observedSeconds) : null;
  const years = rate === null ? null : yearsToReachDamage(rate);
  return {
    fatigue: {
      ...summary,
      from: query.from.toISOString(),
      to: query.to.toISOString(),
      periodSeconds: (query.to.getTime() - query.from.getTime()) / 1000,
      firstReading: first === null ? null : new Date(first).toISOString(),
      lastReading: last === null ? null : new Date(last).toISOString(),
      observedSeconds,
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
