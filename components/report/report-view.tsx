"use client";

import { ConditionBadge } from "@/components/alerts/state-badge";
import { DrawingBoard, type BoardGauge } from "@/components/drawings/drawing-board";
import { ReportLoadTests } from "@/components/load-tests/report-load-tests";
import { EmptyState } from "@/components/ui/empty-state";
import { cardClass, tableClass, tdClass, thClass } from "@/components/ui/styles";
import { useUnits } from "@/components/units/units-context";
import { shownState } from "@/lib/alerting/condition-display";
import type { ReportGauge, StructureReport } from "@/lib/api/report-schema";
import { formatInTimeZone } from "@/lib/time-format";
import { alertEventLine, alertHandling, alertTitle, formatCondition, formatGap, gaugeFacts, summaryFacts } from "@/lib/report/format";
import { fieldRecordSections } from "@/lib/report/field-records";
import { periodState } from "@/lib/report/status";
import type { UnitSystem } from "@/lib/units";
import { ReportStressChart } from "./report-chart";

function Section({ id, title, children }: { id: string; title: string; children: React.ReactNode }) {
  return (
    <section aria-labelledby={id} className="space-y-3 break-inside-avoid-page">
      <h2 id={id} className="text-lg font-semibold">
        {title}
      </h2>
      {children}
    </section>
  );
}

/** The report in the reader's units (stress and temperature); the PDF of the same period stays SI. */
export function ReportView({ report }: { report: StructureReport }) {
  const units = useUnits();
  const { summary, structure } = report;
  const zone = structure.timezone;
  const last = summary.current.lastReadingAt ? formatInTimeZone(new Date(summary.current.lastReadingAt), zone) : "none yet";
  const facts: [string, React.ReactNode][] = [
    ...summaryFacts(summary),
    [
      "Condition now",
      <span key="now" className="inline-flex flex-wrap items-center gap-2">
        <ConditionBadge condition={{ state: summary.current.state, faults: [], stale: summary.current.stale }} />
        <span className="text-slate-600 dark:text-slate-400">last reading {last}</span>
      </span>,
    ],
  ];
  return (
    <div className="space-y-8">
      <Section id="summary-heading" title="Summary">
        <div className={`${cardClass} space-y-3 p-4`}>
          <p className="flex flex-wrap items-center gap-2 font-medium" data-testid="report-level">
            <ConditionBadge condition={{ state: periodState(summary.level), faults: [], stale: false }} />
            {summary.headline}
          </p>
          <dl className="grid gap-x-6 gap-y-2 text-sm sm:grid-cols-[14rem_1fr]">
            {facts.map(([label, value]) => (
              <div key={label} className="contents">
                <dt className="text-slate-500 dark:text-slate-400">{label}</dt>
                <dd>{value}</dd>
              </div>
            ))}
          </dl>
        </div>
      </Section>

      <Section id="drawings-heading" title="Where the gauges are">
        <ReportDrawings report={report} />
      </Section>

      <Section id="gauges-heading" title="Gauges">
        {report.gauges.length === 0 ? (
          <EmptyState title="No gauges in this period">
            No gauge was installed on {structure.name} during {report.period.name}, so there is nothing to report. Register gauges on the structure page.
          </EmptyState>
        ) : (
          <>
            {summary.readings.received === 0 && (
              <EmptyState title={`No readings in ${report.period.name}`}>
                None of the gauges sent a reading in this period: the report cannot say whether the structure stayed within its limits. Check the
                loggers and their network link.
              </EmptyState>
            )}
            <GaugeTable gauges={report.gauges} units={units} timeZone={zone} />
            <GapLists gauges={report.gauges} timeZone={zone} />
            <div className="space-y-4">
              {report.gauges.map((gauge) => (
                <div key={gauge.tag} className={`${cardClass} break-inside-avoid space-y-2 p-4`}>
                  <h3 className="font-semibold">
                    Stress of <span className="font-mono">{gauge.tag}</span>
                    {gauge.label && <span className="font-normal text-slate-600 dark:text-slate-400"> · {gauge.label}</span>}
                  </h3>
                  <ReportStressChart report={report} gauge={gauge} units={units} />
                </div>
              ))}
            </div>
          </>
        )}
      </Section>

      <Section id="load-tests-heading" title="Load tests">
        <ReportLoadTests tests={report.loadTests} timeZone={zone} />
      </Section>

      <Section id="alerts-heading" title="Alerts and how they were handled">
        {report.alerts.length === 0 ? (
          <p className="text-sm text-slate-600 dark:text-slate-400">No alert was open during this period.</p>
        ) : (
          <ul className="space-y-3">
            {report.alerts.map((alert) => (
              <li key={alert.id} className={`${cardClass} break-inside-avoid space-y-1 p-4 text-sm`}>
                <p className="font-semibold">{alertTitle(alert, units)}</p>
                <p>
                  Opened {formatInTimeZone(new Date(alert.openedAt), zone)}
                  {alert.openedBeforePeriod && " (before the period)"}; {alertHandling(alert, zone)}.
                </p>
                <ol className="list-inside list-disc text-slate-600 dark:text-slate-400">
                  {alert.events.map((event, i) => (
                    <li key={i}>{alertEventLine(event, zone)}</li>
                  ))}
                </ol>
              </li>
            ))}
          </ul>
        )}
      </Section>

      {fieldRecordSections(report).map((section) => (
        <Section key={section.id} id={section.id} title={section.title}>
          {section.lines.length === 0 ? (
            <p className="text-sm text-slate-600 dark:text-slate-400">{section.empty}</p>
          ) : (
            <ul className="list-inside list-disc space-y-1 text-sm">
              {section.lines.map((line, i) => (
                <li key={i}>{line}</li>
              ))}
            </ul>
          )}
        </Section>
      ))}
    </div>
  );
}

