import { z } from "zod";

export const ALERT_STATES = ["open", "acknowledged", "cleared", "all"] as const;
export type AlertState = (typeof ALERT_STATES)[number];
export const ALERT_LEVEL_FILTERS = ["any", "watch", "warning", "critical"] as const;
export const ALERT_KIND_FILTERS = ["any", "limit", "sensor"] as const;

/** Alerts shown per page of a screen's list. */
export const ALERTS_PER_PAGE = 50;

/** Alert list filters from the address bar; anything unexpected falls back to the default. */
const filterSchema = z.object({
  state: z.enum(ALERT_STATES).catch("open"),
  level: z.enum(ALERT_LEVEL_FILTERS).catch("any"),
  kind: z.enum(ALERT_KIND_FILTERS).catch("any"),
  page: z.coerce.number().int().min(1).max(1_000_000).catch(1),
});

export type AlertFilter = Omit<z.output<typeof filterSchema>, "page">;
export type AlertListParams = z.output<typeof filterSchema>;

const first = (value: string | string[] | undefined) => (Array.isArray(value) ? value[0] : value);

/** The filter and the page of a list, from the address bar's search parameters. */
export function alertListParamsOf(searchParams: Record<string, string | string[] | undefined>, defaults: Partial<AlertFilter> = {}): AlertListParams {
  return filterSchema.parse({
    state: first(searchParams.state) ?? defaults.state,
    level: first(searchParams.level) ?? defaults.level,
    kind: first(searchParams.kind) ?? defaults.kind,
    page: first(searchParams.page),
  });
}

/** Rows to skip for a page of `perPage`. */
export const pageOffset = (page: number, perPage = ALERTS_PER_PAGE) => (page - 1) * perPage;

/** How many pages `total` rows fill; at least one, so an empty list still has its page. */
export const pageCount = (total: number, perPage = ALERTS_PER_PAGE) => Math.max(1, Math.ceil(total / perPage));
