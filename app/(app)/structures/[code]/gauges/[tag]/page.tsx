import type { Metadata } from "next";
import Link from "next/link";
import { GaugeCharts } from "@/components/charts/gauge-charts";
import { DynamicChannel } from "@/components/dynamic/dynamic-channel";
import { EmptyState } from "@/components/ui/empty-state";
import { GaugePhotos } from "@/components/gauges/gauge-photos";
import { GaugeFieldRecords } from "@/components/field-records/gauge-field-records";
import { GaugeSummary } from "@/components/gauges/gauge-summary";
import { ShuntCheckForm } from "@/components/gauges/shunt-check-form";
import { ShuntVerdict } from "@/components/gauges/shunt-verdict";
import { ZeroForm } from "@/components/gauges/zero-form";
import { recordZeroAction } from "../actions";
import { ActionForm } from "@/components/ui/action-form";
import { ConcreteCaution, MonitoringCaution } from "@/components/ui/caution";
import { Field } from "@/components/ui/field";
import { PageHeader } from "@/components/ui/page-header";
import { ConfirmSubmitButton } from "@/components/ui/confirm-submit-button";
import { buttonClass, cardClass, stackedTable, tableClass, tdClass, thClass } from "@/components/ui/styles";
import { may } from "@/lib/auth/authorize";
import { pageGuard } from "@/lib/auth/page-guard";
import { requireUser } from "@/lib/auth/session";
import { actionInWords, describeChange } from "@/lib/audit/describe-change";
import { inputUnit } from "@/lib/gauges/labels";
import { toGaugeConfig } from "@/lib/gauges/schema";
import { formatDifference, formatShuntOutput } from "@/lib/gauges/shunt-display";
import { listShuntChecks } from "@/lib/services/shunt-checks";
import { formatStressRating } from "@/lib/units";
import { listGaugePhotos } from "@/lib/services/files";
import { listAlerts, listGaugeEpisodes } from "@/lib/services/alerts";
import { AlertFilters } from "@/components/alerts/alert-filters";
import { AlertTable } from "@/components/alerts/alert-table";
import { ConditionBadge } from "@/components/alerts/state-badge";
import { Pager } from "@/components/ui/pager";
import { ALERTS_PER_PAGE, alertListParamsOf, pageOffset } from "@/lib/alerting/filters";
import { formatInTimeZone } from "@/lib/time-format";
import { getLimits } from "@/lib/services/limits";
import { findThermalModel } from "@/lib/services/thermal";
import { gaugeStatuses } from "@/lib/services/status";
import { gaugeAuditTrail, getGauge, zeroHistory } from "@/lib/services/gauges";
import { getVisibleStructure } from "@/lib/services/structures";
import { unitsOf } from "@/lib/services/users";
import { recordShuntCheckAction, retireGaugeAction } from "../actions";

type Props = { params: Promise<{ code: string; tag: string }>; searchParams: Promise<Record<string, string | string[] | undefined>> };

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const { code, tag } = await params;
  return { title: `${decodeURIComponent(tag)} · ${code}` };
}

const when = (date: Date | string, timeZone: string) => formatInTimeZone(new Date(date), timeZone);

/** Each changed field on a line of its own: name, old → new, in words and units. */
function ChangeList({ before, after }: { before: unknown; after: unknown }) {
  const changes = describeChange(before, after);
  if (changes.length === 0) return <span className="text-slate-500">no field changed</span>;
  return (
    <ul className="space-y-0.5">
      {changes.map((change) => (
        <li key={change.field} data-testid="audit-change">
          <span className="font-medium">{change.field}:</span> {change.from === "—" ? "" : <>{change.from} → </>}
          {change.to}
        </li>
      ))}
    </ul>
  );
}

