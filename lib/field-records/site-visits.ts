import { z } from "zod";
import { gaugeTag, isoTime } from "@/lib/gauges/schema";
import { plainText } from "@/lib/validation";

/** Photos one visit may carry: enough for the gauges a crew touches in a day, at 10 MB each. */
export const MAX_VISIT_PHOTOS = 8;
export const SITE_VISITS_PER_PAGE = 20;
const MAX_VISIT_GAUGES = 200;

export const siteVisitInput = z
  .object({
    visitedAt: isoTime.meta({ description: "When the visit began, ISO-8601 with Z or an offset; not in the future" }),
    visitor: plainText()
      .trim()
      .max(200, "Keep the names under 200 characters.")
      .optional()
      .meta({ description: "Who went (names of the crew); default the person whose token or session sends it" }),
    work: plainText({ error: "Say what was done on the visit." })
      .trim()
      .min(1, "Say what was done on the visit, e.g. \"checked the cable glands of the north girder\".")
      .max(4000, "Keep the description under 4000 characters."),
    gauges: z
      .array(gaugeTag)
      .max(MAX_VISIT_GAUGES, `A visit names at most ${MAX_VISIT_GAUGES} gauges.`)
      .default([])
      .meta({ description: "Tags of the structure's gauges the visit touched" }),
  })
  .superRefine((input, context) => {
    const seen = new Set<string>();
    input.gauges.forEach((tag, index) => {
      if (seen.has(tag)) context.addIssue({ code: "custom", path: ["gauges", index], message: `Gauge ${tag} is named twice.` });
      seen.add(tag);
    });
  })
  .meta({ id: "SiteVisitInput" });

export type SiteVisitInput = z.output<typeof siteVisitInput>;

const PAGE_RULE = "page is a whole number from 1.";

/** Query of GET /structures/{code}/site-visits: a page of the newest-first list, and optionally only the visits naming a gauge. */
export const siteVisitQuery = z.object({
  page: z.coerce
    .number({ error: PAGE_RULE })
    .int(PAGE_RULE)
    .min(1, PAGE_RULE)
    .max(1_000_000, PAGE_RULE)
    .default(1)
    .meta({ description: `Page of ${SITE_VISITS_PER_PAGE} visits, newest first (default 1)` }),
  gauge: gaugeTag.optional().meta({ description: "Only the visits that name this gauge" }),
});
