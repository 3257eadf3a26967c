import { z } from "zod";
import { LEVELS, QUANTITIES } from "@/lib/limits";

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
