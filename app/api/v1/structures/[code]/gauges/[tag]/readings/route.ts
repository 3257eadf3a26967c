import { apiRoute, json } from "@/lib/api/http";
import { parseQuery, readingsQuerySchema } from "@/lib/api/readings-schemas";
import { exportReadingsCsv, listReadings } from "@/lib/services/readings";

type Params = { code: string; tag: string };

/** JSON pages with a cursor; with `Accept: text/csv`, the whole range streamed as CSV. */
export const GET = apiRoute<Params>(async ({ request, actor, params }) => {
  const query = parseQuery(request, readingsQuerySchema);
  if (request.headers.get("accept")?.includes("text/csv")) {
    const body = await exportReadingsCsv(actor, params.code, params.tag, query);
    return new Response(body, {
      headers: {
        "content-type": "text/csv; charset=utf-8",
        "content-disposition": `attachment; filename="${params.code}-${params.tag}-readings.csv"`,
      },
    });
  }
  return json(await listReadings(actor, params.code, params.tag, query));
});

export * from "@/lib/api/method-not-allowed";
