import type { ReportGauge, StructureReport } from "@/lib/api/report-schema";
import { CHART_INK, levelInk, reportStressChart, type Point } from "@/lib/report/chart";
import type { UnitSystem } from "@/lib/units";

/** The box the geometry is laid out in; the SVG scales to the column's width. */
const BOX = { width: 720, height: 220 };

const pathOf = (points: readonly Point[], closed = false) =>
  `${points.map((point, i) => `${i === 0 ? "M" : "L"}${point.x.toFixed(1)} ${point.y.toFixed(1)}`).join("")}${closed ? "Z" : ""}`;

/**
 * A gauge's stress over the report's period as SVG, from the same geometry the PDF draws: the
 * envelope, the limit lines and the numbered alerts, with the alerts' list under it.
 */
export function ReportStressChart({ report, gauge, units }: { report: StructureReport; gauge: ReportGauge; units: UnitSystem }) {
  const chart = reportStressChart(report, gauge, units, BOX);
  if (!chart) return <p className="text-sm text-slate-600 dark:text-slate-400">No stress chart: {gauge.tag} stored no reading in this period.</p>;
  const { geometry: g, legend } = chart;
  const { plot } = g;
  const bottom = plot.top + plot.height;
  const placed = { above: 0, below: 0 };
  return (
    <figure className="break-inside-avoid space-y-1" data-testid="report-chart" data-gauge={gauge.tag}>
      <svg viewBox={`0 0 ${g.width} ${g.height}`} className="h-auto w-full rounded bg-white" role="img" aria-label={`Stress of ${gauge.tag} over ${report.period.name}`} fontFamily="inherit">
        {g.marks.map((mark) => (
          <g key={mark.number} fill={levelInk(mark.level)} data-alert-mark={mark.number}>
            <rect x={mark.left} y={plot.top} width={mark.right - mark.left} height={plot.height} fillOpacity={0.14} />
            <path d={`M${mark.left - 3} ${plot.top - 8}h6l-3 6Z`} />
            <text x={mark.left + 4} y={plot.top - 4} fontSize={9}>
              {mark.number}
            </text>
          </g>
        ))}
        {g.yTicks.map((tick) => (
          <g key={tick.value}>
            <line x1={plot.left} x2={plot.left + plot.width} y1={tick.y} y2={tick.y} stroke={CHART_INK.grid} strokeWidth={0.6} />
            <text x={plot.left - 4} y={tick.y + 3} fontSize={9} textAnchor="end" fill={CHART_INK.axis}>
              {tick.label}
            </text>
          </g>
        ))}
        {g.xTicks.map((tick) => (
          <g key={tick.x}>
            <line x1={tick.x} x2={tick.x} y1={bottom} y2={bottom + 3} stroke={CHART_INK.axis} />
            {tick.lines.map((line, i) => (
              <text key={i} x={tick.x} y={bottom + 12 + i * 10} fontSize={9} textAnchor="middle" fill={CHART_INK.axis}>
                {line}
              </text>
            ))}
          </g>
        ))}
        {g.bands.map((band, i) => (
          <path key={i} d={pathOf(band, true)} fill={CHART_INK.band} fillOpacity={0.22} />
        ))}
        {g.means.map((mean, i) => (
          <path key={i} d={pathOf(mean)} fill="none" stroke={CHART_INK.mean} strokeWidth={1} />
        ))}
        {g.limits.map((line) => (
          <g key={`${line.text}-${line.y}`} stroke={levelInk(line.level)} fill={levelInk(line.level)} data-limit={line.text}>
            <line x1={plot.left} x2={plot.left + plot.width} y1={line.y} y2={line.y} strokeWidth={1.2} strokeDasharray="5 3" />
            <text x={plot.left + 3} y={line.y - 3} fontSize={9} stroke="none">
              {line.text}
            </text>
          </g>
        ))}
        {g.offScale.map((line) => {
          const slot = placed[line.side]++;
          return (
            <text key={line.label} x={plot.left + plot.width - 3} y={line.side === "above" ? plot.top + 10 + slot * 11 : bottom - 4 - slot * 11} fontSize={9} textAnchor="end" fill={levelInk(line.level)}>
              {line.side === "above" ? "↑" : "↓"} {line.label}
            </text>
          );
        })}
        <rect x={plot.left} y={plot.top} width={plot.width} height={plot.height} fill="none" stroke={CHART_INK.axis} strokeWidth={0.8} />
        <text transform={`translate(12 ${plot.top + plot.height / 2}) rotate(-90)`} fontSize={10} textAnchor="middle" fill={CHART_INK.text}>
          {g.valueLabel}
        </text>
      </svg>
      <figcaption className="text-xs text-slate-600 dark:text-slate-400">
        Band: min to max of each interval; line: mean; breaks where no readings arrived; dashed: the limits; shaded and numbered: the alerts. Times in{" "}
        {report.structure.timezone}.
        {legend.length > 0 && (
          <ol className="mt-1 text-slate-800 dark:text-slate-200">
            {legend.map((line) => (
              <li key={line}>{line}</li>
            ))}
          </ol>
        )}
      </figcaption>
    </figure>
  );
}
