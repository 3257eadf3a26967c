import { z } from "zod";
import { createStructureInput } from "@/lib/validation";
import { fatigueQuery } from "./fatigue-query";
import { errorSchema, gaugeFatigueSchema, structureDetailSchema, structureListSchema, structureSchema } from "./schemas";

type Operation = {
  summary: string;
  roles?: string;
  request?: z.ZodType;
  response: { status: number; schema: z.ZodType; description: string };
  /** Another representation of the same resource, chosen with Accept or a query parameter. */
  alternative?: { contentType: string; description: string };
  errors: number[];
  parameters?: { name: string; in: "path" | "query"; description: string }[];
};

const ERROR_MEANING: Record<number, string> = {
  400: "Malformed or invalid request",
  401: "No token, or an unknown or revoked one",
  403: "Authenticated, but the role may not do this",
  404: "Unknown, or not visible to the caller",
  409: "Conflict with what is stored",
  413: "Body over the limit",
  415: "Unsupported content type",
};

const codeParameter = { name: "code", in: "path" as const, description: "Structure code" };
const tagParameter = { name: "tag", in: "path" as const, description: "Gauge tag" };

/** Query parameters with the descriptions their schema carries. */
const queryParameters = (schema: z.ZodObject) =>
  Object.entries(schema.shape).map(([name, field]) => ({ name, in: "query" as const, description: String(z.globalRegistry.get(field as z.ZodType)?.description ?? "") }));

const OPERATIONS: Record<string, Record<string, Operation>> = {
  "/structures": {
    get: {
      summary: "Structures the caller can see",
      response: { status: 200, schema: structureListSchema, description: "The structures" },
      errors: [401],
    },
    post: {
      summary: "Create a structure",
      roles: "admin, engineer",
      request: createStructureInput,
      response: { status: 201, schema: structureSchema, description: "The new structure" },
      errors: [400, 401, 403, 409, 413, 415],
    },
  },
  "/structures/{code}": {
    get: {
      summary: "One structure with its gauges and count of open alerts",
      parameters: [codeParameter],
      response: { status: 200, schema: structureDetailSchema, description: "The structure" },
      errors: [401, 404],
    },
  },
  "/structures/{code}/gauges/{tag}/fatigue": {
    get: {
      summary:
        "Fatigue of a gauge over [from, to): rainflow counting (ASTM E1049) of the stored stress, S-N curve of the detail category " +
        "(EN 1993-1-9 shape), Palmgren–Miner damage, rate per year and implied life. Readings beyond the gauge's rated range are left out.",
      parameters: [codeParameter, tagParameter, ...queryParameters(fatigueQuery.in)],
      response: { status: 200, schema: gaugeFatigueSchema, description: "The fatigue figures of the period" },
      alternative: {
        contentType: "text/csv",
        description: "With format=csv or Accept: text/csv: the rainflow matrix, rows by range bin upper edge (MPa), columns by mean bin centre (MPa), cycles in the cells",
      },
      errors: [400, 401, 404],
    },
  },
};

const jsonSchema = (schema: z.ZodType, io: "input" | "output") =>
  z.toJSONSchema(schema, { target: "draft-2020-12", io, unrepresentable: "any" });

function describeOperation(operation: Operation) {
  const errorResponses = Object.fromEntries(
    operation.errors.map((status) => [
      String(status),
      { description: ERROR_MEANING[status], content: { "application/json": { schema: jsonSchema(errorSchema, "output") } } },
    ]),
  );
  return {
    summary: operation.summary,
    ...(operation.roles ? { description: `Roles: ${operation.roles}.` } : {}),
    ...(operation.parameters
      ? { parameters: operation.parameters.map((p) => ({ ...p, required: p.in === "path", schema: { type: "string" } })) }
      : {}),
    ...(operation.request
      ? { requestBody: { required: true, content: { "application/json": { schema: jsonSchema(operation.request, "input") } } } }
      : {}),
    responses: {
      [String(operation.response.status)]: {
        description: operation.response.description,
        content: {
          "application/json": { schema: jsonSchema(operation.response.schema, "output") },
          ...(operation.alternative ? { [operation.alternative.contentType]: { schema: { type: "string", description: operation.alternative.description } } } : {}),
        },
      },
      ...errorResponses,
    },
  };
}

/** The OpenAPI 3.1 document of /api/v1, generated from the schemas that validate requests. */
export function openApiDocument() {
  const paths = Object.fromEntries(
    Object.entries(OPERATIONS).map(([path, methods]) => [
      path,
      Object.fromEntries(Object.entries(methods).map(([method, op]) => [method, describeOperation(op)])),
    ]),
  );
  return {
    openapi: "3.1.0",
    info: {
      title: "Hookeline machine API",
      version: "1",
      description:
        "Strain-gauge monitoring. Units: strain µε, stress MPa, temperature °C, times UTC. " +
        "Authenticate with `Authorization: Bearer <token>`.",
    },
    servers: [{ url: "/api/v1" }],
    components: { securitySchemes: { bearer: { type: "http", scheme: "bearer" } } },
    security: [{ bearer: [] }],
    paths,
  };
}
