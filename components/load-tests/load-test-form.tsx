"use client";

import { useId, useState, useTransition } from "react";
import type { ActionState } from "@/lib/actions/action-state";
import { FormMessage } from "@/components/ui/form-message";
import { buttonClass, cardClass, inputClass, stackedTable, thClass } from "@/components/ui/styles";
import { wallClockInputToIso } from "@/lib/time-format";
import { parsePredictedTable } from "@/lib/load-tests/predicted-csv";

export type FormGauge = { tag: string; label: string | null; member: string | null };

function FieldErrors({ id, errors }: { id: string; errors: string[] | undefined }) {
  if (!errors?.length) return null;
  return (
    <p id={id} className="text-xs font-medium text-critical" role="alert">
      {errors.join(" ")}
    </p>
  );
}

/**
 * The engineer's record of a load test: the window on the structure's clock, the load, and a
 * predicted strain per gauge, typed into the table or filled from a CSV file (previewed in the
 * same table, with every line the file gets wrong named before anything is sent).
 */
export function LoadTestForm({
  code,
  timeZone,
  gauges,
  action,
}: {
  code: string;
  timeZone: string;
  gauges: FormGauge[];
  action: (code: string, payload: unknown) => Promise<ActionState>;
}) {
  const [title, setTitle] = useState("");
  const [load, setLoad] = useState("");
  const [start, setStart] = useState("");
  const [end, setEnd] = useState("");
  const [predicted, setPredicted] = useState<Record<string, string>>({});
  const [fileProblems, setFileProblems] = useState<string[]>([]);
  const [fileNote, setFileNote] = useState<string | null>(null);
  const [state, setState] = useState<ActionState>({ status: "idle" });
  const [pending, startTransition] = useTransition();
  const ids = useId();
  const errorsOf = (name: string) => state.fieldErrors?.[name] ?? Object.entries(state.fieldErrors ?? {}).find(([key]) => key.startsWith(`${name}.`))?.[1];

  async function readFile(file: File | null) {
    setFileProblems([]);
    setFileNote(null);
    if (!file) return;
    const table = parsePredictedTable(await file.text());
    if (!table.ok) return setFileProblems(table.problems);
    const known = new Set(gauges.map((gauge) => gauge.tag));
    const unknown = table.rows.filter((row) => !known.has(row.gauge)).map((row) => row.gauge);
    if (unknown.length) return setFileProblems([`This structure has no gauge tagged ${unknown.join(", ")}: correct the file or leave them out.`]);
    setPredicted(Object.fromEntries(table.rows.map((row) => [row.gauge, String(row.predicted)])));
    setFileNote(`${table.rows.length} predicted strains read from ${file.name}: check them in the table below, then record the test.`);
  }

  function submit(event: React.FormEvent) {
    event.preventDefault();
    const rows = Object.entries(predicted)
      .filter(([, value]) => value.trim() !== "")
      .map(([gauge, value]) => ({ gauge, predicted: Number(value) }));
    const payload = { title, load, start: wallClockInputToIso(start, timeZone), end: wallClockInputToIso(end, timeZone), predicted: rows };
    startTransition(async () => setState(await action(code, payload)));
  }

  const input = (name: string) => ({
    id: `${ids}-${name}`,
    "aria-invalid": errorsOf(name) ? true : undefined,
    "aria-describedby": errorsOf(name) ? `${ids}-${name}-error` : undefined,
  });

  return (
    <form onSubmit={submit} className={`${cardClass} space-y-4 p-4`} aria-label="Record a load test" aria-busy={pending} noValidate>
      <div className="grid gap-4 sm:grid-cols-2">
        <div className="space-y-1 sm:col-span-2">
          <label htmlFor={`${ids}-title`} className="block text-sm font-medium">
            Title
          </label>
          <input {...input("title")} className={inputClass} value={title} onChange={(e) => setTitle(e.target.value)} placeholder="Static test, truck at midspan" />
          <FieldErrors id={`${ids}-title-error`} errors={errorsOf("title")} />
        </div>
        <div className="space-y-1 sm:col-span-2">
          <label htmlFor={`${ids}-load`} className="block text-sm font-medium">
            Load
          </label>
          <textarea {...input("load")} rows={2} className={inputClass} value={load} onChange={(e) => setLoad(e.target.value)} placeholder="Vehicles, axle loads, positions and stops" />
          <FieldErrors id={`${ids}-load-error`} errors={errorsOf("load")} />
        </div>
        {(
          [
            ["start", "Window start", start, setStart],
            ["end", "Window end", end, setEnd],
          ] as const
        ).map(([name, label, value, set]) => (
          <div key={name} className="space-y-1">
            <label htmlFor={`${ids}-${name}`} className="block text-sm font-medium">
              {label} ({timeZone})
            </label>
            <input {...input(name)} type="datetime-local" className={inputClass} value={value} onChange={(e) => set(e.target.value)} />
            <FieldErrors id={`${ids}-${name}-error`} errors={errorsOf(name)} />
          </div>
        ))}
      </div>
      <p className="text-xs text-slate-500 dark:text-slate-400">
        The baseline is each gauge&apos;s last reading before the window start; the peak is the largest change from it in the sign you predict (tension positive).
      </p>

      <fieldset className="space-y-2">
        <legend className="text-sm font-medium">Predicted peak strain per gauge (µε, tension positive; leave blank to leave a gauge out)</legend>
        <div className="space-y-1">
          <label htmlFor={`${ids}-file`} className="block text-sm">
            Or fill the table from a CSV file (columns <code>gauge</code> and <code>predicted (µε)</code>)
          </label>
          <input id={`${ids}-file`} type="file" accept=".csv,text/csv,text/plain" className="block text-sm" onChange={(e) => void readFile(e.target.files?.[0] ?? null)} />
          {fileNote && (
            <p className="text-xs text-slate-600 dark:text-slate-300" role="status">
              {fileNote}
            </p>
          )}
          {fileProblems.length > 0 && (
            <ul className="list-disc pl-5 text-xs font-medium text-critical" role="alert" aria-label="Problems in the file">
              {fileProblems.map((problem) => (
                <li key={problem}>{problem}</li>
              ))}
            </ul>
          )}
        </div>
        <table className={stackedTable.table}>
          <thead className={stackedTable.head}>
            <tr>
              <th className={thClass}>Gauge</th>
              <th className={thClass}>Member</th>
              <th className={thClass}>Predicted (µε)</th>
            </tr>
          </thead>
          <tbody className={stackedTable.body}>
            {gauges.map((gauge) => (
              <tr key={gauge.tag} className={stackedTable.row}>
                <td className={`${stackedTable.cell} font-mono`} data-label="Gauge">
                  {gauge.tag}
                  {gauge.label && <span className="ml-2 font-sans text-xs text-slate-500">{gauge.label}</span>}
                </td>
                <td className={stackedTable.cell} data-label="Member">
                  {gauge.member ?? "—"}
                </td>
                <td className={stackedTable.cell} data-label="Predicted (µε)">
                  <input
                    aria-label={`Predicted strain of ${gauge.tag}, µε`}
                    inputMode="decimal"
                    className={`${inputClass} max-w-40`}
                    value={predicted[gauge.tag] ?? ""}
                    onChange={(e) => setPredicted({ ...predicted, [gauge.tag]: e.target.value })}
                  />
                </td>
              </tr>
            ))}
          </tbody>
        </table>
        <FieldErrors id={`${ids}-predicted-error`} errors={errorsOf("predicted")} />
      </fieldset>

      <button type="submit" className={buttonClass()} disabled={pending}>
        {pending ? "Recording…" : "Record load test"}
      </button>
      <FormMessage state={state} />
    </form>
  );
}
