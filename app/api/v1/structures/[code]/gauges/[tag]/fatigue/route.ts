import { apiRoute, json } from "@/lib/api/http";
import { parseWith } from "@/lib/validation";
import { fatigueQuery } from "@/lib/api/fatigue-query";
import { rainflowMatrixCsv } from "@/lib/fatigue";
import { gaugeFatigue } from "@/lib/services/fatigue";

type Params = { code: string; tag: string };

/** Fatigue of a gauge over a period as JSON, or its rainflow matrix as CSV (?format=csv or Accept: text/csv). */
export const GET = apiRoute<Params>(async ({ request, actor, params }) => {
  const url = new URL(request.url);
  const query = parseWith(fatigueQuery, Object.fromEntries(url.searchParams));
  const { fatigue, matrix } = await gaugeFatigue(actor, params.code, params.tag, query);
  const csv = query.format === "csv" || (!query.format && request.headers.get("accept")?.includes("text/csv"));
  if (!csv) return json(fatigue);
  const day = (iso: string) => iso.slice(0, 10);
  return new Response(rainflowMatrixCsv(matrix), {
    headers: {
      "content-type": "text/csv; charset=utf-8",
      "content-disposition": `attachment; filename="${params.code}-${params.tag}-rainflow-${day(fatigue.from)}-to-${day(fatigue.to)}.csv"`,
    },
  });
});

export * from "@/lib/api/method-not-allowed";
