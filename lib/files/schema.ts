import { z } from "zod";
import { optionalText, plainText } from "@/lib/validation";

/** Text fields sent with uploads, and a gauge's place on a drawing; shared by the API and the pages. */

const TITLE_MAX = 120;

export const drawingFields = z.object({
  title: plainText({ error: 'Give the drawing a title, e.g. "North elevation".' })
    .trim()
    .min(1, 'Give the drawing a title, e.g. "North elevation".')
    .max(TITLE_MAX, `Keep the title under ${TITLE_MAX} characters.`),
});

export const photoFields = z.object({ title: optionalText(TITLE_MAX) });

const fraction = (axis: string, across: string) =>
  z
    .number({ error: `Give ${axis} as a number from 0 to 1.` })
    .min(0, `${axis} is a fraction of the drawing's ${across}: use 0 to 1.`)
    .max(1, `${axis} is a fraction of the drawing's ${across}: use 0 to 1.`);

export const placementInput = z.union(
  [
    z.object({
      drawingId: z.number().int().positive().meta({ description: "A drawing of the gauge's structure" }),
      x: fraction("x", "width").meta({ description: "From the left edge, 0–1" }),
      y: fraction("y", "height").meta({ description: "From the top edge, 0–1" }),
    }),
    z.object({ drawingId: z.null().meta({ description: "null takes the gauge off its drawing" }) }),
  ],
  { error: "Send { drawingId, x, y } to place the gauge, or { drawingId: null } to take it off its drawing." },
).meta({ id: "PlacementInput" });
export type PlacementInput = z.infer<typeof placementInput>;

const FILE_ID_RULE = "A file id is a positive whole number, e.g. /api/v1/files/12.";

/** A file id from the URL. */
export const fileId = z.coerce.number({ error: FILE_ID_RULE }).int(FILE_ID_RULE).positive(FILE_ID_RULE);
