import { z } from "zod";
import { LEVELS, QUANTITIES, ROSETTE_LIMIT_QUANTITIES } from "@/lib/limits";
import { isoTime } from "@/lib/gauges/schema";
import { plainText } from "@/lib/validation";

const finite = z.number({ error: "Enter a number." }).refine(Number.isFinite, "Enter a finite number.");

/** One body shape for a gauge's and a rosette's limits; only the quantity names and their units differ. */
function limitsBodyOf<Q extends readonly [string, ...string[]]>(quantities: Q, units: string, owner: string) {
  const limitInput = z.object({
    quantity: z.enum(quantities, { error: `Choose the quantity: ${quantities.join(", ")}.` }),
    level: z.enum(LEVELS, { error: `Choose the level: ${LEVELS.join(", ")}.` }),
    upper: finite.optional().meta({ description: units }),
    lower: finite.optional(),
    hysteresis: finite.optional().meta({ description: "Dead band a value must come back inside the bound by to clear; same unit" }),
    persistence: z.number().int("A whole number of readings.").optional().meta({ description: "Consecutive readings needed to open or clear; default 1" }),
  });
  return z.object({ limits: z.array(limitInput).max(30, `At most 30 limits per ${owner}.`) });
}

export const limitsBody = limitsBodyOf(QUANTITIES, "MPa for stress, µε for strain, a fraction of yield for utilisation", "gauge").meta({ id: "LimitsInput" });

export const rosetteLimitsBody = limitsBodyOf(ROSETTE_LIMIT_QUANTITIES, "MPa (sigma1, sigma2 and vonMises are all stresses)", "rosette").meta({
  id: "RosetteLimitsInput",
});

/** An alert's id in a path. */
export const alertIdParam = z.coerce.number({ error: "The alert id is a number." }).int().positive();

const comment = plainText().trim().min(1, "Say what was checked or done.").max(2000);

export const acknowledgeBody = z.object({ comment }).meta({ id: "AcknowledgeInput" });

/** How a jump is settled; the two values are lib/services/fault-resolution's FAULT_RESOLUTIONS. */
export const resolveFaultBody = z.object({
  resolution: z.enum(["accept-step", "new-zero"], { error: "Choose accept-step (the structure really moved) or new-zero (the gauge's reference moved)." }).meta({
    description: "accept-step: the quarantined readings are checked against the limits from the jump on; new-zero: the reading at the jump becomes the gauge's zero and the readings between stay set aside",
  }),
  comment,
}).meta({ id: "ResolveFaultInput" });

const MAX_BACKTEST_MS = 366 * 86_400_000;

/** The past period [from, to) a backtest checks proposed limits over, for a gauge or a rosette. */
function withPeriod<Body extends z.ZodType<{ from: string; to: string }>>(body: Body) {
  return body
    .refine((value) => Date.parse(value.from) < Date.parse(value.to), { path: ["to"], message: "`to` must be after `from`." })
    .refine((value) => Date.parse(value.to) - Date.parse(value.from) <= MAX_BACKTEST_MS, { path: ["from"], message: "Backtest at most a year at a time." });
}

const period = { from: isoTime, to: isoTime };

export const backtestBody = withPeriod(limitsBody.extend(period)).meta({ id: "BacktestInput" });

export const rosetteBacktestBody = withPeriod(rosetteLimitsBody.extend(period)).meta({ id: "RosetteBacktestInput" });
