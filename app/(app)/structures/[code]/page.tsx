import { Suspense } from "react";
import type { Metadata } from "next";
import Link from "next/link";
import { AlertTable } from "@/components/alerts/alert-table";
import { StructureDrawings } from "@/components/drawings/structure-drawings";
import { CertificatesSection } from "@/components/field-records/certificates-section";
import { GaugeTable, type GaugeTableRow } from "@/components/gauges/gauge-table";
import { RosetteSection } from "@/components/gauges/rosette-section";
import { TokenTable } from "@/components/tokens/token-table";
import { ActionForm, SecretOnce } from "@/components/ui/action-form";
import { EmptyState } from "@/components/ui/empty-state";
import { ConcreteCaution, MonitoringCaution } from "@/components/ui/caution";
import { Field } from "@/components/ui/field";
import { PageHeader } from "@/components/ui/page-header";
import { ChartSkeleton } from "@/components/ui/skeleton";
import { SubmitButton } from "@/components/ui/submit-button";
import { buttonClass, cardClass, inputClass } from "@/components/ui/styles";
import { createTokenAction } from "@/lib/actions/token-actions";
import { may } from "@/lib/auth/authorize";
import { receivesAlertMail } from "@/lib/auth/permissions";
import { pageGuard } from "@/lib/auth/page-guard";
import { requireUser } from "@/lib/auth/session";
import { listAlerts } from "@/lib/services/alerts";
import { listGauges, type GaugeView } from "@/lib/services/gauges";
import { gaugeStatuses, type GaugeStatus } from "@/lib/services/status";
import { conditionText, shownState } from "@/lib/alerting/condition-display";
import { listRosettes } from "@/lib/services/rosettes";
import { getVisibleStructure } from "@/lib/services/structures";
import { listLoggerTokens } from "@/lib/services/tokens";
import { alertMailModeOf } from "@/lib/services/memberships";
import { unitsOf } from "@/lib/services/users";
import { alertMailAction, createRosetteAction } from "./gauges/actions";

type Props = { params: Promise<{ code: string }> };

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  return { title: (await params).code };
}

function Section({ title, id, children, actions }: { title: string; id: string; children: React.ReactNode; actions?: React.ReactNode }) {
  return (
    <section className="space-y-3" aria-labelledby={id}>
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 id={id} className="text-lg font-semibold">
          {title}
        </h2>
        {actions}
      </div>
      {children}
    </section>
  );
}

const KIND_TEXT: Record<string, string> = { foil: "foil", "vibrating-wire": "vibrating wire" };

/** Gauges with their latest readings, as plain values for the table in the browser. */
function gaugeTableRows(gauges: GaugeView[], statuses: GaugeStatus[]): GaugeTableRow[] {
  const statusOf = new Map(statuses.map((status) => [status.tag, status]));
  return gauges.map((gauge) => {
    const status = statusOf.get(gauge.tag)!;
    const latest = status.latest;
    return {
      tag: gauge.tag,
      label: gauge.label ?? null,
      member: gauge.member ?? null,
      sensor: `${KIND_TEXT[gauge.kind]}, ${gauge.input}${gauge.bridge ? `, ${gauge.bridge}` : ""}`,
      condition: status.condition,
      retired: status.retired,
      openAlerts: status.openAlerts,
      time: latest?.time ?? null,
      strain: latest?.strain ?? null,
      stress: latest?.stress ?? null,
      rating: latest?.rating ?? null,
      temperature: latest?.temperature ?? null,
    };
  });
}

