"use client";

import { useState } from "react";
import { wallClockInputToIso } from "@/lib/time-format";
import { inputClass } from "./styles";

/**
 * A date-and-time picker on the structure's clock (`timeZone`, named in the label) that submits an
 * ISO UTC time under `name`, so the server never has to guess which time zone a technician meant.
 */
export function LocalTimeInput({ name, id, label, timeZone, hint }: { name: string; id: string; label: string; timeZone: string; hint?: string }) {
  const [iso, setIso] = useState("");
  return (
    <div className="space-y-1">
      <label htmlFor={id} className="block text-sm font-medium">
        {label} <span className="font-normal text-slate-500 dark:text-slate-400">({timeZone} time)</span>
      </label>
      <input
        id={id}
        type="datetime-local"
        className={inputClass}
        onChange={(event) => setIso(wallClockInputToIso(event.target.value, timeZone))}
      />
      <input type="hidden" name={name} value={iso} />
      {hint && <p className="text-xs text-slate-500 dark:text-slate-400">{hint}</p>}
    </div>
  );
}
