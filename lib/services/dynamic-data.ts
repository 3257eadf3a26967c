import "server-only";
import { and, asc, between, desc, eq, gte, lt, or } from "drizzle-orm";
import { getDb, writeTransaction } from "@/db/client";
import { alerts, burstSummaries, dynamicEvents, gauges, type DynamicEventRow } from "@/db/schema";
import type { z } from "zod";
import type { eventDetailSchema, eventListSchema, summariesSchema } from "@/lib/api/burst-schemas";
import type { Actor } from "@/lib/auth/actor";
import { requirePermission } from "@/lib/auth/authorize";
import { decodeHistogram, mergeHistograms, readFloat32LE, rmsOf, type RangeHistogram } from "@/lib/dynamic";
import { AppError } from "@/lib/errors";
import { startOfZoneDay } from "@/lib/time-format";
import { recordAudit } from "./audit";
import { resolveGauge } from "./gauges";
import { getVisibleStructure } from "./structures";

type Range = { from: number; to: number };
const iso = (ms: number) => new Date(Math.round(ms)).toISOString();

export type BurstSummaries = z.output<typeof summariesSchema>;
export type EventList = z.output<typeof eventListSchema>;
export type EventDetail = z.output<typeof eventDetailSchema>;

/** A page of intervals is a month of 10-minute ones; longer ranges ask for less at a time. */
export const MAX_SUMMARY_INTERVALS = 5_000;
export const MAX_EVENTS_LISTED = 1_000;

/** The gauge's summary intervals starting in [from, to), oldest first (stress in MPa). */
export async function gaugeSummaries(actor: Actor, code: string, tag: string, range: Range): Promise<BurstSummaries> {
  const { gauge } = await resolveGauge(actor, code, tag, "structure:view");
  const rows = await getDb()
    .select()
    .from(burstSummaries)
    .where(and(eq(burstSummaries.gaugeId, gauge.id), gte(burstSummaries.start, range.from), lt(burstSummaries.start, range.to)))
    .orderBy(asc(burstSummaries.start))
    .limit(MAX_SUMMARY_INTERVALS);
  return {
    unit: "MPa",
    intervals: rows.map((row) => ({
      start: iso(row.start),
      end: iso(row.start + row.length),
      samples: row.samples,
      min: row.min,
      max: row.max,
      mean: row.mean,
      rms: rmsOf(row),
      maxRange: row.maxRange,
      cycles: row.cycles,
    })),
  };
}

/** A gauge's stored rainflow histograms over a period, summed per day of the structure's zone. */
export interface DailyHistograms {
  /** Day start (epoch ms) → ranges counted that day, ascending by day. */
  days: Map<number, RangeHistogram>;
  /** Start of the first interval and end of the last. */
  first: number;
  last: number;
  samples: number;
}

/** Histograms of the gauge's intervals starting in [from, to), summed per day of `timeZone` (where each interval starts); null when there are none. */
export async function dailyHistograms(gaugeId: number, range: Range, timeZone: string): Promise<DailyHistograms | null> {
  const rows = await getDb()
    .select({ start: burstSummaries.start, length: burstSummaries.length, samples: burstSummaries.samples, histogram: burstSummaries.histogram })
    .from(burstSummaries)
    .where(and(eq(burstSummaries.gaugeId, gaugeId), gte(burstSummaries.start, range.from), lt(burstSummaries.start, range.to)))
    .orderBy(asc(burstSummaries.start));
  if (rows.length === 0) return null;
  const days = new Map<number, RangeHistogram>();
  let binWidth: number | null = null;
  let samples = 0;
  for (const row of rows) {
    const histogram = decodeHistogram(row.histogram);
    binWidth ??= histogram.binWidth;
    if (histogram.binWidth !== binWidth) {
      throw new AppError(
        "bad_request",
        `The period holds histograms in bins of ${binWidth} and ${histogram.binWidth} MPa (the gauge's bin width changed); choose a period on one side of the change.`,
      );
    }
    samples += row.samples;
    const day = startOfZoneDay(row.start, timeZone).getTime();
    const earlier = days.get(day);
    days.set(day, earlier ? mergeHistograms(earlier, histogram) : histogram);
  }
  return { days, first: rows[0]!.start, last: rows.at(-1)!.start + rows.at(-1)!.length, samples };
}

function eventSummary(row: Omit<DynamicEventRow, "waveform">, tag: string) {
  return {
    id: row.id,
    gauge: tag,
    start: iso(row.start),
    end: iso(row.end),
    peak: row.peak,
    peakAt: iso(row.peakAt),
    trigger: row.trigger,
    triggerLevel: row.triggerLevel,
    truncated: row.truncated,
    label: row.label,
  };
}

const eventColumns = {
  id: dynamicEvents.id,
  structureId: dynamicEvents.structureId,
  gaugeId: dynamicEvents.gaugeId,
  start: dynamicEvents.start,
  end: dynamicEvents.end,
  rateHz: dynamicEvents.rateHz,
  trigger: dynamicEvents.trigger,
  triggerLevel: dynamicEvents.triggerLevel,
  peak: dynamicEvents.peak,
  peakAt: dynamicEvents.peakAt,
  truncated: dynamicEvents.truncated,
  label: dynamicEvents.label,
  labelledById: dynamicEvents.labelledById,
  labelledAt: dynamicEvents.labelledAt,
};

