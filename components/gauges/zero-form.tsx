"use client";

import { useState } from "react";
import { ActionForm, type FormActionFn } from "@/components/ui/action-form";
import { Field } from "@/components/ui/field";
import { LocalTimeInput } from "@/components/ui/local-time-input";
import { SubmitButton } from "@/components/ui/submit-button";

/** Record a new reference reading: typed on site, or the average of the last stored readings. */
/** `recordZero` is the page's server action, passed in so that components stay below app/. */
export function ZeroForm({ structureCode, tag, rawUnit, timeZone, recordZero }: { structureCode: string; tag: string; rawUnit: string; timeZone: string; recordZero: FormActionFn }) {
  const [source, setSource] = useState<"typed" | "readings">("typed");
  return (
    <ActionForm action={recordZero} className="space-y-3" label="Record a new zero">
      <input type="hidden" name="code" value={structureCode} />
      <input type="hidden" name="tag" value={tag} />
      <fieldset className="flex flex-wrap gap-4 text-sm">
        <legend className="sr-only">Where the zero comes from</legend>
        {(["typed", "readings"] as const).map((value) => (
          <label key={value} className="flex items-center gap-2">
            <input type="radio" name="source" value={value} checked={source === value} onChange={() => setSource(value)} />
            {value === "typed" ? "A value read on site" : "Average of the last readings"}
          </label>
        ))}
      </fieldset>
      {source === "typed" ? (
        <div className="grid gap-3 sm:grid-cols-3">
          <Field name="value" label={`Raw value (${rawUnit})`} inputMode="decimal" required />
          <Field name="temperature" label="Temperature (°C)" inputMode="decimal" />
          <LocalTimeInput name="time" id="zero-time" label="Read at" timeZone={timeZone} hint="Empty for now." />
        </div>
      ) : (
        <Field name="fromReadings" label="Number of readings to average" inputMode="numeric" defaultValue="6" hint="e.g. 6 readings = one hour at 10-minute intervals." />
      )}
      <Field name="reason" label="Why" hint="e.g. after the bearing replacement" />
      <SubmitButton pendingLabel="Recording…">Record zero</SubmitButton>
    </ActionForm>
  );
}
