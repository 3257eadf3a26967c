"use client";

import { useState } from "react";
import { Field } from "@/components/ui/field";
import { inputClass } from "@/components/ui/styles";

type Option = { value: string; label: string };

/** Who the new token acts for: a user, or a logger bound to one structure; only the relevant list shows. */
export function TokenOwnerFields({ users, structures }: { users: Option[]; structures: Option[] }) {
  const [kind, setKind] = useState<"user" | "logger">("logger");
  const options = kind === "user" ? users : structures;
  const name = kind === "user" ? "email" : "structure";
  return (
    <>
      <fieldset className="space-y-1">
        <legend className="text-sm font-medium">Kind</legend>
        <div className="flex gap-4 text-sm">
          {(["logger", "user"] as const).map((value) => (
            <label key={value} className="flex items-center gap-1.5">
              <input type="radio" name="kind" value={value} checked={kind === value} onChange={() => setKind(value)} />
              {value === "logger" ? "Logger (one structure)" : "User"}
            </label>
          ))}
        </div>
      </fieldset>
      <Field name={name} label={kind === "user" ? "Acts as user" : "Sends readings to"}>
        <select id={name} name={name} className={inputClass} key={kind}>
          {options.map((o) => (
            <option key={o.value} value={o.value}>
              {o.label}
            </option>
          ))}
        </select>
      </Field>
    </>
  );
}