export default async function GaugePage({ params, searchParams }: Props) {
  const { code, tag: rawTag } = await params;
  const query = await searchParams;
  const { page, ...filter } = alertListParamsOf(query, { state: "all" });
  // ?event=<id>: an alert's link opens the waveform that raised it.
  const linkedEvent = typeof query.event === "string" && /^[1-9]\d{0,15}$/.test(query.event) ? Number(query.event) : null;
  const tag = decodeURIComponent(rawTag);
  const user = await requireUser();
  const structure = await pageGuard(getVisibleStructure(user, code));
  const gauge = await pageGuard(getGauge(user, code, tag));
  const [canEdit, canZero, canShunt, canAudit, canLabel] = await Promise.all([
    may(user, "gauge:register", structure),
    may(user, "zero:record", structure),
    may(user, "shunt-check:record", structure),
    may(user, "audit:view", structure),
    may(user, "alert:acknowledge", structure),
  ]);
  const [zeros, shuntChecks, audit, photos, limits, alerts, episodes, statuses, units, thermalModel] = await Promise.all([
    zeroHistory(user, code, tag),
    listShuntChecks(user, code, tag),
    canAudit ? gaugeAuditTrail(user, code, tag) : Promise.resolve([]),
    listGaugePhotos(user, code, tag),
    getLimits(user, code, tag),
    listAlerts(user, code, { ...filter, gauge: tag, limit: ALERTS_PER_PAGE, offset: pageOffset(page) }),
    listGaugeEpisodes(user, code, tag),
    gaugeStatuses(structure),
    unitsOf(user.id),
    findThermalModel(user, code, tag),
  ]);
  const status = statuses.find((candidate) => candidate.tag === gauge.tag)!;
  const latest = status.latest;
  const chartEvents = [
    ...zeros.slice(0, -1).map((zero) => ({ time: zero.time.getTime(), label: "re-zeroed" })),
    ...(gauge.replaces ? [{ time: Date.parse(gauge.createdAt), label: `replaced ${gauge.replaces}` }] : []),
  ];
  const active = gauge.status === "active";
  const shuntApplies = gauge.kind === "foil" && gauge.bridge != null;
  const base = `/structures/${code}/gauges`;
  return (
    <>
      <PageHeader
        title={`Gauge ${gauge.tag}`}
        subtitle={
          <>
            {[gauge.label, gauge.member].filter(Boolean).join(" · ") || "No location recorded"} ·{" "}
            <Link href={`/structures/${code}`} className="text-accent underline">
              {structure.name}
            </Link>
          </>
        }
        actions={
          <>
            <Link href={`${base}/${encodeURIComponent(tag)}/limits`} className={buttonClass("secondary")}>
              Limits
            </Link>
            <Link href={`${base}/${encodeURIComponent(tag)}/thermal`} className={buttonClass("secondary")}>
              Thermal model
            </Link>
            {active && canEdit && (
            <>
              <Link href={`${base}/${encodeURIComponent(tag)}/edit`} className={buttonClass("secondary")}>
                Edit
              </Link>
              <Link href={`${base}/${encodeURIComponent(tag)}/replace`} className={buttonClass("secondary")}>
                Replace
              </Link>
            </>
            )}
          </>
        }
      />
      <div className="mb-6 flex flex-wrap items-center gap-2 text-sm" data-testid="gauge-status">
        <ConditionBadge condition={status.condition} retired={status.retired} />
        {!status.retired && status.condition.since !== null && (
          <span className="text-slate-600 dark:text-slate-400">since {formatInTimeZone(new Date(status.condition.since), structure.timezone)}</span>
        )}
        {status.condition.state === "sensor-fault" && (
          <span className="font-medium text-critical">Its readings are in doubt: check the gauge, its bond and the logger channel before trusting them.</span>
        )}
        <span className={`rounded-full px-2.5 py-0.5 font-medium ${active ? "bg-emerald-100 text-emerald-900 dark:bg-emerald-950 dark:text-emerald-200" : "bg-slate-200 text-slate-700 dark:bg-slate-800 dark:text-slate-300"}`}>
          {active ? "Active" : `Retired ${gauge.retiredAt ? when(gauge.retiredAt, structure.timezone) : ""}`}
        </span>
        {latest?.rating && (
          <span data-testid="gauge-utilisation">
            Utilisation at the latest reading: <span className="font-medium">{formatStressRating(latest.rating)}</span>
          </span>
        )}
        {gauge.replaces && (
          <span>
            Replaced gauge{" "}
            <Link className="text-accent underline" href={`${base}/${encodeURIComponent(gauge.replaces)}`}>
              {gauge.replaces}
            </Link>{" "}
            at this location on {when(gauge.createdAt, structure.timezone)}.
          </span>
        )}
        {gauge.replacedBy && (
          <span>
            Replaced by{" "}
            <Link className="text-accent underline" href={`${base}/${encodeURIComponent(gauge.replacedBy)}`}>
              {gauge.replacedBy}
            </Link>
            .
          </span>
        )}
      </div>
      {gauge.sampling.mode === "dynamic" && (
        <DynamicChannel
          apiBase={`/api/v1/structures/${code}/gauges/${encodeURIComponent(tag)}`}
          structureApi={`/api/v1/structures/${code}`}
          timeZone={structure.timezone}
          // eslint-disable-next-line react-hooks/purity -- a server component renders once per request: now is that request's time
          end={latest ? latest.time : Date.now()}
          canLabel={canLabel}
          rateHz={gauge.sampling.rateHz}
          summaryMinutes={gauge.sampling.summaryMinutes}
          initialEvent={linkedEvent}
        />
      )}
      <section className="mb-6" aria-labelledby="history">
        <h2 id="history" className="mb-2 text-lg font-semibold">
          History
        </h2>
        {episodes.total > episodes.episodes.length && (
          <p className="mb-2 text-sm text-slate-600 dark:text-slate-400" data-testid="episodes-drawn">
            The charts shade the {episodes.episodes.length.toLocaleString("en-US")} newest of {episodes.total.toLocaleString("en-US")} alert episodes of this
            gauge; the list below has them all.
          </p>
        )}
        {latest ? (
          <GaugeCharts
            structureCode={code}
            structureName={structure.name}
            tag={tag}
            timeZone={structure.timezone}
            limits={limits}
            yieldStress={gauge.material.yield ?? null}
            episodes={episodes.episodes}
            events={chartEvents}
            end={latest.time}
            expectedIntervalS={gauge.expectedInterval}
            residualStd={thermalModel?.residualStd ?? null}
          />
        ) : (
          <EmptyState title="No readings yet">
            <p>Charts appear once the logger sends data or a logger file is uploaded.</p>
          </EmptyState>
        )}
      </section>
      <section className="mb-6" aria-labelledby="gauge-alerts">
        <h2 id="gauge-alerts" className="mb-2 text-lg font-semibold">
          Alerts on this gauge
        </h2>
        <AlertFilters {...filter} />
        <AlertTable alerts={alerts.alerts} timeZones={{ [structure.code]: structure.timezone }} units={units} />
        <Pager total={alerts.total} page={page} perPage={ALERTS_PER_PAGE} query={filter} noun="alerts" />
      </section>
      <div className="grid gap-6 lg:grid-cols-2">
        <section className={`${cardClass} p-4`} aria-labelledby="configuration">
          <h2 id="configuration" className="mb-3 font-semibold">
            Configuration
          </h2>
          <GaugeSummary gauge={gauge} />
          <Link href={`${base}/${encodeURIComponent(tag)}/fatigue`} className="mt-4 inline-block text-sm text-accent underline">
            Fatigue damage and life
          </Link>
        </section>
        <section className={`${cardClass} space-y-4 p-4`} aria-labelledby="zero">
          <h2 id="zero" className="font-semibold">
            Zero reading
          </h2>
          <p className="text-sm">
            In force: <span className="font-mono">{gauge.zero.value} {inputUnit(gauge.input)}</span>
            {gauge.zero.temperature != null && <> at {gauge.zero.temperature} °C</>}, read {when(gauge.zero.time!, structure.timezone)}. Strain is measured from this state;
            stress already present then is the initial stress above.
          </p>
          {active && canZero && <ZeroForm structureCode={code} tag={tag} rawUnit={inputUnit(gauge.input)} timeZone={structure.timezone} recordZero={recordZeroAction} />}
          <div className="overflow-x-auto">
            <table className={tableClass} aria-label="Zero history">
              <thead>
                <tr>
                  <th className={thClass}>Set</th>
                  <th className={thClass}>Value</th>
                  <th className={thClass}>Temp.</th>
                  <th className={thClass}>Why</th>
                </tr>
              </thead>
              <tbody className="divide-y divide-slate-100 dark:divide-slate-800">
                {zeros.map((zero) => (
                  <tr key={zero.id} data-testid="zero-row">
                    <td className={tdClass}>
                      {when(zero.setAt, structure.timezone)}
                      <span className="block text-xs text-slate-500">{zero.setByLabel}</span>
                    </td>
                    <td className={`${tdClass} font-mono`}>
                      {zero.value.toLocaleString("en-US", { maximumFractionDigits: 6 })} {inputUnit(gauge.input)}
                      <span className="block font-sans text-xs text-slate-500">read {when(zero.time, structure.timezone)}</span>
                    </td>
                    <td className={tdClass}>{zero.temperature != null ? `${zero.temperature.toFixed(1)} °C` : "—"}</td>
                    <td className={tdClass}>
                      {zero.reason}
                      <span className="block text-xs text-slate-500">{zero.source}</span>
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </section>
      </div>
      <section className={`${cardClass} mt-6 space-y-4 p-4`} aria-labelledby="shunt-checks">
        <h2 id="shunt-checks" className="font-semibold">
          Shunt checks
        </h2>
        <p className="text-sm text-slate-600 dark:text-slate-400">
          A known resistor placed across the gauge lowers its arm by ΔR/R = R_g/(R_g + R_shunt) (leads in the arm included), so the bridge should show a
          known output: a check that the gauge, its leads, the bridge completion and the logger channel still read as configured.
        </p>
        {!shuntApplies ? (
          <p className="text-sm" data-testid="shunt-not-applicable">
            Shunt checks apply to foil gauges with a bridge arrangement recorded; this gauge has none, so there is no bridge to shunt.
          </p>
        ) : (
          active &&
          canShunt && (
            <ShuntCheckForm structureCode={code} tag={tag} unit={inputUnit(gauge.input)} config={toGaugeConfig(gauge)} timeZone={structure.timezone} recordShuntCheck={recordShuntCheckAction} />
          )
        )}
        {shuntChecks.length === 0 ? (
          <p className="text-sm text-slate-600 dark:text-slate-400">No shunt checks recorded yet.</p>
        ) : (
          <table className={stackedTable.table} aria-label="Shunt check history">
            <thead className={stackedTable.head}>
              <tr>
                <th className={thClass}>Applied</th>
                <th className={thClass}>Shunt</th>
                <th className={thClass}>Measured</th>
                <th className={thClass}>Expected</th>
                <th className={thClass}>Difference</th>
                <th className={thClass}>Result</th>
              </tr>
            </thead>
            <tbody className={stackedTable.body}>
              {shuntChecks.map((check) => (
                <tr key={check.id} data-testid="shunt-row" className={stackedTable.row}>
                  <td className={`${stackedTable.cell} whitespace-nowrap`} data-label="Applied">
                    {formatInTimeZone(new Date(check.time), structure.timezone)}
                    <span className="block text-xs text-slate-500">{check.checkedBy}</span>
                  </td>
                  <td className={`${stackedTable.cell} font-mono`} data-label="Shunt">
                    {check.shuntResistance.toLocaleString("en-US")} Ω
                  </td>
                  <td className={`${stackedTable.cell} font-mono`} data-label="Measured">
                    {formatShuntOutput(check.measuredOutput, inputUnit(check.unit))}
                  </td>
                  <td className={`${stackedTable.cell} font-mono`} data-label="Expected">
                    {formatShuntOutput(check.expectedOutput, inputUnit(check.unit))}
                  </td>
                  <td className={`${stackedTable.cell} font-mono`} data-label="Difference">
                    {formatDifference(check.differencePercent)}
                    <span className="block font-sans text-xs text-slate-500">tolerance ±{check.tolerancePercent} %</span>
                  </td>
                  <td className={stackedTable.cell} data-label="Result">
                    <ShuntVerdict passed={check.passed} />
                    {check.note && <span className="mt-1 block text-xs">{check.note}</span>}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </section>
      <div className="mt-6">
        <GaugePhotos structureCode={code} tag={tag} timeZone={structure.timezone} canUpload={active && canEdit} initialPhotos={photos} />
      </div>
      <GaugeFieldRecords user={user} code={code} tag={gauge.tag} timeZone={structure.timezone} />
      {canAudit && (
        <section className={`${cardClass} mt-6 p-4`} aria-labelledby="audit">
          <h2 id="audit" className="mb-3 font-semibold">
            Changes to this location&apos;s gauges
          </h2>
          {audit.length === 0 ? (
            <p className="text-sm text-slate-600 dark:text-slate-400">No changes recorded yet: edits, zeros, limits and replacements at this location will be listed here.</p>
          ) : (
            <table className={stackedTable.table}>
              <thead className={stackedTable.head}>
                <tr>
                  <th className={thClass}>When</th>
                  <th className={thClass}>Who</th>
                  <th className={thClass}>What</th>
                  <th className={thClass}>Old → new</th>
                </tr>
              </thead>
              <tbody className={stackedTable.body}>
                {audit.map((entry) => (
                  <tr key={entry.id} data-testid="audit-row" className={stackedTable.row}>
                    <td className={`${stackedTable.cell} whitespace-nowrap`} data-label="When">
                      {when(entry.at, structure.timezone)}
                    </td>
                    <td className={stackedTable.cell} data-label="Who">
                      {entry.actorLabel}
                    </td>
                    <td className={stackedTable.cell} data-label="What">
                      <span title={entry.action}>{actionInWords(entry.action)}</span> <span className="font-mono text-xs">{entry.entityKey.split("/")[1]}</span>
                    </td>
                    <td className={`${stackedTable.cell} max-w-md break-words text-xs`} data-label="Old → new">
                      <ChangeList before={entry.before} after={entry.after} />
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          )}
        </section>
      )}
      {active && canEdit && (
        <section className={`${cardClass} mt-6 p-4`} aria-labelledby="retire">
          <h2 id="retire" className="mb-2 font-semibold">
            Retire this gauge
          </h2>
          <p className="mb-3 text-sm text-slate-600 dark:text-slate-400">
            A retired gauge accepts no more readings; its record and data are kept. To put a new gauge in its place, use Replace instead.
          </p>
          <ActionForm action={retireGaugeAction} className="flex flex-wrap items-end gap-3" label="Retire gauge">
            <input type="hidden" name="code" value={code} />
            <input type="hidden" name="tag" value={tag} />
            <Field name="reason" label="Why" required />
            <ConfirmSubmitButton question={`Retire ${tag}? It accepts no more readings.`} confirmLabel="Yes, retire" pendingLabel="Retiring…">
              Retire
            </ConfirmSubmitButton>
          </ActionForm>
        </section>
      )}
      <div className="mt-6">
        <MonitoringCaution>{gauge.material.compressiveStrength ? <ConcreteCaution /> : null}</MonitoringCaution>
      </div>
    </>
  );
}
