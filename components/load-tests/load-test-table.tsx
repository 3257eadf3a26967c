import { stackedTable, thClass } from "@/components/ui/styles";
import type { LoadTestGauge } from "@/lib/api/load-test-schemas";
import { ratioText, strainText } from "@/lib/load-tests/results";
import { formatInTimeZone } from "@/lib/time-format";

function peakTime(gauge: LoadTestGauge, timeZone: string): string {
  if (!gauge.peakAt) return "—";
  const start = formatInTimeZone(new Date(gauge.peakAt.start), timeZone);
  return gauge.peakAt.start === gauge.peakAt.end ? start : `${start} to ${formatInTimeZone(new Date(gauge.peakAt.end), timeZone)}`;
}

/** Per gauge: baseline, measured peak, predicted, ratio and the state in words; stacked cards on a phone. */
export function LoadTestTable({ gauges, timeZone }: { gauges: LoadTestGauge[]; timeZone: string }) {
  return (
    <table className={stackedTable.table} data-testid="load-test-table">
      <thead className={stackedTable.head}>
        <tr>
          <th className={thClass}>Gauge</th>
          <th className={thClass}>Baseline (µε)</th>
          <th className={thClass}>Measured peak (µε)</th>
          <th className={thClass}>Predicted (µε)</th>
          <th className={thClass}>Ratio measured/predicted</th>
          <th className={thClass}>Against the prediction (µε)</th>
          <th className={thClass}>Peak at</th>
          <th className={thClass}>State</th>
        </tr>
      </thead>
      <tbody className={stackedTable.body}>
        {gauges.map((gauge) => (
          <tr key={gauge.gauge} className={stackedTable.row} data-gauge={gauge.gauge}>
            <td className={`${stackedTable.cell} font-mono`} data-label="Gauge">
              {gauge.gauge}
              {gauge.member && <span className="ml-2 font-sans text-xs text-slate-500">{gauge.member}</span>}
              {gauge.source === "summaries" && <span className="ml-2 font-sans text-xs text-slate-500">from interval summaries</span>}
            </td>
            <td className={stackedTable.cell} data-label="Baseline (µε)">
              {strainText(gauge.baseline?.strain ?? null)}
            </td>
            <td className={`${stackedTable.cell} font-semibold`} data-label="Measured peak (µε)" data-testid="measured">
              {strainText(gauge.measured)}
            </td>
            <td className={stackedTable.cell} data-label="Predicted (µε)">
              {strainText(gauge.predicted)} <span className="text-xs text-slate-500">{gauge.direction}</span>
            </td>
            <td className={`${stackedTable.cell} font-semibold`} data-label="Ratio measured/predicted" data-testid="ratio">
              {ratioText(gauge.ratio)}
            </td>
            <td className={stackedTable.cell} data-label="Against the prediction (µε)">
              {strainText(gauge.against)}
            </td>
            <td className={stackedTable.cell} data-label="Peak at">
              {peakTime(gauge, timeZone)}
            </td>
            <td className={`${stackedTable.cell} ${gauge.state === "measured" ? "" : "font-medium text-amber-800 dark:text-amber-300"}`} data-label="State">
              {gauge.message}
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
