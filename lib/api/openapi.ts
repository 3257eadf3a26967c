import { z } from "zod";
import { createStructureInput } from "@/lib/validation";
import { errorSchema, structureDetailSchema, structureListSchema, structureSchema } from "./schemas";

type Operation = {
  summary: string;
  roles?: string;
  request?: z.ZodType;
  response: { status: number; schema: z.ZodType; description: string };
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
        content: { "application/json": { schema: jsonSchema(operation.response.schema, "output") } },
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
