import { z } from "zod";
import { optionalText } from "@/lib/validation";
import { alertCountsSchema, rejectionList } from "./readings-schemas";

/**
 * Request and response schemas of the bursts endpoints. Bursts inside the array are checked one
 * by one by the service (each refusal reported with its index), so the request schema only fixes
 * the envelope.
 */
export const ingestBurstsInput = z.object({
  bursts: z
    .array(
      z.unknown().meta({
        description:
          'A burst: { "gauge": tag, "start": ISO-8601 with Z or an offset (first sample), "rateHz": the gauge\'s rate, "temperature"?: °C for the whole burst, "values": [raw samples in the gauge\'s input unit] }',
        example: { gauge: "D1", start: "2026-03-01T12:00:00Z", rateHz: 100, temperature: 14.2, values: [412.5, 413.1, 415.0] },
      }),
      { error: 'Send "bursts" as an array of bursts.' },
    )
    .meta({ description: "At most 2 000 000 samples (and 16 MB) per request; more is a 413." }),
}).meta({ id: "BurstsInput" });

/** The binary body's burst fields, from the query string (text until the service checks them like JSON's). */
export const binaryBurstQuery = z.object({
  gauge: z.string({ error: "Name the gauge: ?gauge=<tag>." }).min(1, "Name the gauge: ?gauge=<tag>.").meta({ description: "Gauge tag" }),
  start: z.string({ error: "Give the first sample's time: ?start=<ISO-8601 with Z or an offset>." }).meta({ description: "First sample's time, ISO-8601 with Z or an offset" }),
  rateHz: z.coerce.number({ error: "Give ?rateHz=<the gauge's rate in Hz>." }).positive("rateHz is a positive rate in Hz.").meta({ description: "Samples per second: the gauge's rate" }),
  temperature: z
    .string()
    .optional()
    .transform((text, context) => {
      if (text === undefined || text.trim() === "") return null;
      const value = Number(text);
      if (Number.isFinite(value)) return value;
      context.addIssue({ code: "custom", message: "The temperature is a number in °C, or left out." });
      return z.NEVER;
    })
    .meta({ description: "°C for the whole burst, when the gauge's compensation needs it" }),
});

export const burstResultSchema = z
  .object({
    accepted: z.number().int().meta({ description: "Samples taken into summaries by this request" }),
    bursts: z.number().int().meta({ description: "Bursts stored by this request" }),
    duplicates: z.number().int().meta({ description: "Bursts whose (gauge, start) was already stored, or repeated in the request" }),
    rejected: rejectionList("Position in `bursts` (0 for a binary body)"),
    events: z.number().int().meta({ description: "Event waveforms captured and stored by this request" }),
    alerts: alertCountsSchema,
  })
  .meta({ id: "BurstResult" });

export const summariesSchema = z
  .object({
    unit: z.literal("MPa"),
    intervals: z.array(
      z.object({
        start: z.string(),
        end: z.string(),
        samples: z.number().int(),
        min: z.number(),
        max: z.number(),
        mean: z.number(),
        rms: z.number().meta({ description: "RMS about the interval's mean, MPa" }),
        maxRange: z.number().meta({ description: "Largest rainflow range closed in the interval (full or half cycle), MPa" }),
        cycles: z.number().meta({ description: "Rainflow cycles closed in the interval; two half cycles make one" }),
      }),
    ),
  })
  .meta({ id: "BurstSummaries" });

const eventFields = {
  id: z.number().int(),
  gauge: z.string(),
  start: z.string(),
  end: z.string(),
  peak: z.number().meta({ description: "Stress furthest beyond the trigger, MPa" }),
  peakAt: z.string(),
  trigger: z.enum(["above", "below"]),
  triggerLevel: z.number().meta({ description: "The level crossed, MPa" }),
  truncated: z.boolean().meta({ description: "True when the waveform reached the cap and its tail was cut" }),
  label: z.string().nullable(),
};

export const eventListSchema = z.object({ events: z.array(z.object(eventFields)) }).meta({ id: "EventList" });

export const eventDetailSchema = z
  .object({
    ...eventFields,
    rateHz: z.number(),
    unit: z.literal("MPa"),
    stress: z.array(z.number()).meta({ description: "Samples from preSeconds before the first beyond the trigger to postSeconds after the last, MPa" }),
    alerts: z
      .array(z.object({ id: z.number().int(), level: z.enum(["watch", "warning", "critical"]), openedAt: z.string() }))
      .meta({ description: "Limit alerts of the gauge that opened, or reached their peak, within the event's waveform, oldest first" }),
  })
  .meta({ id: "EventDetail" });

export const eventLabelInput = z.object({
  label: optionalText(100).meta({ description: 'What the event was, e.g. "heavy vehicle" or "false trigger"; null clears it' }),
}).meta({ id: "EventLabelInput" });