export default async function StructurePage({ params }: Props) {
  const { code } = await params;
  const user = await requireUser();
  const structure = await pageGuard(getVisibleStructure(user, code));
  const [gauges, statuses, rosettes, recentAlerts, canRegister, canManageTokens, canIngest] = await Promise.all([
    listGauges(user, code),
    gaugeStatuses(structure),
    listRosettes(user, code),
    listAlerts(user, code, { state: "all", level: "any", kind: "any", limit: 8 }),
    may(user, "gauge:register", structure),
    may(user, "token:manage", structure),
    may(user, "readings:ingest", structure),
  ]);
  const rows = gaugeTableRows(gauges, statuses);
  const tokens = canManageTokens ? await listLoggerTokens(user, code) : [];
  const [mailMode, units] = await Promise.all([alertMailModeOf(user.id, structure.id), unitsOf(user.id)]);
  return (
    <div className="space-y-8">
      <PageHeader
        title={structure.name}
        actions={
          <>
            <Link href={`/structures/${code}/report`} className={buttonClass("secondary")}>
              Report
            </Link>
            <Link href={`/structures/${code}/load-tests`} className={buttonClass("secondary")}>
              Load tests
            </Link>
            <Link href={`/structures/${code}/certificates`} className={buttonClass("secondary")}>
              Certificates
            </Link>
            <Link href={`/structures/${code}/site-visits`} className={buttonClass("secondary")}>
              Site visits
            </Link>
            {canIngest && (
              <Link href={`/structures/${structure.code}/upload`} className={buttonClass("secondary")}>
                Upload logger file
              </Link>
            )}
          </>
        }
        subtitle={
          <>
            <span className="font-mono">{structure.code}</span>
            {structure.location && <> · {structure.location}</>} · times shown in {structure.timezone}
          </>
        }
      />
      {structure.description && <p className="-mt-4 max-w-prose text-sm">{structure.description}</p>}
      <Section
        title="Gauges"
        id="gauges-heading"
        actions={
          <>
            {gauges.length > 1 && (
              <Link href={`/structures/${code}/compare`} className={buttonClass("secondary")}>
                Compare gauges
              </Link>
            )}
            {canRegister && (
              <Link href={`/structures/${code}/gauges/new`} className={buttonClass()}>
                Register a gauge
              </Link>
            )}
          </>
        }
      >
        {gauges.length === 0 ? (
          <EmptyState title="No gauges registered on this structure yet">
            <p>Register each gauge as it is installed; once its logger sends readings, its strain, stress and state show here.</p>
          </EmptyState>
        ) : (
          <GaugeTable structureCode={code} timeZone={structure.timezone} rows={rows} />
        )}
      </Section>
      <Section
        title="Recent alerts"
        id="alerts-heading"
        actions={
          <Link href={`/alerts?state=all`} className="text-sm font-medium text-accent underline">
            All alerts
          </Link>
        }
      >
        <AlertTable alerts={recentAlerts.alerts} timeZones={{ [structure.code]: structure.timezone }} units={units} />
        {recentAlerts.total > recentAlerts.alerts.length && (
          <p className="text-sm text-slate-600 dark:text-slate-400" data-testid="recent-alerts-count">
            The {recentAlerts.alerts.length} newest of {recentAlerts.total.toLocaleString("en-US")} alerts on this structure.
          </p>
        )}
        {mailMode && receivesAlertMail(user.role) && (
          <ActionForm action={alertMailAction} className="flex flex-wrap items-end gap-3" label="My alert e-mails">
            <input type="hidden" name="code" value={structure.code} />
            <Field name="mode" label="My alert e-mails for this structure" id="alert-mail-mode">
              <select id="alert-mail-mode" name="mode" defaultValue={mailMode.alerts} className={`${inputClass} w-64`}>
                <option value="immediate">Each alert as it happens</option>
                <option value="digest">One digest a day</option>
              </select>
            </Field>
            <Field name="sensorMode" label="Sensor faults (a gauge, not the structure)" id="sensor-mail-mode">
              <select id="sensor-mail-mode" name="sensorMode" defaultValue={mailMode.sensor} className={`${inputClass} w-64`}>
                <option value="immediate">Each as it happens</option>
                <option value="digest">In the daily digest</option>
              </select>
            </Field>
            <SubmitButton variant="secondary" pendingLabel="Saving…">Save</SubmitButton>
          </ActionForm>
        )}
      </Section>
      <Suspense fallback={<ChartSkeleton />}>
        <StructureDrawings
          user={user}
          structure={structure}
          markers={rows.map((row, i) => ({
            tag: row.tag,
            placement: gauges[i]!.drawing,
            state: shownState(row.condition, row.retired),
            stateText: conditionText(row.condition, row.retired),
          }))}
        />
      </Suspense>
      <Suspense fallback={<ChartSkeleton />}>
        <CertificatesSection user={user} code={structure.code} />
      </Suspense>
      <Section title="Rosettes" id="rosettes-heading">
        <div className={`${cardClass} p-4`}>
          <RosetteSection structureCode={code} rosettes={rosettes} gauges={gauges} canEdit={canRegister} createRosette={createRosetteAction} />
        </div>
      </Section>
      {canManageTokens && (
        <Section title="Logger tokens" id="tokens-heading">
          <p className="text-sm text-slate-600 dark:text-slate-400">
            A logger token may only send readings to {structure.code}. Create one per logger; revoke it when the logger is removed.
          </p>
          <div className="grid gap-4 lg:grid-cols-[1fr_20rem]">
            {tokens.length === 0 ? <EmptyState title="No logger tokens yet" /> : <TokenTable tokens={tokens} />}
            <ActionForm action={createTokenAction} className={`${cardClass} h-fit space-y-3 p-4`} label="Create a logger token">
              <input type="hidden" name="kind" value="logger" />
              <input type="hidden" name="structure" value={structure.code} />
              <Field name="name" label="Logger name" required hint="e.g. “logger at pier 2”" />
              <SubmitButton pendingLabel="Creating…">Create logger token</SubmitButton>
              <SecretOnce label="The new token (shown only now):" />
            </ActionForm>
          </div>
        </Section>
      )}
      <MonitoringCaution>{gauges.some((gauge) => gauge.material.compressiveStrength) && <ConcreteCaution />}</MonitoringCaution>
    </div>
  );
}
