import Link from "next/link";
import { cardClass } from "@/components/ui/styles";
import type { LoadTestResults } from "@/lib/api/load-test-schemas";
import { formatInTimeZone } from "@/lib/time-format";
import { LoadTestTable } from "./load-test-table";

/** The report's section of load tests whose window lies in the period: each with its per-gauge table and the caution. */
export function ReportLoadTests({ tests, timeZone }: { tests: LoadTestResults[]; timeZone: string }) {
  if (tests.length === 0) return <p className="text-sm text-slate-600 dark:text-slate-400">No load test was recorded in this period.</p>;
  return (
    <div className="space-y-4">
      {tests.map((test) => (
        <article key={test.id} className={`${cardClass} break-inside-avoid space-y-2 p-4 text-sm`} data-testid="report-load-test">
          <h3 className="font-semibold">
            <Link href={`/structures/${encodeURIComponent(test.structure)}/load-tests/${test.id}`} className="underline print:no-underline">
              {test.title}
            </Link>
          </h3>
          <p>
            {formatInTimeZone(new Date(test.start), timeZone)} to {formatInTimeZone(new Date(test.end), timeZone)} · {test.load} · recorded by {test.createdBy}
          </p>
          <LoadTestTable gauges={test.gauges} timeZone={timeZone} />
          <p className="text-xs text-slate-600 dark:text-slate-400">{test.caution}</p>
        </article>
      ))}
    </div>
  );
}
