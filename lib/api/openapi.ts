import { z } from "zod";
import { createStructureInput } from "@/lib/validation";
import { REJECTION_CODES } from "@/lib/ingest/rejections";
import { ingestReadingsInput, ingestResultSchema, readingsPageSchema, seriesSchema } from "./readings-schemas";
import { errorSchema, structureDetailSchema, structureListSchema, structureSchema } from "./schemas";

type Operation = {
  summary: string;
  roles?: string;
  /** What an integrator needs beyond the schemas. */
  notes?: string;
  request?: z.ZodType;
  /** Describes a text/csv request body accepted beside (or instead of) JSON. */
  csvRequest?: string;
  /** Another representation of the response, by media type. */
  alternative?: { contentType: string; description: string };
  response: { status: number; schema: z.ZodType; description: string; contentType?: string };
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
const timezoneParameter = {
  name: "timezone",
  in: "query" as const,
  description: "CSV only: IANA time zone for times without an offset (default: the structure's time zone)",
};
const rangeParameters = [
  { name: "from", in: "query" as const, description: "ISO-8601 with Z or an offset; default 7 days before `to`" },
  { name: "to", in: "query" as const, description: "ISO-8601 with Z or an offset, exclusive; default now (or 7 days after `from`)" },
];

const CSV_BODY =
  "Header `gauge,time,value,temperature` (any order, case-insensitive; `temperature` may be left out; a UTF-8 byte-order mark is skipped; blank lines are ignored). " +
  "Separated by commas with decimals written with a point: a semicolon- or tab-separated file is refused with a 400 before any row is read, " +
  "a missing or unknown column with a 400 naming it, and a row with too many or too few fields (e.g. an unquoted decimal comma) is rejected on its own (`wrong-column-count`). " +
  "Times are ISO-8601 (`T` or a space between date and time); without an offset they are read in `?timezone=` or else the structure's time zone " +
  "(a time that happens twice when clocks go back is the earlier one; one skipped when they go forward is read with the offset before the change).";

const REJECTIONS =
  "Each reading is checked on its own; `rejected[].code` is one of: " +
  Object.entries(REJECTION_CODES)
    .map(([code, meaning]) => `\`${code}\` (${meaning})`)
    .join("; ") +
  ". Times are stored to the millisecond. A reading whose (gauge, time) is already stored, or that repeats an earlier reading of the same request, counts as a duplicate and is not stored again (the first one is kept).";

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
  "/structures/{code}/readings": {
    post: {
      summary: "Send readings (JSON or CSV)",
      roles: "admin, engineer, technician, or the structure's logger token",
      notes: `At most 50 000 readings and 10 MB per request (413 past that). All valid readings of a request are stored in one transaction, or none. ${REJECTIONS}`,
      parameters: [codeParameter, timezoneParameter],
      request: ingestReadingsInput,
      csvRequest: CSV_BODY,
      response: { status: 200, schema: ingestResultSchema, description: "What was stored, counted as duplicate and rejected" },
      errors: [400, 401, 403, 404, 413, 415],
    },
  },
  "/structures/{code}/uploads": {
    post: {
      summary: "Upload a logger file of any size (CSV, streamed)",
      roles: "admin, engineer, technician, or the structure's logger token",
      notes:
        `${CSV_BODY} The body is read as it arrives and stored in batches of 5 000 rows, each its own transaction, so a file of millions of rows is never held whole. ` +
        "The header is checked before anything is stored (400). The answer is newline-delimited JSON: " +
        '`{"type":"start","timezone"}`, then `{"type":"progress","bytes","rows","accepted","duplicates","rejected"}` after each batch, then ' +
        '`{"type":"done","rows","accepted","duplicates","rejected","rejections":[{"line","code","message"}],"rejectionsTruncated","alerts"}` ' +
        '(`line` counts the header as line 1; the first 10 000 rejected rows are listed), or `{"type":"error","error":{code,message}}` if the file cannot be read to its end: ' +
        "the batches reported before stay stored, and sending the file again is safe. " +
        REJECTIONS,
      parameters: [codeParameter, timezoneParameter],
      csvRequest: CSV_BODY,
      response: { status: 200, schema: z.string(), description: "Progress lines and the final report", contentType: "application/x-ndjson" },
      errors: [400, 401, 403, 404, 415],
    },
  },
  "/structures/{code}/gauges/{tag}/readings": {
    get: {
      summary: "Stored readings of a gauge with their derived values, oldest first",
      notes:
        "Pages of `limit` readings; pass `nextCursor` back as `cursor` for the next page (absent on the last). " +
        "With `Accept: text/csv` the whole range is streamed as CSV (`time,value,temperature,strain,stress,flags`, flags space-separated) and `limit` is ignored.",
      parameters: [
        codeParameter,
        tagParameter,
        ...rangeParameters,
        { name: "limit", in: "query", description: "Readings per page, 1–10 000 (default 1000)" },
        { name: "cursor", in: "query", description: "`nextCursor` of the previous page" },
      ],
      response: { status: 200, schema: readingsPageSchema, description: "A page of readings" },
      alternative: { contentType: "text/csv", description: "Every reading of the range as CSV (Accept: text/csv)" },
      errors: [400, 401, 404],
    },
  },
  "/structures/{code}/gauges/{tag}/series": {
    get: {
      summary: "A gauge's strain, stress or temperature in at most `points` buckets",
      notes:
        "Buckets have a round width (1 s … 1 week, then whole weeks) aligned to the Unix epoch, so the first and last may reach outside the range. " +
        "Each bucket's min and max are exact (a one-reading spike always shows); fine buckets come from the readings, buckets of whole hours or days from roll-ups. " +
        "Buckets without readings are left out, so gaps stay gaps.",
      parameters: [
        codeParameter,
        tagParameter,
        ...rangeParameters,
        { name: "points", in: "query", description: "Most buckets, 1–5000 (default 1000)" },
        { name: "quantity", in: "query", description: "strain (µε), stress (MPa) or temperature (°C); default strain" },
      ],
      response: { status: 200, schema: seriesSchema, description: "The buckets" },
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
  const description = [operation.roles ? `Roles: ${operation.roles}.` : "", operation.notes ?? ""].filter(Boolean).join("\n\n");
  const requestContent = {
    ...(operation.request ? { "application/json": { schema: jsonSchema(operation.request, "input") } } : {}),
    ...(operation.csvRequest ? { "text/csv": { schema: { type: "string", description: operation.csvRequest } } } : {}),
  };
  const { response } = operation;
  return {
    summary: operation.summary,
    ...(description ? { description } : {}),
    ...(operation.parameters
      ? { parameters: operation.parameters.map((p) => ({ ...p, required: p.in === "path", schema: { type: "string" } })) }
      : {}),
    ...(Object.keys(requestContent).length > 0 ? { requestBody: { required: true, content: requestContent } } : {}),
    responses: {
      [String(response.status)]: {
        description: response.description,
        content: {
          [response.contentType ?? "application/json"]: { schema: jsonSchema(response.schema, "output") },
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
