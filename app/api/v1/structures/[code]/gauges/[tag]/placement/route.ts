import { apiRoute, json, readJson } from "@/lib/api/http";
import { placementInput } from "@/lib/files/schema";
import { placeGauge } from "@/lib/services/files";

type Params = { code: string; tag: string };

/** `{ drawingId, x, y }` places the gauge on a drawing of its structure; `{ drawingId: null }` takes it off. */
export const PUT = apiRoute<Params>(async ({ request, actor, params }) =>
  json(await placeGauge(actor, params.code, params.tag, await readJson(request, placementInput))),
);

export * from "@/lib/api/method-not-allowed";
