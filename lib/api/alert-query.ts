import { z } from "zod";
import { ALERT_KIND_FILTERS, ALERT_LEVEL_FILTERS, ALERT_STATES } from "@/lib/alerting/filters";

/** Alerts per page when the caller gives no `limit`: as many as the list gave before it was paged. */
export const DEFAULT_ALERT_LIMIT = 500;
export const MAX_ALERT_LIMIT = 1_000;

/** Query string of GET /structures/{code}/alerts: filters and a page, all applied in the database. */
export const alertListQuery = z.object({
  state: z
    .enum(ALERT_STATES, { error: `state is one of ${ALERT_STATES.join(", ")}.` })
    .default("open")
    .meta({ description: "open (default: open and not acknowledged), acknowledged, cleared or all" }),
  level: z
    .enum(ALERT_LEVEL_FILTERS, { error: `level is one of ${ALERT_LEVEL_FILTERS.join(", ")}.` })
    .default("any")
    .meta({ description: "watch, warning, critical, or any (default)" }),
  kind: z
    .enum(ALERT_KIND_FILTERS, { error: `kind is one of ${ALERT_KIND_FILTERS.join(", ")}.` })
    .default("any")
    .meta({ description: "limit, sensor, or any (default)" }),
  limit: z.coerce
    .number({ error: `limit is a whole number from 1 to ${MAX_ALERT_LIMIT}.` })
    .int(`limit is a whole number from 1 to ${MAX_ALERT_LIMIT}.`)
    .min(1, `limit is a whole number from 1 to ${MAX_ALERT_LIMIT}.`)
    .max(MAX_ALERT_LIMIT, `limit is a whole number from 1 to ${MAX_ALERT_LIMIT}.`)
    .default(DEFAULT_ALERT_LIMIT)
    .meta({ description: `Alerts per page, 1–${MAX_ALERT_LIMIT} (default ${DEFAULT_ALERT_LIMIT}); \`total\` says how many match in all` }),
  cursor: z
    .string()
    .regex(/^\d{1,15}\.\d{1,12}$/, "cursor is the nextCursor of the previous page.")
    .optional()
    .meta({ description: "`nextCursor` of the previous page; absent for the first page" }),
});
