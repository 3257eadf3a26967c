import { z } from "zod";
import { isDeepStrictEqual } from "node:util";
import { placementInput } from "@/lib/files/schema";
import type { FileKind } from "@/db/schema";
import { IMAGE_TYPES } from "@/lib/storage/image-type";
import { uploadRule } from "@/lib/storage/upload-rules";
import { createStructureInput } from "@/lib/validation";
import {
  drawingListSchema,
  errorSchema,
  fileSchema,
  alertListSchema,
  alertSchema,
  backtestSchema,
  gaugeFatigueSchema,
  gaugeListSchema,
  gaugeSchema,
  limitListSchema,
  rosetteLimitListSchema,
  rosetteListSchema,
  rosetteSchema,
  photoListSchema,
  shuntCheckListSchema,
  shuntCheckSchema,
  structureDetailSchema,
  structureListSchema,
  structureSchema,
} from "./schemas";
import { fatigueQuery } from "./fatigue-query";
import { REJECTION_CODES } from "@/lib/ingest/rejections";
import { ingestReadingsInput, ingestResultSchema, readingsPageSchema, seriesSchema } from "./readings-schemas";
import { binaryBurstQuery, burstResultSchema, eventDetailSchema, eventLabelInput, eventListSchema, ingestBurstsInput, summariesSchema } from "./burst-schemas";
import { BURST_REJECTION_CODES } from "@/lib/ingest/burst-input";
import { reportQuery } from "./report-query";
import { alertListQuery } from "./alert-query";
import { structureReportSchema } from "./report-schema";
import { loadTestListSchema, loadTestResultsSchema } from "./load-test-schemas";
import { certificateListSchema, certificateSchema, siteVisitPageSchema, siteVisitSchema } from "./field-record-schemas";
import { MAX_VISIT_PHOTOS, siteVisitInput, siteVisitQuery } from "@/lib/field-records/site-visits";
import { PDF_TYPE } from "@/lib/storage/pdf-type";
import { loadTestInput } from "@/lib/load-tests";
import { gaugeInput, gaugePatch, rosetteInput, shuntCheckInput, zeroRequest } from "@/lib/gauges/schema";
import { thermalFitPreviewSchema, thermalModelSchema } from "./thermal-schemas";
import { thermalModelInput } from "@/lib/thermal/schema";
import { acknowledgeBody, backtestBody, limitsBody, resolveFaultBody, rosetteBacktestBody, rosetteLimitsBody } from "@/lib/alerting/schema";

/** Form fields of a multipart/form-data upload, described by hand (zod does not model files). */
type MultipartRequest = { fields: Record<string, { description: string; binary?: boolean }>; required: string[] };

