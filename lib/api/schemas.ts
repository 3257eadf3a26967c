import { z } from "zod";
import { FILE_KINDS } from "@/db/schema";
import { IMAGE_TYPES, type ImageType } from "@/lib/storage/image-type";

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

export const fileSchema = z
  .object({
    id: z.number().int(),
    kind: z.enum(FILE_KINDS),
    title: z.string(),
    contentType: z.enum(Object.keys(IMAGE_TYPES) as [ImageType, ...ImageType[]]).meta({ description: "Detected from the content, not the name" }),
    bytes: z.number().int(),
    width: z.number().int().nullable().meta({ description: "Pixels" }),
    height: z.number().int().nullable().meta({ description: "Pixels" }),
    gauge: z.string().nullable().meta({ description: "Tag of the gauge a photo shows; null for drawings" }),
    url: z.string().meta({ description: "Where the bytes are served: /api/v1/files/{id}" }),
    createdAt: z.string().meta({ description: "UTC, ISO-8601 with milliseconds" }),
  })
  .meta({ id: "File" });

export const drawingListSchema = z.object({ drawings: z.array(fileSchema) });
export const photoListSchema = z.object({ photos: z.array(fileSchema) });

export const gaugeSchema = z.record(z.string(), z.unknown()).meta({ description: "The gauge, with `drawing: { id, x, y } | null`" });
