import type { Metadata } from "next";
import Link from "next/link";
import { PrintButton } from "@/components/report/print-button";
import { ReportPeriodPicker } from "@/components/report/report-period-picker";
import { ReportView } from "@/components/report/report-view";
import { ConcreteCaution, MonitoringCaution } from "@/components/ui/caution";
import { PageHeader } from "@/components/ui/page-header";
import { buttonClass } from "@/components/ui/styles";
import { reportQuery } from "@/lib/api/report-query";
import { pageGuard } from "@/lib/auth/page-guard";
import { requireUser } from "@/lib/auth/session";
import { formatInTimeZone, monthOf } from "@/lib/time-format";
import { REPORT_NOTES } from "@/lib/report/cautions";
import { monthsBefore, periodQuery, wholeMonthKey } from "@/lib/report/period";
import { structureReport } from "@/lib/services/report";

type Props = { params: Promise<{ code: string }>; searchParams: Promise<Record<string, string | string[] | undefined>> };

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  return { title: `Report · ${(await params).code}` };
}

/** The picker's fields as the API reads them; empty fields (an unchosen month) count as absent. */
function periodFields(search: Record<string, string | string[] | undefined>) {
  const fields: Record<string, string> = {};
  for (const name of ["month", "from", "to"]) {
    const value = search[name];
    const first = Array.isArray(value) ? value[0] : value;
    if (first) fields[name] = first;
  }
  return fields;
}

/** The structure's report for a month or chosen days, printable, with its PDF to download. */
export default async function StructureReportPage({ params, searchParams }: Props) {
  const { code } = await params;
  const user = await requireUser();
  const parsed = reportQuery.safeParse(periodFields(await searchParams));
  const report = await pageGuard(structureReport(user, code, parsed.success ? parsed.data.period : undefined));
  const zone = report.structure.timezone;
  const structurePath = `/structures/${encodeURIComponent(report.structure.code)}`;
  return (
    <div className="space-y-6 print:space-y-4">
      <PageHeader
        title={`Report: ${report.structure.name}`}
        subtitle={
          <>
            <span className="font-semibold text-ink dark:text-slate-100">{report.period.name}</span> · {formatInTimeZone(new Date(report.period.from), zone)} to{" "}
            {formatInTimeZone(new Date(report.period.to), zone)} · days and times in {zone} · generated {formatInTimeZone(new Date(report.generatedAt), zone)}
            <Link href={structurePath} className="ml-2 text-accent underline print:hidden">
              Structure page
            </Link>
          </>
        }
        actions={
          <div className="flex gap-2 print:hidden">
            <a href={`/api/v1${structurePath}/report?${periodQuery(report.period)}&format=pdf`} download className={buttonClass()}>
              Download PDF
            </a>
            <PrintButton />
          </div>
        }
      />
      <ReportPeriodPicker
        months={monthsBefore(monthOf(new Date(), zone), 12)}
        selectedMonth={wholeMonthKey(report.period)}
        fromDay={report.period.firstDay}
        toDay={report.period.lastDay}
        timeZone={zone}
        error={parsed.success ? null : parsed.error.issues[0]!.message}
      />
      <ReportView report={report} />
      <MonitoringCaution>
        {REPORT_NOTES.map((note) => (
          <li key={note}>{note}</li>
        ))}
        {report.gauges.some((gauge) => gauge.utilisationPeak?.basis === "compressive-strength") && <ConcreteCaution />}
      </MonitoringCaution>
    </div>
  );
}