type Operation = {
  summary: string;
  roles?: string;
  request?: z.ZodType;
  multipart?: MultipartRequest;
  /** Longer explanation shown under the summary. */
  notes?: string;
  /** Describes a text/csv request body accepted beside (or instead of) JSON. */
  csvRequest?: string;
  /** `schema` (JSON) must carry `.meta({ id })`: it is written once under components.schemas and referenced. */
  response: { status: number; description: string; schema?: z.ZodType; text?: { contentType: string }; binary?: string[] };
  /** Describes an application/octet-stream request body accepted beside JSON. */
  binaryRequest?: string;
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
const loadTestParameter = { name: "id", in: "path" as const, description: "Load test id" };
const rosetteTagParameter = { name: "tag", in: "path" as const, description: "Rosette tag" };

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

/** Query parameters with the descriptions their schema carries. */
const queryParameters = (schema: z.ZodObject) =>
  Object.entries(schema.shape).map(([name, field]) => ({ name, in: "query" as const, description: String(z.globalRegistry.get(field as z.ZodType)?.description ?? "") }));

const imageUpload = (kind: FileKind, title: { description: string; required: boolean }): MultipartRequest => ({
  fields: {
    file: { description: `${uploadRule(kind)} The type is read from the content, not the name.`, binary: true },
    title: { description: title.description },
  },
  required: title.required ? ["file", "title"] : ["file"],
});

const certificateUpload: MultipartRequest = {
  fields: {
    file: { description: `The certificate: ${uploadRule("certificate")} The type is read from the content, not the name; a PDF must be whole (end with %%EOF).`, binary: true },
    gauge: { description: "Tag of the structure's gauge the certificate is for; give this or `logger`" },
    logger: { description: "Name of the logger the certificate is for (its token's name or serial number); give this or `gauge`" },
    number: { description: "Certificate number as printed" },
    issuedBy: { description: "The calibration laboratory" },
    issuedOn: { description: "YYYY-MM-DD" },
    expiresOn: { description: "YYYY-MM-DD, after issuedOn: the last day the certificate is valid, on the structure's clock" },
  },
  required: ["file", "number", "issuedBy", "issuedOn", "expiresOn"],
};
const siteVisitUpload: MultipartRequest = {
  fields: {
    visitedAt: { description: "When the visit began, ISO-8601 with Z or an offset; not in the future" },
    visitor: { description: "Who went; default the sender" },
    work: { description: "What was done" },
    gauges: { description: "A gauge tag the visit touched; repeat the field for each" },
    photos: { description: `A photo taken on the visit: ${uploadRule("visit-photo")} Repeat the field for each, at most ${MAX_VISIT_PHOTOS}.`, binary: true },
  },
  required: ["visitedAt", "work"],
};
const certificateParameter = { name: "id", in: "path" as const, description: "Certificate id" };

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
      summary: "One structure with its gauges, each with its condition now (`condition: { state, since, faults, stale }`), and its count of open alerts",
      parameters: [codeParameter],
      response: { status: 200, schema: structureDetailSchema, description: "The structure" },
      errors: [401, 404],
    },
  },
  "/structures/{code}/gauges": {
    get: {
      summary: "Gauges of a structure, retired ones included",
      parameters: [codeParameter],
      response: { status: 200, schema: gaugeListSchema, description: "The gauges" },
      errors: [401, 404],
    },
    post: {
      summary: "Register a gauge (tags are unique per structure)",
      roles: "admin, engineer, technician",
      parameters: [codeParameter],
      request: gaugeInput,
      response: { status: 201, schema: gaugeSchema, description: "The new gauge" },
      errors: [400, 401, 403, 404, 409, 413, 415],
    },
  },
  "/structures/{code}/gauges/{tag}": {
    get: {
      summary: "One gauge",
      parameters: [codeParameter, tagParameter],
      response: { status: 200, schema: gaugeSchema, description: "The gauge" },
      errors: [401, 404],
    },
    patch: {
      summary: "Change fields of a gauge (the whole gauge is checked again); stored readings keep their derived values",
      roles: "admin, engineer, technician",
      parameters: [codeParameter, tagParameter],
      request: gaugePatch,
      response: { status: 200, schema: gaugeSchema, description: "The gauge" },
      errors: [400, 401, 403, 404, 409, 413, 415],
    },
    delete: {
      summary: "Retire the gauge: it accepts no more readings; its history is kept",
      roles: "admin, engineer, technician",
      parameters: [codeParameter, tagParameter],
      response: { status: 200, schema: gaugeSchema, description: "The retired gauge" },
      errors: [401, 403, 404],
    },
  },
  "/structures/{code}/gauges/{tag}/zero": {
    post: {
      summary: "Set a new zero (reference) reading, typed or the average of the last N raw readings; the previous one stays in the history",
      roles: "admin, engineer, technician",
      parameters: [codeParameter, tagParameter],
      request: zeroRequest,
      response: { status: 200, schema: gaugeSchema, description: "The gauge with its new zero" },
      errors: [400, 401, 403, 404, 409, 413, 415],
    },
  },
  "/structures/{code}/gauges/{tag}/shunt-checks": {
    get: {
      summary: "The gauge's shunt-calibration checks, newest first",
      parameters: [codeParameter, tagParameter],
      response: { status: 200, schema: shuntCheckListSchema, description: "The checks" },
      errors: [401, 404],
    },
    post: {
      summary:
        "Record a shunt-calibration check: the resistor placed across the gauge and the output change the logger showed; the expected output is computed from the gauge's bridge and judged against the tolerance. Refused (400) for a gauge that is not a foil bridge or has no gauge resistance recorded; nothing is stored then",
      roles: "admin, engineer, technician",
      parameters: [codeParameter, tagParameter],
      request: shuntCheckInput,
      response: { status: 201, schema: shuntCheckSchema, description: "The check with its expected output and verdict" },
      errors: [400, 401, 403, 404, 409, 413, 415],
    },
  },
  "/structures/{code}/gauges/{tag}/limits": {
    get: {
      summary: "The gauge's limits",
      parameters: [codeParameter, tagParameter],
      response: { status: 200, schema: limitListSchema, description: "The limits, with defaults applied" },
      errors: [401, 404],
    },
    put: {
      summary: "Replace the gauge's limits. Refused: lower ≥ upper, negative dead band or persistence, levels out of order",
      roles: "admin, engineer",
      parameters: [codeParameter, tagParameter],
      request: limitsBody,
      response: { status: 200, schema: limitListSchema, description: "The limits now in force" },
      errors: [400, 401, 403, 404, 413, 415],
    },
  },
  "/structures/{code}/gauges/{tag}/limits/backtest": {
    post: {
      summary: "What proposed limits would have raised over [from, to) of stored readings, by the same evaluation as ingestion; nothing is stored",
      parameters: [codeParameter, tagParameter],
      request: backtestBody,
      response: { status: 200, schema: backtestSchema, description: "The alert episodes the limits would have raised" },
      errors: [400, 401, 404, 413, 415],
    },
  },
  "/structures/{code}/gauges/{tag}/thermal-model": {
    get: {
      summary: "The gauge's thermal model in force",
      parameters: [codeParameter, tagParameter],
      response: { status: 200, schema: thermalModelSchema, description: "The model; 404 when the gauge has none" },
      errors: [401, 404],
    },
    put: {
      summary:
        "Fit stress-producing strain = a + b·T(t − lag) (+ c·days with drift) by ordinary least squares over the reference period's healthy readings, and store it as the gauge's model",
      notes:
        "Replaces the model in force (the audit trail keeps the old one). The residual, measured − model in µε, is then stored for every reading: recomputed at once for the readings already stored (before the period too), and computed on ingest for new ones; " +
        "read it as `quantity=residual` in the series, and bound it with `residual` limits. Open residual alerts close, since they were measured against the old model. " +
        'Refused (400, saying what is needed): fewer than 24 readings with a temperature in the period, less than 3 °C of temperature range, a fixed lag or an "auto" search bound longer than the period. ' +
        "A thermal model is a statistical fit, valid inside the reference period's temperature range; what its residual means is for engineering judgement.",
      roles: "admin, engineer",
      parameters: [codeParameter, tagParameter],
      request: thermalModelInput,
      response: { status: 200, schema: thermalModelSchema, description: "The model now in force" },
      errors: [400, 401, 403, 404, 413, 415],
    },
    delete: {
      summary: "Remove the thermal model; stored residuals go back to null. Refused (409) while residual limits stand",
      roles: "admin, engineer",
      parameters: [codeParameter, tagParameter],
      response: { status: 204, description: "Removed" },
      errors: [401, 403, 404, 409],
    },
  },
  "/structures/{code}/gauges/{tag}/thermal-model/fit": {
    post: {
      summary: "The same fit as PUT, with its scatter of strain against lagged temperature, without storing anything: a preview before saving",
      parameters: [codeParameter, tagParameter],
      request: thermalModelInput,
      response: { status: 200, schema: thermalFitPreviewSchema, description: "The fitted coefficients and the points fitted" },
      errors: [400, 401, 404, 413, 415],
    },
  },
  "/structures/{code}/rosettes": {
    get: {
      summary: "Rosettes of a structure",
      parameters: [codeParameter],
      response: { status: 200, schema: rosetteListSchema, description: "The rosettes" },
      errors: [401, 404],
    },
    post: {
      summary: "Group three gauges of the structure as a rosette (gauges a, b, c at 0°, 45°/60°, 90°/120°; material from gauge a)",
      roles: "admin, engineer, technician",
      parameters: [codeParameter],
      request: rosetteInput,
      response: { status: 201, schema: rosetteSchema, description: "The rosette" },
      errors: [400, 401, 403, 404, 409, 413, 415],
    },
  },
  "/structures/{code}/rosettes/{tag}/limits": {
    get: {
      summary: "The rosette's limits on sigma1, sigma2 and vonMises (MPa)",
      parameters: [codeParameter, rosetteTagParameter],
      response: { status: 200, schema: rosetteLimitListSchema, description: "The limits, with defaults applied" },
      errors: [401, 404],
    },
    put: {
      summary: "Replace the rosette's limits. Refused as for a gauge's; evaluated on ingest from readings of the three gauges with the same timestamp",
      notes:
        "A reading completing an instant older than the rosette's last evaluated one is evaluated by replaying from an hourly checkpoint, as for a gauge's limits (kept three days); an instant using a reading sensor health or the rated range marks as a fault is skipped.",
      roles: "admin, engineer",
      parameters: [codeParameter, rosetteTagParameter],
      request: rosetteLimitsBody,
      response: { status: 200, schema: rosetteLimitListSchema, description: "The limits now in force" },
      errors: [400, 401, 403, 404, 413, 415],
    },
  },
  "/structures/{code}/rosettes/{tag}/limits/backtest": {
    post: {
      summary:
        "What proposed rosette limits would have raised over [from, to) of stored readings, by the same evaluation as ingestion (faulty gauge readings skipped); nothing is stored",
      notes: "`readingsChecked` counts the instants at which all three gauges have a reading.",
      parameters: [codeParameter, rosetteTagParameter],
      request: rosetteBacktestBody,
      response: { status: 200, schema: backtestSchema, description: "The alert episodes the limits would have raised" },
      errors: [400, 401, 404, 413, 415],
    },
  },
  "/structures/{code}/rosettes/{tag}/series": {
    get: {
      summary: "A rosette's sigma1, sigma2, vonMises, tauMax (MPa) or theta (degrees) in at most `points` buckets",
      notes: "Computed from readings of the three gauges with the same timestamp (plane stress, material of gauge a); buckets as for a gauge's series.",
      parameters: [
        codeParameter,
        rosetteTagParameter,
        ...rangeParameters,
        { name: "points", in: "query", description: "Most buckets, 1–5000 (default 1000)" },
        { name: "quantity", in: "query", description: "sigma1 | sigma2 | vonMises | tauMax | theta; default vonMises" },
      ],
      response: { status: 200, schema: seriesSchema, description: "The buckets" },
      errors: [400, 401, 404],
    },
  },
  "/structures/{code}/alerts": {
    get: {
      summary: "Alerts of a structure, newest first, filtered and paged: `total` counts every match, `nextCursor` fetches the next page",
      parameters: [codeParameter, ...queryParameters(alertListQuery)],
      response: { status: 200, schema: alertListSchema, description: "The alerts" },
      errors: [400, 401, 404],
    },
  },
  "/alerts/{id}/acknowledge": {
    post: {
      summary: "Acknowledge an alert with a comment",
      roles: "admin, engineer",
      parameters: [{ name: "id", in: "path", description: "Alert id" }],
      request: acknowledgeBody,
      response: { status: 200, schema: alertSchema, description: "The alert" },
      errors: [400, 401, 403, 404, 413, 415],
    },
  },
  "/alerts/{id}/resolve": {
    post: {
      summary: "Resolve a jump (a sensor alert with code jump): accept the step as real, or record a new zero",
      roles: "admin, engineer",
      notes:
        "After a jump the gauge's readings are kept out of limit evaluation (readings.fault marks them after-jump) until this is done. " +
        "accept-step evaluates them against the limits from the jump on, raising any alerts they would have raised; new-zero records the reading at the jump as the gauge's zero " +
        "(as POST /gauges/{tag}/zero does) and leaves the readings between set aside. Either clears the alert. A jump cannot be cleared by hand.",
      parameters: [{ name: "id", in: "path", description: "Alert id" }],
      request: resolveFaultBody,
      response: { status: 200, schema: alertSchema, description: "The alert, cleared" },
      errors: [400, 401, 403, 404, 409, 413, 415],
    },
  },
  "/structures/{code}/drawings": {
    get: {
      summary: "Drawings (elevations, plans) of a structure",
      parameters: [codeParameter],
      response: { status: 200, schema: drawingListSchema, description: "The drawings, oldest first" },
      errors: [401, 404],
    },
    post: {
      summary: "Upload a drawing",
      roles: "admin, engineer, technician",
      parameters: [codeParameter],
      multipart: imageUpload("drawing", { description: "What the drawing shows, e.g. North elevation", required: true }),
      response: { status: 201, schema: fileSchema, description: "The stored drawing" },
      errors: [400, 401, 403, 404, 413, 415],
    },
  },
  "/structures/{code}/gauges/{tag}/photos": {
    get: {
      summary: "Installation photos of a gauge",
      parameters: [codeParameter, tagParameter],
      response: { status: 200, schema: photoListSchema, description: "The photos, oldest first" },
      errors: [401, 404],
    },
    post: {
      summary: "Upload an installation photo of a gauge",
      roles: "admin, engineer, technician",
      parameters: [codeParameter, tagParameter],
      multipart: imageUpload("photo", { description: "Caption; defaults to \"Installation photo of {tag}\"", required: false }),
      response: { status: 201, schema: fileSchema, description: "The stored photo" },
      errors: [400, 401, 403, 404, 413, 415],
    },
  },
  "/structures/{code}/gauges/{tag}/placement": {
    put: {
      summary: "Place a gauge on a drawing of its structure (x, y: fractions of width and height from the top left), or take it off",
      roles: "admin, engineer, technician",
      parameters: [codeParameter, tagParameter],
      request: placementInput,
      response: { status: 200, schema: gaugeSchema, description: "The gauge" },
      errors: [400, 401, 403, 404, 413, 415],
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
        description:
          "With format=csv or Accept: text/csv: the rainflow matrix, rows by range bin upper edge (MPa), columns by mean bin centre (MPa; a cycle's mean is that of its two extremes), " +
          "cycles in the cells. A dynamic gauge's mean bins are its range bin width; cycles of intervals stored before means were kept are in a last column, \"mean not recorded\"",
      },
      errors: [400, 401, 404],
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
  "/structures/{code}/bursts": {
    post: {
      summary: "Send bursts of a dynamic gauge (JSON, or one burst as 32-bit little-endian floats)",
      roles: "admin, engineer, technician, or the structure's logger token",
      notes:
        "At most 2 000 000 samples and 16 MB per request (413 past that). All valid bursts of a request are stored in one transaction, or none. " +
        "Samples are converted like readings (one temperature per burst) and kept only as summaries per interval of the gauge's `summaryMinutes` (aligned to the hour), " +
        "rainflow histograms and captured event waveforms. Rainflow carries its residue from one burst to the next of the gauge; a burst older than the newest one stored " +
        "is counted on its own, its open half cycles closed at its end. A burst whose (gauge, start) is stored, or repeated in the request, is a duplicate; one that overlaps " +
        "another without the same start is rejected (`overlap`). A burst with any non-finite sample (NaN, Infinity, null, text) is refused whole (`not-finite`), in JSON and binary alike. " +
        "Limits apply to each burst's lowest and highest sample and its last one, as readings at their own instants; those three are stored as readings. " +
        "Each burst is checked on its own; `rejected[].code` is one of: " +
        Object.entries(BURST_REJECTION_CODES)
          .map(([code, meaning]) => `\`${code}\` (${meaning})`)
          .join("; ") +
        ". A binary body that is not a whole number of 4-byte floats, or a missing query parameter, is a 400.",
      parameters: [
        codeParameter,
        ...queryParameters(binaryBurstQuery).map((p) => ({ ...p, description: `Binary body only: ${p.description}` })),
      ],
      request: ingestBurstsInput,
      binaryRequest: "The burst's raw samples as 32-bit little-endian IEEE 754 floats, in the gauge's input unit; gauge, start, rateHz and temperature in the query.",
      response: { status: 200, schema: burstResultSchema, description: "What was stored, counted as duplicate and rejected" },
      errors: [400, 401, 403, 404, 413, 415],
    },
  },
  "/structures/{code}/gauges/{tag}/summaries": {
    get: {
      summary: "A dynamic gauge's interval summaries starting in [from, to), oldest first (stress in MPa)",
      notes: "At most 5 000 intervals per request; ask for a shorter range for more.",
      parameters: [codeParameter, tagParameter, ...rangeParameters],
      response: { status: 200, schema: summariesSchema, description: "The intervals" },
      errors: [400, 401, 404],
    },
  },
  "/structures/{code}/gauges/{tag}/events": {
    get: {
      summary: "A dynamic gauge's captured events starting in [from, to), newest first, without their waveforms",
      notes: "At most 1 000 events per request.",
      parameters: [codeParameter, tagParameter, ...rangeParameters],
      response: { status: 200, schema: eventListSchema, description: "The events" },
      errors: [400, 401, 404],
    },
  },
  "/structures/{code}/events/{id}": {
    get: {
      summary: "One captured event with its waveform: stress in MPa at `rateHz` from `start`",
      parameters: [codeParameter, { name: "id", in: "path", description: "Event id" }],
      response: { status: 200, schema: eventDetailSchema, description: "The event" },
      errors: [400, 401, 404],
    },
    patch: {
      summary: "Label an event (what it was); null clears the label. Audited",
      roles: "admin, engineer",
      parameters: [codeParameter, { name: "id", in: "path", description: "Event id" }],
      request: eventLabelInput,
      response: { status: 200, schema: eventDetailSchema, description: "The event" },
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
        '`{"type":"done","rows","accepted","duplicates","rejected","gauges":[{"gauge","readings","from","to"}],"rejections":[{"line","code","message"}],"rejectionsTruncated","alerts"}` (gauges: readings stored per gauge and the UTC times they span) ' +
        '(`line` counts the header as line 1; the first 10 000 rejected rows are listed), or `{"type":"error","error":{code,message}}` if the file cannot be read to its end: ' +
        "the batches reported before stay stored, and sending the file again is safe. " +
        REJECTIONS,
      parameters: [codeParameter, timezoneParameter],
      csvRequest: CSV_BODY,
      response: { status: 200, description: "Progress lines and the final report", text: { contentType: "application/x-ndjson" } },
      errors: [400, 401, 403, 404, 415],
    },
  },
  "/structures/{code}/gauges/{tag}/readings": {
    get: {
      summary: "Stored readings of a gauge with their derived values, oldest first",
      notes:
        "Pages of `limit` readings; pass `nextCursor` back as `cursor` for the next page (absent on the last). " +
        "With `Accept: text/csv` the whole range is streamed as CSV (`time,value,temperature,strain,stress,flags`, flags space-separated) and `limit` is ignored. " +
        "Raw value and temperature are written as received; strain and stress to the resolution of the gauge's readings (one step of the finest raw decimal, through the gauge's conversion). " +
        "`header=units` names the same columns with their units (`time (UTC)`, `value (<input unit>)`, `temperature (°C)`, `strain (µε)`, `stress (MPa)`, `flags`) after a UTF-8 byte-order mark, for spreadsheets.",
      parameters: [
        codeParameter,
        tagParameter,
        ...rangeParameters,
        { name: "limit", in: "query", description: "Readings per page, 1–10 000 (default 1000)" },
        { name: "cursor", in: "query", description: "`nextCursor` of the previous page" },
        { name: "header", in: "query", description: "CSV only: `names` (default) or `units`" },
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
  "/structures/{code}/report": {
    get: {
      summary:
        "The structure's report for a period of whole days in the structure's time zone: status over the period and now, per gauge the stress and strain extremes, " +
        "utilisation peak, data completeness and gaps, fatigue damage; the alerts open in the period and how they were handled; the cautions",
      parameters: [codeParameter, ...queryParameters(reportQuery.in)],
      response: { status: 200, schema: structureReportSchema, description: "The report" },
      alternative: {
        contentType: "application/pdf",
        description: 'With format=pdf or Accept: application/pdf: the report as an A4 PDF in SI units, as an attachment named "<code>-report-<period>.pdf"',
      },
      errors: [400, 401, 404],
    },
  },
  "/structures/{code}/load-tests": {
    get: {
      summary: "The structure's diagnostic load tests, newest window first",
      parameters: [codeParameter],
      response: { status: 200, schema: loadTestListSchema, description: "The load tests" },
      errors: [401, 404],
    },
    post: {
      summary: "Record a load test: its window, the load, and the predicted peak strain per gauge (as a list or as CSV text). Audited",
      roles: "admin, engineer",
      parameters: [codeParameter],
      notes:
        "Every gauge named must be the structure's: unknown tags are all named in one 400 (`details.unknownGauges`) and nothing is stored. " +
        "A window holding no data is stored all the same (a logger file often arrives after the test): the answer's `dataState` is `none` and each gauge says `no-data` until readings arrive. " +
        "Results are worked out when read. Per gauge, the baseline is the last believed reading before the window start (for a dynamic gauge: the mean of the last summary interval ended by then); " +
        "the measured peak is the largest change from it in the sign of the prediction (tension positive), and the ratio is measured ÷ predicted. " +
        "Readings with a sensor-health verdict or beyond the gauge's rated range are left out.",
      request: loadTestInput,
      response: { status: 201, schema: loadTestResultsSchema, description: "The test with its results as they stand" },
      errors: [400, 401, 403, 404, 413, 415],
    },
  },
  "/structures/{code}/load-tests/{id}": {
    get: {
      summary: "One load test with its results per gauge: baseline, measured peak, predicted, ratio",
      parameters: [codeParameter, loadTestParameter],
      response: { status: 200, schema: loadTestResultsSchema, description: "The test and its results" },
      errors: [400, 401, 404],
    },
  },
  "/structures/{code}/load-tests/{id}/results.csv": {
    get: {
      summary: "The results table as CSV, units in the header (strain to 0.1 µε, ratios to 0.01; empty cells where nothing was measured)",
      parameters: [codeParameter, loadTestParameter],
      response: { status: 200, description: "The results as text/csv", text: { contentType: "text/csv" } },
      errors: [400, 401, 404],
    },
  },
  "/structures/{code}/certificates": {
    get: {
      summary: "Calibration certificates of the structure's gauges and loggers, soonest expiry first, each with where it stands today on the structure's clock",
      parameters: [codeParameter],
      response: { status: 200, schema: certificateListSchema, description: "The certificates" },
      errors: [401, 404],
    },
    post: {
      summary: "Record a calibration certificate of a gauge or a logger, with its file. Audited",
      roles: "admin, engineer, technician",
      parameters: [codeParameter],
      notes:
        "The expiry must fall after the issue date; an unknown gauge tag is a 400 naming it; a file that is not a whole PDF or a PNG, JPEG or WebP image is refused (415, or 400 for a damaged one). " +
        "Nothing is stored unless all of it is. Reminders: once a day, each certificate that has come within a threshold of its expiry (CERTIFICATE_REMINDER_DAYS, default 30 days) is e-mailed once per threshold to the structure's technicians and engineers, " +
        "unless a later certificate of the same instrument expires after it.",
      multipart: certificateUpload,
      response: { status: 201, schema: certificateSchema, description: "The stored certificate" },
      errors: [400, 401, 403, 404, 413, 415],
    },
  },
  "/structures/{code}/certificates/{id}/file": {
    get: {
      summary: "The certificate's file as the type detected at upload (a PDF as an attachment)",
      parameters: [codeParameter, certificateParameter],
      response: { status: 200, description: "The file", binary: [PDF_TYPE, ...Object.keys(IMAGE_TYPES)] },
      errors: [400, 401, 404],
    },
  },
  "/structures/{code}/site-visits": {
    get: {
      summary: "The structure's site visits, newest first, a page at a time; `?gauge=` keeps those naming one gauge",
      parameters: [codeParameter, ...queryParameters(siteVisitQuery)],
      response: { status: 200, schema: siteVisitPageSchema, description: "A page of visits" },
      errors: [400, 401, 404],
    },
    post: {
      summary: "Record a site visit: when, who, what was done, the gauges it touched and its photos. Audited",
      roles: "admin, engineer, technician",
      parameters: [codeParameter],
      notes:
        "Send JSON (no photos) or multipart/form-data with the photos. Every gauge named must be the structure's (unknown tags are all named in one 400, `details.unknownGauges`); " +
        "every photo must be a PNG, JPEG or WebP image (415 otherwise). Nothing is stored unless all of it is.",
      request: siteVisitInput,
      multipart: siteVisitUpload,
      response: { status: 201, schema: siteVisitSchema, description: "The stored visit" },
      errors: [400, 401, 403, 404, 413, 415],
    },
  },
  "/files/{id}": {
    get: {
      summary: "The bytes of a photo or drawing, as the type detected at upload (X-Content-Type-Options: nosniff)",
      parameters: [{ name: "id", in: "path", description: "File id" }],
      response: { status: 200, description: "The image", binary: Object.keys(IMAGE_TYPES) },
      errors: [400, 401, 404],
    },
    delete: {
      summary: "Delete a photo or drawing; gauges placed on a deleted drawing come off it",
      roles: "admin, engineer, technician",
      parameters: [{ name: "id", in: "path", description: "File id" }],
      response: { status: 204, description: "Deleted" },
      errors: [400, 401, 403, 404],
    },
  },
};

function multipartSchema(request: MultipartRequest) {
  const properties = Object.fromEntries(
    Object.entries(request.fields).map(([name, field]) => [
      name,
      field.binary ? { type: "string", format: "binary", description: field.description } : { type: "string", description: field.description },
    ]),
  );
  return { type: "object", properties, required: request.required };
}

type Direction = "input" | "output";

/**
 * The named schemas the paths use, each written once: a request body as the client sends it
 * (defaults optional), a response as the server answers it. Every path refers to them by `$ref`.
 */
class Components {
  readonly used = { input: new Map<string, z.ZodType>(), output: new Map<string, z.ZodType>() };

  ref(schema: z.ZodType, io: Direction, where: string) {
    const id = z.globalRegistry.get(schema)?.id;
    if (typeof id !== "string") throw new Error(`${where}: give its schema .meta({ id: "Name" }) so the document can name it once.`);
    this.used[io].set(id, schema);
    return { $ref: componentRef(id) };
  }

  /** The used schemas and those they refer to; a schema read both ways must read the same. */
  schemas() {
    const emitted = { input: registrySchemas("input", this.used.input.values()), output: registrySchemas("output", this.used.output.values()) };
    const result: Record<string, JsonSchema> = {};
    for (const io of ["input", "output"] as const) {
      for (const id of reachable(this.used[io].keys(), emitted[io])) {
        const schema = emitted[io][id]!;
        if (id in result && !isDeepStrictEqual(result[id], schema))
          throw new Error(`Schema ${id} differs between request and response: give each its own id.`);
        result[id] = schema;
      }
    }
    return Object.fromEntries(Object.entries(result).sort(([a], [b]) => a.localeCompare(b)));
  }
}

type JsonSchema = Record<string, unknown>;

const componentRef = (id: string) => `#/components/schemas/${id}`;

/**
 * The named schemas that `roots` reach, converted together. Not the whole global registry: zod
 * keeps it on globalThis, so a server that has loaded the schema modules in several bundles (pages,
 * route handlers, server actions) holds each id once per copy, and converting them together
 * fails with "Duplicate schema id". The schemas these operations reach are this copy's own.
 */
function registrySchemas(io: Direction, roots: Iterable<z.ZodType>): Record<string, JsonSchema> {
  const params = { target: "draft-2020-12", io, unrepresentable: "any" } as const;
  const walk = new z.core.JSONSchemaGenerator({ ...params, metadata: z.globalRegistry });
  for (const root of roots) walk.process(root);
  const own = z.registry<{ id: string }>();
  for (const schema of walk.seen.keys()) {
    const id = z.globalRegistry.get(schema)?.id;
    if (typeof id === "string") own.add(schema, { id });
  }
  const { schemas } = z.toJSONSchema(own, { ...params, uri: componentRef });
  return Object.fromEntries(
    Object.entries(schemas).map(([id, schema]) => {
      const { $schema: _dialect, $id: _uri, ...body } = schema as JsonSchema;
      return [id, body];
    }),
  );
}

function reachable(roots: Iterable<string>, schemas: Record<string, JsonSchema>) {
  const found = new Set<string>();
  const visit = (id: string) => {
    if (found.has(id)) return;
    found.add(id);
    for (const match of JSON.stringify(schemas[id]).matchAll(/"\$ref":"#\/components\/schemas\/([^"]+)"/g)) visit(match[1]!);
  };
  for (const id of roots) visit(id);
  return found;
}

function requestBodyOf(operation: Operation, components: Components, where: string) {
  const content = {
    ...(operation.multipart ? { "multipart/form-data": { schema: multipartSchema(operation.multipart) } } : {}),
    ...(operation.request ? { "application/json": { schema: components.ref(operation.request, "input", where) } } : {}),
    ...(operation.csvRequest ? { "text/csv": { schema: { type: "string", description: operation.csvRequest } } } : {}),
    ...(operation.binaryRequest ? { "application/octet-stream": { schema: { type: "string", format: "binary", description: operation.binaryRequest } } } : {}),
  };
  return Object.keys(content).length > 0 ? { required: true, content } : undefined;
}

function successContent({ response, alternative }: Operation, components: Components, where: string) {
  if (response.binary) return Object.fromEntries(response.binary.map((type) => [type, { schema: { type: "string", contentMediaType: type } }]));
  if (response.text) return { [response.text.contentType]: { schema: { type: "string" } } };
  if (!response.schema) return undefined;
  return {
    "application/json": { schema: components.ref(response.schema, "output", where) },
    ...(alternative ? { [alternative.contentType]: { schema: { type: "string", description: alternative.description } } } : {}),
  };
}

/** `GET /structures/{code}/gauges` → `getStructuresByCodeGauges`: unique, stable, and readable in generated clients. */
function operationId(method: string, path: string) {
  const words = path
    .split("/")
    .filter(Boolean)
    .map((segment) => segment.replace(/^\{(.+)\}$/, "by-$1"))
    .flatMap((segment) => segment.split(/[^A-Za-z0-9]+/));
  return method + words.map((word) => word.charAt(0).toUpperCase() + word.slice(1)).join("");
}

/** Groups of operations in the reference, by the collection a path starts with (or the one under a structure). */
const TAGS: Record<string, string> = {
  structures: "The monitored structures",
  gauges: "A structure's strain gauges: configuration, zero, shunt checks, limits, readings, series, fatigue, photos and placement",
  rosettes: "Three gauges read together as a rosette: principal and von Mises stresses",
  alerts: "Limit and sensor alerts and their acknowledgement",
  drawings: "Elevations and plans the gauges are placed on",
  readings: "Sending readings in one request (JSON or CSV)",
  bursts: "Sending bursts of a dynamic (high-rate) gauge, in JSON or as 32-bit little-endian floats",
  events: "Waveforms captured around trigger crossings of dynamic gauges, and their labels",
  uploads: "Sending a logger file of any size, streamed",
  report: "The periodic structure report",
  "load-tests": "Diagnostic load tests: measured against predicted strain per gauge",
  certificates: "Calibration certificates of gauges and loggers, with their expiry and reminders",
  "site-visits": "The log of visits to the structure: who, when, what was done, gauges touched, photos",
  files: "Stored photos and drawings",
};

function tagOf(path: string) {
  const [first, second] = path.split("/").filter((segment) => segment && !segment.startsWith("{"));
  const tag = first === "structures" && second ? second : first!;
  if (!(tag in TAGS)) throw new Error(`${path}: describe its group "${tag}" in TAGS.`);
  return tag;
}

function describeOperation(method: string, path: string, operation: Operation, components: Components) {
  const where = `${method.toUpperCase()} ${path}`;
  const requestBody = requestBodyOf(operation, components, where);
  const content = successContent(operation, components, where);
  const errorBody = { "application/json": { schema: components.ref(errorSchema, "output", where) } };
  const errorResponses = Object.fromEntries(operation.errors.map((status) => [String(status), { description: ERROR_MEANING[status], content: errorBody }]));
  const description = [operation.roles ? `Roles: ${operation.roles}.` : "", operation.notes ?? ""].filter(Boolean).join("\n\n");
  return {
    operationId: operationId(method, path),
    tags: [tagOf(path)],
    summary: operation.summary,
    ...(description ? { description } : {}),
    ...(operation.parameters
      ? { parameters: operation.parameters.map((p) => ({ ...p, required: p.in === "path", schema: { type: "string" } })) }
      : {}),
    ...(requestBody ? { requestBody } : {}),
    responses: {
      [String(operation.response.status)]: { description: operation.response.description, ...(content ? { content } : {}) },
      ...errorResponses,
    },
  };
}

/** The OpenAPI 3.1 document of /api/v1, generated from the schemas that validate requests and shape answers. */
export function openApiDocument() {
  const components = new Components();
  const paths = Object.fromEntries(
    Object.entries(OPERATIONS).map(([path, methods]) => [
      path,
      Object.fromEntries(Object.entries(methods).map(([method, operation]) => [method, describeOperation(method, path, operation, components)])),
    ]),
  );
  const tags = [...new Set(Object.keys(OPERATIONS).map(tagOf))].map((name) => ({ name, description: TAGS[name] }));
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
    security: [{ bearer: [] }],
    tags,
    paths,
    components: { securitySchemes: { bearer: { type: "http", scheme: "bearer" } }, schemas: components.schemas() },
  };
}
