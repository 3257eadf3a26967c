import "server-only";
import { desc, eq } from "drizzle-orm";
import { getDb, writeTransaction } from "@/db/client";
import { shuntChecks, type ShuntCheck } from "@/db/schema";
import { actorLabel, type Actor } from "@/lib/auth/actor";
import { AppError } from "@/lib/errors";
import { gaugeConfigOf } from "@/lib/gauges/record";
import type { ShuntCheckInput } from "@/lib/gauges/schema";
import { FUTURE_TOLERANCE_MS } from "@/lib/ingest/batch";
import { expectedShuntOutput, shuntCheckVerdict } from "@/lib/mechanics/shunt-calibration";
import { recordAudit } from "./audit";
import { gaugeKey, refuseIfRetired, resolveGauge } from "./gauges";

/** A shunt check as the API and the gauge page show it. */
export type ShuntCheckView = {
  id: number;
  time: string;
  shuntResistance: number;
  measuredOutput: number;
  expectedOutput: number;
  unit: string;
  simulatedStrain: number;
  /** (measured − expected) ÷ expected, %. */
  differencePercent: number;
  tolerancePercent: number;
  passed: boolean;
  checkedBy: string;
  note: string | null;
};

function viewOf(row: ShuntCheck): ShuntCheckView {
  return {
    id: row.id,
    time: row.time.toISOString(),
    shuntResistance: row.shuntResistance,
    measuredOutput: row.measuredOutput,
    expectedOutput: row.expectedOutput,
    unit: row.unit,
    simulatedStrain: row.simulatedStrain,
    differencePercent: shuntCheckVerdict(row.measuredOutput, row.expectedOutput, row.tolerancePercent).deviationPercent,
    tolerancePercent: row.tolerancePercent,
    passed: row.passed,
    checkedBy: row.checkedByLabel,
    note: row.note,
  };
}

/**
 * Records a shunt check of a foil gauge's bridge: the expected output comes from the gauge's
 * configuration as it is now, and is stored with the check so a later edit of the gauge does not
 * rewrite what the check was judged against.
 */
export async function recordShuntCheck(actor: Actor, code: string, tag: string, input: ShuntCheckInput, now = Date.now()): Promise<ShuntCheckView> {
  const { structure, gauge } = await resolveGauge(actor, code, tag, "shunt-check:record");
  refuseIfRetired(gauge);
  const expectation = expectedShuntOutput(gaugeConfigOf(gauge), input.shuntResistance);
  if (!expectation.ok) {
    const path = expectation.code === "invalid-shunt" ? "shuntResistance" : "gauge";
    throw new AppError("validation_failed", expectation.message, { issues: [{ path, message: expectation.message }], reason: expectation.code });
  }
  const time = input.time ? new Date(input.time) : new Date(now);
  if (time.getTime() > now + FUTURE_TOLERANCE_MS) {
    throw new AppError("validation_failed", "The time of the check is in the future; give the time the shunt was applied.", {
      issues: [{ path: "time", message: "In the future." }],
    });
  }
  const { expectedReading, equivalentStrain } = expectation.value;
  const { passed } = shuntCheckVerdict(input.measuredOutput, expectedReading, input.tolerancePercent);
  const unit = gauge.input;
  const row = await writeTransaction(async (tx) => {
    const [inserted] = await tx
      .insert(shuntChecks)
      .values({
        gaugeId: gauge.id,
        time,
        shuntResistance: input.shuntResistance,
        measuredOutput: input.measuredOutput,
        expectedOutput: expectedReading,
        unit,
        simulatedStrain: equivalentStrain,
        tolerancePercent: input.tolerancePercent,
        passed,
        note: input.note ?? null,
        checkedById: actor.kind === "user" ? actor.id : null,
        checkedByLabel: actorLabel(actor),
      })
      .returning();
    await recordAudit(tx, {
      actor,
      action: "gauge.shunt-check",
      entityType: "gauge",
      entityKey: gaugeKey(structure, tag),
      structureId: structure.id,
      after: {
        shuntCheck: {
          unit,
          shuntResistance: input.shuntResistance,
          measuredOutput: input.measuredOutput,
          expectedOutput: expectedReading,
          tolerancePercent: input.tolerancePercent,
          result: passed ? "passed" : "failed",
        },
      },
    });
    return inserted!;
  });
  return viewOf(row);
}

/** A gauge's shunt checks, newest first. */
export async function listShuntChecks(actor: Actor, code: string, tag: string): Promise<ShuntCheckView[]> {
  const { gauge } = await resolveGauge(actor, code, tag, "structure:view");
  const rows = await getDb().select().from(shuntChecks).where(eq(shuntChecks.gaugeId, gauge.id)).orderBy(desc(shuntChecks.time), desc(shuntChecks.id));
  return rows.map(viewOf);
}
