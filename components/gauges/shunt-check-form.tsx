"use client";

import { useCallback, useEffect, useState } from "react";
import { ActionForm, useActionForm, type FormActionFn } from "@/components/ui/action-form";
import { Field } from "@/components/ui/field";
import { LocalTimeInput } from "@/components/ui/local-time-input";
import { SubmitButton } from "@/components/ui/submit-button";
import { DEFAULT_SHUNT_TOLERANCE_PERCENT } from "@/lib/gauges/schema";
import type { GaugeConfig } from "@/lib/mechanics";
import { expectedShuntOutput, shuntCheckVerdict } from "@/lib/mechanics/shunt-calibration";
import { formatDifference, formatShuntOutput } from "@/lib/gauges/shunt-display";
import { ShuntVerdict } from "./shunt-verdict";

type Typed = { shuntResistance: string; measuredOutput: string; tolerancePercent: string };
const BLANK: Typed = { shuntResistance: "", measuredOutput: "", tolerancePercent: String(DEFAULT_SHUNT_TOLERANCE_PERCENT) };
const numberOf = (text: string) => (text.trim() === "" ? Number.NaN : Number(text.replace(",", ".")));

/** What the circuit says the typed shunt should show, and how the typed measurement compares, before it is recorded. */
function ShuntExpectation({ config, unit, typed, onRecorded }: { config: GaugeConfig; unit: string; typed: Typed; onRecorded: () => void }) {
  const { state } = useActionForm();
  useEffect(() => {
    if (state.status === "ok") onRecorded();
  }, [state, onRecorded]);
  const shunt = numberOf(typed.shuntResistance);
  if (!Number.isFinite(shunt)) return <p className="text-sm text-slate-600 dark:text-slate-400">Type the shunt resistance to see the output the bridge should show.</p>;
  const expectation = expectedShuntOutput(config, shunt);
  if (!expectation.ok) return <p className="text-sm text-critical">{expectation.message}</p>;
  const { expectedReading, equivalentStrain } = expectation.value;
  const measured = numberOf(typed.measuredOutput);
  const tolerance = numberOf(typed.tolerancePercent);
  const verdict = Number.isFinite(measured) && tolerance > 0 ? shuntCheckVerdict(measured, expectedReading, tolerance) : null;
  return (
    <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm" data-testid="shunt-expectation">
      <dt>Expected</dt>
      <dd className="font-mono" data-testid="shunt-expected">
        {formatShuntOutput(expectedReading, unit)} <span className="font-sans text-xs text-slate-500">(simulates {formatShuntOutput(equivalentStrain, "µε")})</span>
      </dd>
      {verdict && (
        <>
          <dt>Measured</dt>
          <dd className="font-mono">{formatShuntOutput(measured, unit)}</dd>
          <dt>Difference</dt>
          <dd className="font-mono" data-testid="shunt-difference">
            {formatDifference(verdict.deviationPercent)} <span className="font-sans text-xs text-slate-500">(tolerance ±{tolerance} %)</span>
          </dd>
          <dt>Result</dt>
          <dd>
            <ShuntVerdict passed={verdict.passed} />
          </dd>
        </>
      )}
    </dl>
  );
}

/**
 * Record a shunt check: a known resistor across the gauge, the output change the logger showed.
 * `recordShuntCheck` is the page's server action; `config` the gauge as it converts now.
 */
export function ShuntCheckForm({
  structureCode,
  tag,
  unit,
  config,
  timeZone,
  recordShuntCheck,
}: {
  structureCode: string;
  tag: string;
  unit: string;
  config: GaugeConfig;
  timeZone: string;
  recordShuntCheck: FormActionFn;
}) {
  const [typed, setTyped] = useState<Typed>(BLANK);
  // Stable, so the expectation clears once per recorded check and not on every keystroke after one.
  const clear = useCallback(() => setTyped(BLANK), []);
  const track = (event: React.ChangeEvent<HTMLDivElement>) => {
    const target = event.target as unknown as HTMLInputElement;
    if (target.name in BLANK) setTyped((previous) => ({ ...previous, [target.name]: target.value }));
  };
  return (
    <ActionForm action={recordShuntCheck} className="space-y-3" label="Record a shunt check">
      <input type="hidden" name="code" value={structureCode} />
      <input type="hidden" name="tag" value={tag} />
      <div className="grid gap-3 sm:grid-cols-3" onChange={track}>
        <Field name="shuntResistance" label="Shunt resistance (Ω)" inputMode="decimal" required hint="Across the gauge, e.g. 174,650 Ω." />
        <Field name="measuredOutput" label={`Measured output change (${unit})`} inputMode="decimal" required hint="Shunted reading minus the reading before." />
        <Field
          name="tolerancePercent"
          label="Tolerance (%)"
          inputMode="decimal"
          defaultValue={String(DEFAULT_SHUNT_TOLERANCE_PERCENT)}
          hint="1 % of the expected output is common practice."
        />
      </div>
      <div className="grid gap-3 sm:grid-cols-2">
        <LocalTimeInput name="time" id="shunt-time" label="Applied at" timeZone={timeZone} hint="Empty for now." />
        <Field name="note" label="Note" hint="e.g. after re-soldering the leads" />
      </div>
      <div className="rounded-md bg-slate-50 p-3 dark:bg-slate-900">
        <ShuntExpectation config={config} unit={unit} typed={typed} onRecorded={clear} />
      </div>
      <SubmitButton pendingLabel="Recording…">Record shunt check</SubmitButton>
    </ActionForm>
  );
}
