import { z } from "zod";
import { ALERT_STATES } from "@/lib/services/alerts";

/** Alert list filters from the address bar; anything unexpected falls back to the default. */
const filterSchema = z.object({
  state: z.enum(ALERT_STATES).catch("open"),
  level: z.enum(["any", "watch", "warning", "critical"]).catch("any"),
  kind: z.enum(["any", "limit", "sensor"]).catch("any"),
});

export type AlertFilter = z.output<typeof filterSchema>;

export function alertFilterOf(searchParams: Record<string, string | string[] | undefined>): AlertFilter {
  return filterSchema.parse({ state: searchParams.state, level: searchParams.level, kind: searchParams.kind });
}

export function matchesFilter(alert: { level: string; kind: string }, filter: AlertFilter): boolean {
  return (filter.level === "any" || alert.level === filter.level) && (filter.kind === "any" || alert.kind === filter.kind);
}