/** The gauge's events starting in [from, to), newest first, without their waveforms. */
export async function gaugeEvents(actor: Actor, code: string, tag: string, range: Range): Promise<EventList> {
  const { gauge } = await resolveGauge(actor, code, tag, "structure:view");
  const rows = await getDb()
    .select(eventColumns)
    .from(dynamicEvents)
    .where(and(eq(dynamicEvents.gaugeId, gauge.id), gte(dynamicEvents.start, range.from), lt(dynamicEvents.start, range.to)))
    .orderBy(desc(dynamicEvents.start))
    .limit(MAX_EVENTS_LISTED);
  return { events: rows.map((row) => eventSummary(row, gauge.tag)) };
}

async function eventOf(actor: Actor, code: string, id: number) {
  const structure = await getVisibleStructure(actor, code);
  await requirePermission(actor, "structure:view", structure);
  const [row] = await getDb()
    .select({ event: dynamicEvents, tag: gauges.tag })
    .from(dynamicEvents)
    .innerJoin(gauges, eq(gauges.id, dynamicEvents.gaugeId))
    .where(and(eq(dynamicEvents.id, id), eq(dynamicEvents.structureId, structure.id)))
    .limit(1);
  if (!row) throw new AppError("not_found", `Structure "${structure.code}" has no event ${id}.`);
  return { structure, ...row };
}

/** The gauge's limit alerts that opened or peaked inside an event: the waveform links to what it raised. */
async function alertsDuring(event: Pick<DynamicEventRow, "gaugeId" | "start" | "end">): Promise<EventDetail["alerts"]> {
  // Alert instants are whole milliseconds; a sample's instant may not be.
  const inside = { from: new Date(Math.floor(event.start)), to: new Date(Math.ceil(event.end)) };
  const rows = await getDb()
    .select({ id: alerts.id, level: alerts.level, openedAt: alerts.openedAt })
    .from(alerts)
    .where(
      and(
        eq(alerts.gaugeId, event.gaugeId),
        eq(alerts.kind, "limit"),
        or(between(alerts.openedAt, inside.from, inside.to), between(alerts.peakAt, inside.from, inside.to)),
      ),
    )
    .orderBy(asc(alerts.openedAt), asc(alerts.id));
  return rows.map((row) => ({ ...row, openedAt: row.openedAt.toISOString() }));
}

/** One event with its waveform (MPa at `rateHz` from `start`) and the alerts it raised. */
export async function getEvent(actor: Actor, code: string, id: number): Promise<EventDetail> {
  const { event, tag } = await eventOf(actor, code, id);
  return {
    ...eventSummary(event, tag),
    rateHz: event.rateHz,
    unit: "MPa",
    stress: Array.from(readFloat32LE(event.waveform)),
    alerts: await alertsDuring(event),
  };
}

/**
 * Names what an event was. Judging what the data mean is the same responsibility as
 * acknowledging an alert, so it takes the same permission (engineers and admins); audited.
 */
export async function labelEvent(actor: Actor, code: string, id: number, label: string | null): Promise<EventDetail> {
  const { structure, event } = await eventOf(actor, code, id);
  await requirePermission(actor, "alert:acknowledge", structure);
  await writeTransaction(async (tx) => {
    await tx
      .update(dynamicEvents)
      .set({ label, labelledById: actor.kind === "user" ? actor.id : null, labelledAt: new Date() })
      .where(eq(dynamicEvents.id, event.id));
    await recordAudit(tx, {
      actor,
      action: "event.label",
      entityType: "event",
      entityKey: `${structure.code}/${event.id}`,
      structureId: structure.id,
      before: { label: event.label },
      after: { label },
    });
  });
  return getEvent(actor, code, id);
}

/** The captured event holding an instant of a gauge, if any. */
async function eventAt(gaugeId: number, time: number): Promise<number | null> {
  const [row] = await getDb()
    .select({ id: dynamicEvents.id })
    .from(dynamicEvents)
    .where(and(eq(dynamicEvents.gaugeId, gaugeId), lt(dynamicEvents.start, time + 1), gte(dynamicEvents.end, time)))
    .orderBy(desc(dynamicEvents.start))
    .limit(1);
  return row?.id ?? null;
}

/**
 * The waveforms behind an alert on a dynamic gauge: the event holding the sample that opened it
 * and, when the episode peaked in a later one, that event too. Empty for a static gauge or when
 * no waveform was captured (the trigger may sit beyond the limit).
 */
export async function alertWaveforms(actor: Actor, code: string, tag: string, instants: { openedAt: string; peakAt: string | null }): Promise<{ id: number; holds: "opening" | "peak" | "opening and peak" }[]> {
  const { gauge } = await resolveGauge(actor, code, tag, "structure:view");
  if (gauge.sampling.mode !== "dynamic") return [];
  const opening = await eventAt(gauge.id, Date.parse(instants.openedAt));
  const peak = instants.peakAt ? await eventAt(gauge.id, Date.parse(instants.peakAt)) : null;
  if (opening !== null && opening === peak) return [{ id: opening, holds: "opening and peak" }];
  return [
    ...(opening === null ? [] : [{ id: opening, holds: "opening" as const }]),
    ...(peak === null ? [] : [{ id: peak, holds: "peak" as const }]),
  ];
}
