import type { Metadata } from "next";
import { unitsOf } from "@/lib/services/users";
import Link from "next/link";
import { LevelBadge, StateBadge, alertPlaceLabel, alertSummary } from "@/components/alerts/alert-badges";
import { RosetteCharts } from "@/components/charts/rosette-charts";
import { ActionForm } from "@/components/ui/action-form";
import { MonitoringCaution } from "@/components/ui/caution";
import { Field } from "@/components/ui/field";
import { PageHeader } from "@/components/ui/page-header";
import { SubmitButton } from "@/components/ui/submit-button";
import { cardClass, inputClass } from "@/components/ui/styles";
import { may } from "@/lib/auth/authorize";
import { pageGuard } from "@/lib/auth/page-guard";
import { requireUser } from "@/lib/auth/session";
import { getAlert } from "@/lib/services/alerts";
import { alertWaveforms } from "@/lib/services/dynamic-data";
import { getGauge } from "@/lib/services/gauges";
import { getLimits } from "@/lib/services/limits";
import { getRosetteLimits } from "@/lib/services/rosette-limits";
import { GaugeCharts } from "@/components/charts/gauge-charts";
import { getVisibleStructure } from "@/lib/services/structures";
import { handleAlertAction, resolveFaultAction } from "../actions";
import { formatInTimeZone } from "@/lib/time-format";

type Props = { params: Promise<{ id: string }> };

const DAY_MS = 86_400_000;

export const metadata: Metadata = { title: "Alert" };

