"use client";

import { useRef } from "react";
import { ActionForm } from "@/components/ui/action-form";
import { unitsAction } from "@/lib/actions/units-action";
import type { UnitSystem } from "@/lib/units";

/** SI or US customary for everything this person reads; saved with their account. */
export function UnitsSwitch({ units }: { units: UnitSystem }) {
  const submit = useRef<HTMLButtonElement>(null);
  return (
    <ActionForm action={unitsAction} label="Display units" className="flex items-center gap-1 text-xs">
      <label htmlFor="units-select" className="text-slate-500">
        Units
      </label>
      <select
        id="units-select"
        name="units"
        defaultValue={units}
        className="rounded border border-slate-300 bg-transparent px-1 py-0.5 dark:border-slate-600"
        onChange={() => submit.current?.click()}
      >
        <option value="si">MPa, °C</option>
        <option value="us">ksi, °F</option>
      </select>
      <button ref={submit} type="submit" className="sr-only">
        Save units
      </button>
    </ActionForm>
  );
}
