import { apiRoute } from "@/lib/api/http";
import { loadTestId } from "@/lib/api/load-test-schemas";
import { loadTestResultsCsv } from "@/lib/services/load-tests";
import { parseWith } from "@/lib/validation";

type Params = { code: string; id: string };

export const GET = apiRoute<Params>(async ({ actor, params }) => {
  const { filename, csv } = await loadTestResultsCsv(actor, params.code, parseWith(loadTestId, params.id));
  return new Response(csv, { headers: { "content-type": "text/csv; charset=utf-8", "content-disposition": `attachment; filename="${filename}"` } });
});

export * from "@/lib/api/method-not-allowed";