export default async function AlertPage({ params }: Props) {
  const id = Number((await params).id);
  const user = await requireUser();
  const { alert, history } = await pageGuard(Number.isInteger(id) ? getAlert(user, id) : Promise.reject(new Error("bad id")));
  const structure = await pageGuard(getVisibleStructure(user, alert.structure));
  const [canHandle, canZero, gauge, limits, rosetteLimits, waveforms] = await Promise.all([
    may(user, "alert:acknowledge", structure),
    may(user, "zero:record", structure),
    getGauge(user, structure.code, alert.gauge),
    getLimits(user, structure.code, alert.gauge),
    alert.rosette ? getRosetteLimits(user, structure.code, alert.rosette) : [],
    alert.kind === "limit" && !alert.rosette ? alertWaveforms(user, structure.code, alert.gauge, alert) : [],
  ]);
  const isHeldJump = alert.kind === "sensor" && alert.code === "jump" && !alert.clearedAt;
  const openedAt = Date.parse(alert.openedAt);
  const clearedAt = alert.clearedAt ? Date.parse(alert.clearedAt) : null;
  // A day either side of the episode, or up to now while it lasts.
  // eslint-disable-next-line react-hooks/purity -- a server component renders once per request: now is that request's time
  const around = { from: openedAt - DAY_MS, to: Math.min(Date.now(), (clearedAt ?? Date.now()) + DAY_MS) };
  const local = (date: Date | string) => formatInTimeZone(new Date(date), structure.timezone, { precision: "second" });
  return (
    <>
      <PageHeader
        title={`Alert on ${alertPlaceLabel(alert)}`}
        subtitle={
          <>
            <Link className="text-accent underline" href={`/structures/${structure.code}`}>
              {structure.name}
            </Link>{" "}
            · opened {local(alert.openedAt)} ({structure.timezone})
          </>
        }
      />
      <div className="grid gap-6 lg:grid-cols-[1fr_22rem]">
        <section className={`${cardClass} space-y-4 p-4`} aria-labelledby="what">
          <h2 id="what" className="flex items-center gap-2 font-semibold">
            <LevelBadge level={alert.level} /> <StateBadge alert={alert} />
          </h2>
          <p>{alertSummary(alert, await unitsOf(user.id))}</p>
          {isHeldJump && (
            <p role="status" className="rounded border border-warning/50 bg-orange-50 p-2 text-sm dark:bg-orange-950/40">
              Limits are not being checked on gauge {alert.gauge}: its readings from the jump on are set aside as faulty until an engineer
              accepts the step as real or records a new zero.
            </p>
          )}
          {alert.flappingSince && (
            <p className="text-sm">
              Flapping since {local(alert.flappingSince)}: opened {alert.openings} times; its crossings are e-mailed as one episode.
            </p>
          )}
          <p className="text-sm">
            {alert.rosette ? (
              <Link className="text-accent underline" href={`/structures/${structure.code}/rosettes/${encodeURIComponent(alert.rosette)}`}>
                Open rosette {alert.rosette}
              </Link>
            ) : (
              <Link className="text-accent underline" href={`/structures/${structure.code}/gauges/${encodeURIComponent(alert.gauge)}`}>
                Open gauge {alert.gauge}
              </Link>
            )}
          </p>
          {waveforms.length > 0 && (
            <ul className="space-y-1 text-sm" aria-label="Waveforms of this alert" data-testid="alert-waveforms">
              {waveforms.map((waveform) => (
                <li key={waveform.id}>
                  <Link
                    className="text-accent underline"
                    href={`/structures/${structure.code}/gauges/${encodeURIComponent(alert.gauge)}?event=${waveform.id}#dynamic`}
                  >
                    Waveform of event {waveform.id}
                  </Link>{" "}
                  <span className="text-slate-500">(holds the {waveform.holds})</span>
                </li>
              ))}
            </ul>
          )}
          <h3 className="font-semibold">History</h3>
          <ol className="space-y-2 text-sm" aria-label="Alert history">
            {history.map((event) => (
              <li key={event.id} data-testid="alert-event" className="border-l-2 border-slate-300 pl-3 dark:border-slate-600">
                <span className="font-medium">{event.type}</span> {event.level && <>at {event.level} </>}· {local(event.at)}
                {event.byLabel && <span className="text-slate-500"> · {event.byLabel}</span>}
                {event.text && <p className="mt-0.5">{event.text}</p>}
              </li>
            ))}
          </ol>
        </section>
        <aside className="space-y-4">
          {!alert.clearedAt && canHandle && !alert.acknowledgedAt && (
            <ActionForm action={handleAlertAction} className={`${cardClass} space-y-3 p-4`} label="Acknowledge">
              <input type="hidden" name="alertId" value={alert.id} />
              <input type="hidden" name="handling" value="acknowledged" />
              <Field name="text" label="Acknowledge with a comment" hint="What was checked, and what happens next." required />
              <SubmitButton pendingLabel="Saving…">Acknowledge</SubmitButton>
            </ActionForm>
          )}
          <ActionForm action={handleAlertAction} className={`${cardClass} space-y-3 p-4`} label="Add a note">
            <input type="hidden" name="alertId" value={alert.id} />
            <input type="hidden" name="handling" value="note" />
            <Field name="text" label="Note" id="alert-note">
              <textarea id="alert-note" name="text" rows={3} className={inputClass} />
            </Field>
            <SubmitButton variant="secondary" pendingLabel="Saving…">Add note</SubmitButton>
          </ActionForm>
          {isHeldJump && canHandle && (
            <ActionForm action={resolveFaultAction} className={`${cardClass} space-y-3 p-4`} label="Resolve the jump">
              <input type="hidden" name="alertId" value={alert.id} />
              <fieldset className="space-y-2 text-sm">
                <legend className="font-semibold">Resolve the jump</legend>
                <label className="flex items-start gap-2">
                  <input type="radio" name="resolution" value="accept-step" defaultChecked />
                  <span>Accept the step as real: the structure moved; check the set-aside readings against the limits.</span>
                </label>
                {canZero && (
                  <label className="flex items-start gap-2">
                    <input type="radio" name="resolution" value="new-zero" />
                    <span>Record a new zero at the jump: the gauge&apos;s reference moved; the readings between stay set aside.</span>
                  </label>
                )}
              </fieldset>
              <Field name="text" label="What was checked" hint="On site or on the chart; kept in the alert's history." required />
              <SubmitButton pendingLabel="Resolving…">Resolve</SubmitButton>
            </ActionForm>
          )}
          {!alert.clearedAt && canHandle && !isHeldJump && (
            <ActionForm action={handleAlertAction} className={`${cardClass} space-y-3 p-4`} label="Clear by hand">
              <input type="hidden" name="alertId" value={alert.id} />
              <input type="hidden" name="handling" value="cleared" />
              <Field name="text" label="Clear by hand" hint="For a repaired sensor or a cause dealt with; limit alerts also clear by themselves." required />
              <SubmitButton variant="danger" pendingLabel="Clearing…">Clear</SubmitButton>
            </ActionForm>
          )}
        </aside>
      </div>
      <section className="mt-6" aria-labelledby="around">
        <h2 id="around" className="mb-2 text-lg font-semibold">
          Around the event
        </h2>
        {/* a rosette's alert is about its derived stresses, which gauge a's chart and limits do not show */}
        {alert.rosette ? (
          <RosetteCharts
            structureCode={structure.code}
            tag={alert.rosette}
            end={around.to}
            timeZone={structure.timezone}
            limits={rosetteLimits}
            episodes={alert.kind === "limit" && alert.quantity ? [{ quantity: alert.quantity, openedAt, clearedAt, level: alert.level }] : []}
            events={[{ time: openedAt, label: "opened" }]}
          />
        ) : (
          <GaugeCharts
            structureCode={structure.code}
            tag={alert.gauge}
            timeZone={structure.timezone}
            limits={limits}
            yieldStress={gauge.material.yield ?? null}
            episodes={alert.kind === "limit" ? [{ openedAt, clearedAt, level: alert.level }] : []}
            events={[{ time: openedAt, label: "opened" }]}
            end={around.to}
            initialRange={around}
            compact
            expectedIntervalS={gauge.expectedInterval}
          />
        )}
      </section>
      <div className="mt-6">
        <MonitoringCaution />
      </div>
    </>
  );
}
