import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { LoadTestChart } from "@/components/load-tests/load-test-chart";
import { LoadTestTable } from "@/components/load-tests/load-test-table";
import { MonitoringCaution } from "@/components/ui/caution";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { buttonClass, cardClass } from "@/components/ui/styles";
import { loadTestId } from "@/lib/api/load-test-schemas";
import { pageGuard } from "@/lib/auth/page-guard";
import { requireUser } from "@/lib/auth/session";
import { listGauges } from "@/lib/services/gauges";
import { getLoadTestResults } from "@/lib/services/load-tests";
import { getVisibleStructure } from "@/lib/services/structures";
import { formatInTimeZone } from "@/lib/time-format";

type Props = { params: Promise<{ code: string; id: string }> };

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const { code, id } = await params;
  return { title: `Load test ${id} · ${code}` };
}

const DATA_STATE_TEXT = {
  complete: null,
  partial: "Some gauges have no data in the window, or nothing before it to measure from: their rows say which. Readings uploaded later count when the page is opened again.",
  none: "No gauge has data in the window yet. If the logger's file has not been uploaded, upload it and open this page again: results are worked out from what is stored.",
} as const;

/** One load test: per gauge the measured peak beside the prediction, a chart around the window, and the CSV for the report. */
export default async function LoadTestPage({ params }: Props) {
  const { code, id } = await params;
  const user = await requireUser();
  const parsedId = loadTestId.safeParse(id);
  if (!parsedId.success) notFound();
  const structure = await pageGuard(getVisibleStructure(user, code));
  const [results, gauges] = await Promise.all([pageGuard(getLoadTestResults(user, code, parsedId.data)), listGauges(user, code)]);
  const intervals = new Map(gauges.map((gauge) => [gauge.tag, gauge.expectedInterval ?? null]));
  const zone = structure.timezone;
  const base = `/structures/${encodeURIComponent(structure.code)}`;
  const window = { start: Date.parse(results.start), end: Date.parse(results.end) };
  const note = DATA_STATE_TEXT[results.dataState];
  return (
    <div className="space-y-8">
      <PageHeader
        title={results.title}
        subtitle={
          <>
            {structure.name} · {formatInTimeZone(new Date(results.start), zone)} to {formatInTimeZone(new Date(results.end), zone)} · recorded by {results.createdBy}
            <Link href={`${base}/load-tests`} className="ml-2 text-accent underline">
              All load tests
            </Link>
          </>
        }
        actions={
          <a href={`/api/v1${base}/load-tests/${results.id}/results.csv`} download className={buttonClass("secondary")}>
            Download CSV
          </a>
        }
      />
      <p className="-mt-4 max-w-prose text-sm">
        <span className="font-medium">Load:</span> {results.load}
      </p>
      <MonitoringCaution>
        <li>{results.caution}</li>
        <li>Peak = the largest change from the baseline (the last reading before the window) in the sign of the prediction; strain is tension positive.</li>
      </MonitoringCaution>
      <section aria-labelledby="results-heading" className="space-y-3">
        <h2 id="results-heading" className="text-lg font-semibold">
          Results per gauge
        </h2>
        {note && (
          <p className="rounded-md border border-amber-300 bg-amber-50 px-3 py-2 text-sm text-amber-950 dark:border-amber-700 dark:bg-amber-950/40 dark:text-amber-100" role="status">
            {note}
          </p>
        )}
        <div className={cardClass}>
          <LoadTestTable gauges={results.gauges} timeZone={zone} />
        </div>
      </section>
      <section aria-labelledby="charts-heading" className="space-y-3">
        <h2 id="charts-heading" className="text-lg font-semibold">
          Strain around the window
        </h2>
        {results.gauges.length === 0 ? (
          <EmptyState title="No gauges in this test" />
        ) : (
          <div className="grid gap-4 lg:grid-cols-2">
            {results.gauges.map((gauge) => (
              <LoadTestChart
                key={gauge.gauge}
                code={structure.code}
                tag={gauge.gauge}
                timeZone={zone}
                window={window}
                baseline={gauge.baseline?.strain ?? null}
                expectedIntervalS={intervals.get(gauge.gauge) ?? null}
              />
            ))}
          </div>
        )}
      </section>
    </div>
  );
}
