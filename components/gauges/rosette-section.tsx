import Link from "next/link";
import { ActionForm, type FormActionFn } from "@/components/ui/action-form";
import { Field } from "@/components/ui/field";
import { SubmitButton } from "@/components/ui/submit-button";
import { inputClass } from "@/components/ui/styles";
import type { GaugeView } from "@/lib/services/gauges";
import type { RosetteView } from "@/lib/services/rosettes";

const LEGS = [
  ["a", "Gauge a (0°)"],
  ["b", "Gauge b (45° or 60°)"],
  ["c", "Gauge c (90° or 120°)"],
] as const;

/** Rosettes of the structure, and a form to group three of its gauges into one. */
export function RosetteSection({
  structureCode,
  rosettes,
  gauges,
  canEdit,
  createRosette,
}: {
  structureCode: string;
  rosettes: RosetteView[];
  gauges: GaugeView[];
  canEdit: boolean;
  /** The page's server action, passed in so that components stay below app/. */
  createRosette: FormActionFn;
}) {
  const active = gauges.filter((gauge) => gauge.status === "active");
  return (
    <div className="space-y-4">
      {rosettes.length === 0 ? (
        <p className="text-sm text-slate-600 dark:text-slate-400">No rosettes. Group three gauges bonded at one point to get principal stresses and von Mises.</p>
      ) : (
        <ul className="space-y-1 text-sm">
          {rosettes.map((rosette) => (
            <li key={rosette.tag} data-testid="rosette-row">
              <Link href={`/structures/${structureCode}/rosettes/${encodeURIComponent(rosette.tag)}`} className="font-mono font-medium text-accent underline">
                {rosette.tag}
              </Link>{" "}
              — {rosette.layout} ({rosette.layout === "rectangular" ? "0°/45°/90°" : "0°/60°/120°"}):{" "}
              {rosette.gauges.join(", ")}
            </li>
          ))}
        </ul>
      )}
      {canEdit && active.length >= 3 && (
        <ActionForm action={createRosette} className="grid gap-3 sm:grid-cols-2 lg:grid-cols-5" label="Group a rosette">
          <input type="hidden" name="code" value={structureCode} />
          <Field name="tag" label="Rosette tag" required />
          <Field name="layout" label="Layout">
            <select id="layout" name="layout" className={inputClass}>
              <option value="rectangular">Rectangular, 0°/45°/90°</option>
              <option value="delta">Delta, 0°/60°/120°</option>
            </select>
          </Field>
          {LEGS.map(([leg, label]) => (
            <Field key={leg} name={leg} label={label}>
              <select id={leg} name={leg} className={inputClass}>
                {active.map((gauge) => (
                  <option key={gauge.tag}>{gauge.tag}</option>
                ))}
              </select>
            </Field>
          ))}
          <div className="sm:col-span-2 lg:col-span-5">
            <SubmitButton pendingLabel="Grouping…">Group rosette</SubmitButton>
          </div>
        </ActionForm>
      )}
    </div>
  );
}
