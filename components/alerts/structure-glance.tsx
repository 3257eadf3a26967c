import { formatDistanceStrict } from "date-fns";
import type { StructureSummary } from "@/lib/services/status";
import { formatShareOfYield } from "@/lib/units";
import { CONDITION_STATES } from "@/lib/alerting/condition";
import { STATE_LOOK } from "@/lib/alerting/condition-display";
import { ConditionBadge } from "./state-badge";
import { formatInTimeZone } from "@/lib/time-format";

/** What an owner needs at a glance: the worst state, what is open, how hard it worked, how fresh the data are. */
export function StructureGlance({ summary, timeZone }: { summary: StructureSummary; timeZone: string }) {
  const local = (ms: number) => formatInTimeZone(ms, timeZone);
  const open = summary.openAlerts;
  return (
    <div className="mt-3 space-y-2 text-sm" data-testid="structure-glance">
      <div className="flex flex-wrap items-center gap-2">
        <ConditionBadge condition={{ state: summary.state, faults: [], stale: false }} />
        {summary.stale && (
          <span className="text-xs font-semibold text-critical" data-testid="stale-mark">
            Data stopped arriving — this is not an all clear
          </span>
        )}
      </div>
      <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-0.5 text-xs">
        <dt className="text-slate-500 dark:text-slate-400">Open alerts</dt>
        <dd>
          {open.critical + open.warning + open.watch === 0 ? "none" : `${open.critical} critical, ${open.warning} warning, ${open.watch} watch`}
          {summary.sensorAlerts > 0 && `; ${summary.sensorAlerts} sensor`}
        </dd>
        <dt className="text-slate-500 dark:text-slate-400">Peak, last 24 h</dt>
        <dd>
          {formatShareOfYield(summary.peakUtilisation24h)}
          {summary.peakLeavesOut > 0 && ` (${summary.peakLeavesOut === 1 ? "1 gauge" : `${summary.peakLeavesOut} gauges`} in sensor fault left out)`}
        </dd>
        <dt className="text-slate-500 dark:text-slate-400">Last reading</dt>
        <dd>
          {summary.lastReadingAt === null
            ? "none yet"
            // eslint-disable-next-line react-hooks/purity -- a server component renders once per request: now is that request's time
            : `${local(summary.lastReadingAt)} (${formatDistanceStrict(summary.lastReadingAt, Date.now(), { addSuffix: true })})`}
        </dd>
        <dt className="text-slate-500 dark:text-slate-400">Gauges</dt>
        <dd data-testid="gauges-by-condition">
          {summary.gaugeCount} active
          {CONDITION_STATES.filter((state) => summary.gaugesIn[state]).map((state) => ` · ${summary.gaugesIn[state]} ${STATE_LOOK[state].word.toLowerCase()}`)} · times in{" "}
          {timeZone}
        </dd>
      </dl>
    </div>
  );
}
