"use client";

import { useState } from "react";
import { inputClass } from "./styles";

/**
 * A date-and-time picker in the device's own time that submits an ISO time with its offset
 * under `name`, so the server never has to guess which time zone a technician meant.
 */
export function LocalTimeInput({ name, id, label, hint }: { name: string; id: string; label: string; hint?: string }) {
  const [iso, setIso] = useState("");
  return (
    <div className="space-y-1">
      <label htmlFor={id} className="block text-sm font-medium">
        {label}
      </label>
      <input
        id={id}
        type="datetime-local"
        className={inputClass}
        onChange={(event) => setIso(event.target.value ? new Date(event.target.value).toISOString() : "")}
      />
      <input type="hidden" name={name} value={iso} />
      {hint && <p className="text-xs text-slate-500 dark:text-slate-400">{hint}</p>}
    </div>
  );
}
