import { z } from "zod";

/** Responses of /structures/{code}/gauges/{tag}/thermal-model. Strain µε, temperature °C, times UTC ISO-8601. */

const fitFields = {
  intercept: z.number().meta({ description: "a, µε: the model strain at 0 °C (and the drift origin)" }),
  slope: z.number().meta({ description: "b, µε/°C: stress-producing strain per degree of the lagged temperature" }),
  lagMinutes: z.number().int().meta({ description: "The lag used, minutes: the model reads the temperature that long before each reading" }),
  drift: z.number().optional().meta({ description: "c, µε/day from the start of the reference period; present only when drift was fitted" }),
  r2: z.number().meta({ description: "Coefficient of determination of the fit, 0–1" }),
  residualStd: z.number().meta({ description: "σ of the residual over the reference period, µε: √(SSres / (n − p))" }),
  readings: z.number().int().meta({ description: "Readings the fit used (healthy, with a known lagged temperature)" }),
  temperatureRange: z
    .object({ min: z.number(), max: z.number() })
    .meta({ description: "Lagged temperature range of the reference period, °C: the model is a statistical fit valid inside it" }),
};

export const thermalModelSchema = z
  .object({
    ...fitFields,
    from: z.string().meta({ description: "Start of the reference period" }),
    to: z.string().meta({ description: "End of the reference period (included)" }),
    lagSearch: z.enum(["fixed", "auto"]).meta({ description: "Whether the lag was given or searched for by best fit" }),
    maxLagMinutes: z.number().int().optional().meta({ description: "The search bound asked for with lagSearch auto" }),
    fittedBy: z.string().meta({ description: "Who saved the model" }),
    fittedAt: z.string(),
  })
  .meta({ id: "ThermalModel" });

export const thermalFitPreviewSchema = z
  .object({
    ...fitFields,
    scatter: z
      .array(z.object({ temperature: z.number().meta({ description: "Lagged temperature, °C" }), strain: z.number().meta({ description: "Stress-producing strain, µε" }) }))
      .meta({ description: "The fitted readings (at most 2 000, evenly thinned) for a scatter against the fitted line" }),
  })
  .meta({ id: "ThermalFitPreview" });

export type ThermalFitPreview = z.output<typeof thermalFitPreviewSchema>;
export type ThermalModelAnswer = z.output<typeof thermalModelSchema>;
