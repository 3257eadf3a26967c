import Link from "next/link";
import { cardClass, tableClass, tdClass, thClass } from "@/components/ui/styles";
import { EmptyState } from "@/components/ui/empty-state";
import type { AlertView } from "@/lib/services/alerts";
import type { UnitSystem } from "@/lib/units";
import { LevelBadge, StateBadge, alertPlaceLabel, alertSummary } from "./alert-badges";
import { formatInTimeZone } from "@/lib/time-format";

const when = (iso: string, timeZone: string) => formatInTimeZone(new Date(iso), timeZone);

export function AlertTable({ alerts, timeZones, units = "si" }: { alerts: AlertView[]; timeZones: Record<string, string>; units?: UnitSystem }) {
  if (alerts.length === 0) {
    return (
      <EmptyState title="No alerts match">
        <p>Nothing has crossed a limit and no sensor fault is recorded for this selection. Check that data are still arriving: a silent logger raises no limit alert.</p>
      </EmptyState>
    );
  }
  return (
    <div className={`${cardClass} overflow-x-auto`}>
      <table className={tableClass} aria-label="Alerts">
        <thead>
          <tr>
            <th className={thClass}>Level</th>
            <th className={thClass}>Where</th>
            <th className={thClass}>What</th>
            <th className={thClass}>Opened (local time)</th>
            <th className={thClass}>State</th>
          </tr>
        </thead>
        <tbody className="divide-y divide-slate-100 dark:divide-slate-800">
          {alerts.map((alert) => (
            <tr key={alert.id} data-testid="alert-row">
              <td className={tdClass}>
                <LevelBadge level={alert.level} />
              </td>
              <td className={tdClass}>
                <Link href={`/alerts/${alert.id}`} className="font-mono font-medium text-accent underline">
                  {alert.structure} / {alertPlaceLabel(alert)}
                </Link>
                <span className="block text-xs text-slate-500">{alert.kind === "sensor" ? "sensor fault" : "limit"}</span>
              </td>
              <td className={tdClass}>{alertSummary(alert, units)}</td>
              <td className={`${tdClass} whitespace-nowrap`}>{when(alert.openedAt, timeZones[alert.structure] ?? "UTC")}</td>
              <td className={tdClass}>
                <StateBadge alert={alert} />
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
