import { z } from "zod";

/** Response shapes of /api/v1, documented in the OpenAPI document. */

export const errorSchema = z
  .object({
    error: z.object({
      code: z.string().meta({ example: "validation_failed" }),
      message: z.string(),
      details: z.unknown().optional(),
    }),
  })
  .meta({ id: "Error" });

export const structureSchema = z
  .object({
    code: z.string(),
    name: z.string(),
    location: z.string().nullable(),
    timezone: z.string().meta({ description: "IANA time zone" }),
    description: z.string().nullable(),
    createdAt: z.string().meta({ description: "UTC, ISO-8601 with milliseconds" }),
  })
  .meta({ id: "Structure" });

export const structureListSchema = z.object({ structures: z.array(structureSchema) });

export const structureDetailSchema = structureSchema
  .extend({
    gauges: z.array(z.record(z.string(), z.unknown())).meta({ description: "The structure's gauges" }),
    openAlerts: z.number().int(),
  })
  .meta({ id: "StructureDetail" });
