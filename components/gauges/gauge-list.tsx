import Link from "next/link";
import { format } from "date-fns";
import { cardClass, tableClass, tdClass, thClass } from "@/components/ui/styles";
import type { GaugeView } from "@/lib/services/gauges";

const KIND_TEXT: Record<string, string> = { foil: "Foil", "vibrating-wire": "Vibrating wire" };

/** The structure's gauges, active first, with where they are and how they are read. */
export function GaugeList({ structureCode, gauges }: { structureCode: string; gauges: GaugeView[] }) {
  const ordered = [...gauges].sort((a, b) => Number(a.status === "retired") - Number(b.status === "retired") || a.tag.localeCompare(b.tag));
  return (
    <div className={`${cardClass} overflow-x-auto`}>
      <table className={tableClass} aria-label="Gauges">
        <thead>
          <tr>
            <th className={thClass}>Tag</th>
            <th className={thClass}>Where</th>
            <th className={thClass}>Sensor</th>
            <th className={thClass}>Zeroed</th>
            <th className={thClass}>State</th>
          </tr>
        </thead>
        <tbody className="divide-y divide-slate-100 dark:divide-slate-800">
          {ordered.map((gauge) => (
            <tr key={gauge.tag} data-testid="gauge-row" className={gauge.status === "retired" ? "text-slate-500" : ""}>
              <td className={tdClass}>
                <Link href={`/structures/${structureCode}/gauges/${encodeURIComponent(gauge.tag)}`} className="font-mono font-medium text-accent underline">
                  {gauge.tag}
                </Link>
              </td>
              <td className={tdClass}>
                {gauge.label ?? "—"}
                {gauge.member && <span className="block text-xs text-slate-500">{gauge.member}</span>}
              </td>
              <td className={tdClass}>
                {KIND_TEXT[gauge.kind]}, {gauge.input}
                {gauge.bridge && <span className="block text-xs text-slate-500">{gauge.bridge} bridge</span>}
              </td>
              <td className={`${tdClass} whitespace-nowrap`}>{gauge.zero.time ? format(new Date(gauge.zero.time), "yyyy-MM-dd") : "—"}</td>
              <td className={tdClass}>
                {gauge.status === "retired" ? `retired${gauge.replacedBy ? `, replaced by ${gauge.replacedBy}` : ""}` : "active"}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
