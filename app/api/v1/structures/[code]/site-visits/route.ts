import { apiRoute, json } from "@/lib/api/http";
import { readSiteVisit } from "@/lib/api/uploads";
import { addSiteVisit, listSiteVisits } from "@/lib/services/site-visits";

type Params = { code: string };

/** ?page (newest first) and ?gauge (only the visits naming it). */
export const GET = apiRoute<Params>(async ({ request, actor, params }) =>
  json(await listSiteVisits(actor, params.code, Object.fromEntries(new URL(request.url).searchParams))),
);

/** JSON without photos, or multipart/form-data with `photos` (images) and `gauges` repeated. */
export const POST = apiRoute<Params>(async ({ request, actor, params }) => json(await addSiteVisit(actor, params.code, await readSiteVisit(request)), 201));

export * from "@/lib/api/method-not-allowed";
