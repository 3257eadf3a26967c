import { and, desc, eq, gte, isNull } from "drizzle-orm";
import { getDb } from "@/db/client";
import { alerts, readings, rollups, type Gauge, type Structure } from "@/db/schema";
import { DEFAULT_EXPECTED_INTERVAL_S, gaugeState, isStale, worstState, type GaugeState } from "@/lib/alerting/gauge-state";
import { ROLLUP_RESOLUTIONS } from "@/lib/series";
import { gaugeRowsOf, resolveGauge } from "./gauges";
import type { Actor } from "@/lib/auth/actor";

export type LatestReading = { time: number; strain: number; stress: number; temperature: number | null; utilisation: number | null; flags: number };

export type GaugeStatus = { tag: string; label: string | null; member: string | null; state: GaugeState; latest: LatestReading | null; openAlerts: number };

async function latestReading(gauge: Gauge): Promise<LatestReading | null> {
  const [row] = await getDb()
    .select({ time: readings.time, strain: readings.strain, stress: readings.stress, temperature: readings.temperature, flags: readings.flags })
    .from(readings)
    .where(eq(readings.gaugeId, gauge.id))
    .orderBy(desc(readings.time))
    .limit(1);
  if (!row) return null;
  const yieldStress = gauge.material.yield ?? null;
  return { ...row, utilisation: yieldStress ? Math.abs(row.stress) / yieldStress : null };
}

/** One gauge's latest reading, for pages about that gauge alone. */
export async function latestReadingOf(actor: Actor, code: string, tag: string): Promise<LatestReading | null> {
  const { gauge } = await resolveGauge(actor, code, tag, "structure:view");
  return latestReading(gauge);
}

async function openAlertLevels(structureId: number) {
  const rows = await getDb()
    .select({ gaugeId: alerts.gaugeId, level: alerts.level, kind: alerts.kind })
    .from(alerts)
    .where(and(eq(alerts.structureId, structureId), isNull(alerts.clearedAt)));
  const byGauge = new Map<number, string[]>();
  for (const row of rows) {
    // A sensor fault is not a structural level: it shows as the sensor's own alert, not as watch/warning.
    if (row.kind === "limit") byGauge.set(row.gaugeId, [...(byGauge.get(row.gaugeId) ?? []), row.level]);
  }
  return { byGauge, count: (gaugeId: number) => rows.filter((row) => row.gaugeId === gaugeId).length };
}

/** Every gauge of the structure with its latest reading and its state, now. */
export async function gaugeStatuses(structure: Structure, now = Date.now()): Promise<GaugeStatus[]> {
  return statusesOf(structure, await gaugeRowsOf(structure.id), now);
}

async function statusesOf(structure: Structure, gauges: Gauge[], now: number): Promise<GaugeStatus[]> {
  const open = await openAlertLevels(structure.id);
  return Promise.all(
    gauges.map(async (gauge) => {
      const latest = gauge.status === "retired" ? null : await latestReading(gauge);
      const state = gaugeState({
        retired: gauge.status === "retired",
        openLevels: open.byGauge.get(gauge.id) ?? [],
        lastReadingAt: latest?.time ?? null,
        expectedIntervalS: gauge.expectedInterval,
        now,
      });
      return { tag: gauge.tag, label: gauge.label, member: gauge.member, state, latest, openAlerts: open.count(gauge.id) };
    }),
  );
}

/** Highest |σ| / yield over the last day, from the hourly roll-ups (so a spike counts). */
async function peakUtilisation(gauges: Gauge[], since: number): Promise<number | null> {
  let peak: number | null = null;
  for (const gauge of gauges) {
    const yieldStress = gauge.material.yield;
    if (!yieldStress || gauge.status === "retired") continue;
    const rows = await getDb()
      .select({ max: rollups.stressMax, min: rollups.stressMin })
      .from(rollups)
      .where(and(eq(rollups.gaugeId, gauge.id), eq(rollups.resolution, ROLLUP_RESOLUTIONS.hourly), gte(rollups.bucket, since)));
    for (const row of rows) peak = Math.max(peak ?? 0, Math.abs(row.max) / yieldStress, Math.abs(row.min) / yieldStress);
  }
  return peak;
}

export type StructureSummary = {
  state: GaugeState;
  openAlerts: Record<"watch" | "warning" | "critical", number>;
  sensorAlerts: number;
  peakUtilisation24h: number | null;
  lastReadingAt: number | null;
  stale: boolean;
  gaugeCount: number;
};

export async function structureSummary(structure: Structure, now = Date.now()): Promise<StructureSummary> {
  const gauges = await gaugeRowsOf(structure.id);
  const statuses = await statusesOf(structure, gauges, now);
  const openRows = await getDb()
    .select({ level: alerts.level, kind: alerts.kind })
    .from(alerts)
    .where(and(eq(alerts.structureId, structure.id), isNull(alerts.clearedAt)));
  const lastReadingAt = statuses.reduce<number | null>((last, status) => Math.max(last ?? 0, status.latest?.time ?? 0) || last, null);
  const active = gauges.filter((gauge) => gauge.status === "active");
  return {
    state: worstState(statuses.map((status) => status.state)),
    openAlerts: {
      watch: openRows.filter((row) => row.kind === "limit" && row.level === "watch").length,
      warning: openRows.filter((row) => row.kind === "limit" && row.level === "warning").length,
      critical: openRows.filter((row) => row.kind === "limit" && row.level === "critical").length,
    },
    sensorAlerts: openRows.filter((row) => row.kind === "sensor").length,
    peakUtilisation24h: await peakUtilisation(gauges, now - 86_400_000),
    lastReadingAt,
    // The structure is stale when even its newest reading is: nothing at all is arriving.
    stale: active.length > 0 && isStale(lastReadingAt, Math.max(...active.map((g) => g.expectedInterval ?? DEFAULT_EXPECTED_INTERVAL_S)), now),
    gaugeCount: active.length,
  };
}