/** The structure's drawings with the report's gauges on them, as the structure's drawing pages show them. */
function ReportDrawings({ report }: { report: StructureReport }) {
  if (report.drawings.length === 0) {
    return <p className="text-sm text-slate-600 dark:text-slate-400">No drawing of the structure is stored: an engineer can upload one on the structure&apos;s drawings page.</p>;
  }
  const zone = report.structure.timezone;
  const gauges: BoardGauge[] = report.gauges.map((gauge) => ({
    tag: gauge.tag,
    label: gauge.label,
    state: shownState(gauge.condition, gauge.status === "retired"),
    stateText: formatCondition(gauge.condition, gauge.status, zone),
    placement: gauge.placement && { id: gauge.placement.drawing, x: gauge.placement.x, y: gauge.placement.y },
  }));
  return (
    <div className="space-y-4">
      {report.drawings.map((drawing) => (
        <div key={drawing.id} className="break-inside-avoid space-y-1">
          <h3 className="font-semibold">{drawing.title}</h3>
          <DrawingBoard structureCode={report.structure.code} drawing={drawing} gauges={gauges} canPlace={false} />
        </div>
      ))}
      <p className="text-xs text-slate-600 dark:text-slate-400">Markers show each gauge&apos;s condition when the report was made.</p>
    </div>
  );
}

function GaugeTable({ gauges, units, timeZone }: { gauges: ReportGauge[]; units: UnitSystem; timeZone: string }) {
  const columns = ["Gauge", ...gaugeFacts(gauges[0]!, units, timeZone).map((fact) => fact.label)];
  return (
    <div className={`${cardClass} overflow-x-auto print:overflow-visible`}>
      <table className={`${tableClass} print:text-xs`}>
        <thead>
          <tr>
            {columns.map((column) => (
              <th key={column} scope="col" className={thClass}>
                {column}
              </th>
            ))}
          </tr>
        </thead>
        <tbody className="divide-y divide-slate-100 dark:divide-slate-800">
          {gauges.map((gauge) => (
            <tr key={gauge.tag} data-testid="report-gauge-row" className="break-inside-avoid">
              <th scope="row" className={`${tdClass} text-left`}>
                <span className="font-mono font-semibold">{gauge.tag}</span>
                {gauge.status === "retired" && <span className="ml-1 text-xs text-slate-500">(retired)</span>}
                <span className="block text-xs font-normal text-slate-500 dark:text-slate-400">{[gauge.label, gauge.member].filter(Boolean).join(" · ")}</span>
              </th>
              {gaugeFacts(gauge, units, timeZone).map((fact) => (
                <td key={fact.key} className={`${tdClass} tabular-nums`} data-fact={fact.key}>
                  {fact.value}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

function GapLists({ gauges, timeZone }: { gauges: ReportGauge[]; timeZone: string }) {
  const withGaps = gauges.filter((gauge) => gauge.gaps.list.length > 0);
  if (withGaps.length === 0) return null;
  return (
    <div className={`${cardClass} space-y-3 p-4 text-sm`}>
      <h3 className="font-semibold">Gaps: runs of hours without readings (times in {timeZone})</h3>
      {withGaps.map((gauge) => (
        <div key={gauge.tag} className="break-inside-avoid">
          <p className="font-mono font-semibold">{gauge.tag}</p>
          <ul className="list-inside list-disc text-slate-700 dark:text-slate-300">
            {gauge.gaps.list.map((gap) => (
              <li key={gap.start}>{formatGap(gap, timeZone)}</li>
            ))}
            {gauge.gaps.more > 0 && <li>and {gauge.gaps.more} more</li>}
          </ul>
        </div>
      ))}
    </div>
  );
}
