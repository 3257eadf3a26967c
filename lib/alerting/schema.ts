import { z } from "zod";
import { LEVELS, QUANTITIES } from "@/lib/limits";
import { isoTime } from "@/lib/gauges/schema";

const finite = z.number({ error: "Enter a number." }).refine(Number.isFinite, "Enter a finite number.");

export const limitInput = z.object({
  quantity: z.enum(QUANTITIES, { error: `Choose the quantity: ${QUANTITIES.join(", ")}.` }),
  level: z.enum(LEVELS, { error: `Choose the level: ${LEVELS.join(", ")}.` }),
  upper: finite.optional().meta({ description: "MPa for stress, µε for strain, a fraction of yield for utilisation" }),
  lower: finite.optional(),
  hysteresis: finite.optional().meta({ description: "Dead band a value must come back inside the bound by to clear; same unit" }),
  persistence: z.number().int("A whole number of readings.").optional().meta({ description: "Consecutive readings needed to open or clear; default 1" }),
});

export const limitsBody = z.object({ limits: z.array(limitInput).max(30, "At most 30 limits per gauge.") });

export const acknowledgeBody = z.object({ comment: z.string().trim().min(1, "Say what was checked or done.").max(2000) });

const MAX_BACKTEST_MS = 366 * 86_400_000;

export const backtestBody = limitsBody
  .extend({ from: isoTime, to: isoTime })
  .refine((body) => Date.parse(body.from) < Date.parse(body.to), { path: ["to"], message: "`to` must be after `from`." })
  .refine((body) => Date.parse(body.to) - Date.parse(body.from) <= MAX_BACKTEST_MS, { path: ["from"], message: "Backtest at most a year at a time." });
