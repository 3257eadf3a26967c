import { apiRoute, json } from "@/lib/api/http";
import { parseWith } from "@/lib/validation";
import { reportQuery } from "@/lib/api/report-query";
import { structureReport, structureReportPdf } from "@/lib/services/report";

type Params = { code: string };

/** The structure's report for a period as JSON, or as a PDF attachment (?format=pdf or Accept: application/pdf). */
export const GET = apiRoute<Params>(async ({ request, actor, params }) => {
  const query = parseWith(reportQuery, Object.fromEntries(new URL(request.url).searchParams));
  const report = await structureReport(actor, params.code, query.period);
  const pdf = query.format === "pdf" || (!query.format && request.headers.get("accept")?.includes("application/pdf"));
  if (!pdf) return json(report);
  return new Response(new Uint8Array(await structureReportPdf(actor, report)), {
    headers: {
      "content-type": "application/pdf",
      "content-disposition": `attachment; filename="${report.structure.code}-report-${report.period.key}.pdf"`,
    },
  });
});

export * from "@/lib/api/method-not-allowed";
