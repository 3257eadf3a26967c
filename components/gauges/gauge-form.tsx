"use client";

import { useRouter } from "next/navigation";
import { useMemo, useState, useTransition } from "react";
import { FormMessage } from "@/components/ui/form-message";
import { buttonClass, cardClass, inputClass } from "@/components/ui/styles";
import type { ActionState } from "@/lib/actions/action-state";
import { COEFFICIENT_KEYS, applicableFields, gaugePayloadOf, type GaugeFormValues } from "@/lib/gauges/form-values";
import { previewConversion } from "@/lib/gauges/preview";
import { SUMMARY_MINUTES } from "@/lib/dynamic";
import { DETAIL_CATEGORY_VALUES } from "@/lib/fatigue";
import { CALIBRATION_FACTOR_LABEL, WIRE_GAUGE_FACTOR_UNIT, gaugeFactorLabel, inputName, inputUnit } from "@/lib/gauges/labels";
import { BRIDGES, FOIL_INPUTS, MATERIALS, STEEL_WIRE_CTE, VIBRATING_WIRE_INPUTS } from "@/lib/mechanics";
import { wallClockInputToIso } from "@/lib/time-format";
import { formatStressRating } from "@/lib/units";

export type GaugeFormMode = "register" | "edit" | "replace";

const BRIDGE_NAMES: Record<string, string> = {
  quarter: "Quarter bridge, one active gauge",
  "half-bending": "Half bridge, two gauges in bending",
  "half-poisson": "Half bridge, axial + transverse (Poisson) gauge",
  "full-bending": "Full bridge, four gauges in bending",
  "full-poisson": "Full bridge, bending with Poisson gauges",
  "full-axial-poisson": "Full bridge, axial with Poisson gauges",
};

type Props = {
  mode: GaugeFormMode;
  structureCode: string;
  /** The structure's zone: the zero reading's time is typed on its clock. */
  timeZone: string;
  initial: GaugeFormValues;
  submit: (payload: Record<string, unknown>) => Promise<ActionState>;
};

const format = (value: number, digits: number) => value.toLocaleString("en-US", { maximumFractionDigits: digits, minimumFractionDigits: digits });

export function GaugeForm({ mode, structureCode, timeZone, initial, submit }: Props) {
  const router = useRouter();
  const [values, setValues] = useState<GaugeFormValues>(initial);
  const [reason, setReason] = useState("");
  const [state, setState] = useState<ActionState>({ status: "idle" });
  const [pending, startTransition] = useTransition();
  const [sample, setSample] = useState({ value: "", temperature: initial["zero.temperature"] ?? "" });
  const applies = applicableFields(values);
  const errors = state.fieldErrors ?? {};
  const rawUnit = inputUnit(values.input ?? "");
  const foil = values.kind === "foil";

  const set = (name: string) => (event: React.ChangeEvent<HTMLInputElement | HTMLSelectElement>) =>
    setValues((previous) => ({ ...previous, [name]: event.target.value }));

  function chooseKind(kind: string) {
    setValues((previous) => ({
      ...previous,
      kind,
      input: kind === "foil" ? "mV/V" : "Hz",
      "thermal.method": kind === "foil" ? "none" : "cte",
      "thermal.gaugeCte": kind === "foil" ? "" : String(STEEL_WIRE_CTE),
    }));
  }

  function chooseMaterial(id: string) {
    const material = MATERIALS[id as keyof typeof MATERIALS];
    if (!material) return;
    setValues((previous) => ({
      ...previous,
      "material.name": material.name,
      "material.E": String(Math.round(material.E)),
      "material.nu": String(material.nu),
      "material.alpha": String(material.alpha),
      "material.yield": "yield" in material ? String(material.yield) : "",
      "material.compressiveStrength": "compressiveStrength" in material ? String(material.compressiveStrength) : "",
    }));
  }

  const preview = useMemo(() => {
    const sampleValue = Number(sample.value.replace(",", "."));
    if (sample.value.trim() === "" || !Number.isFinite(sampleValue)) return null;
    const temperature = sample.temperature.trim() === "" ? null : Number(sample.temperature);
    return previewConversion(gaugePayloadOf(values), sampleValue, temperature);
  }, [values, sample]);

  function onSubmit(event: React.FormEvent) {
    event.preventDefault();
    const payload: Record<string, unknown> = gaugePayloadOf(values);
    if (mode === "edit") delete payload.tag;
    if (mode === "replace") payload.reason = reason;
    startTransition(async () => {
      const answer = await submit(payload);
      setState(answer);
      if (answer.status === "ok") {
        const tag = mode === "edit" ? initial.tag : values.tag?.trim();
        router.push(`/structures/${structureCode}/gauges/${encodeURIComponent(tag ?? "")}`);
      }
    });
  }

  const input = (name: string, label: string, options: { unit?: string; hint?: string; type?: string; required?: boolean; step?: string } = {}) => {
    const fieldErrors = Object.entries(errors).filter(([key]) => key === name || key.startsWith(`${name}.`)).flatMap(([, list]) => list ?? []);
    const id = `gauge-${name.replace(/\W/g, "-")}`;
    return (
      <div className="space-y-1">
        <label htmlFor={id} className="block text-sm font-medium">
          {label}
          {options.unit && <span className="ml-1 font-normal text-slate-500 dark:text-slate-400">({options.unit})</span>}
        </label>
        <input
          id={id}
          name={name}
          type={options.type ?? "text"}
          inputMode={options.type ? undefined : "decimal"}
          required={options.required}
          step={options.step}
          value={values[name] ?? ""}
          onChange={set(name)}
          aria-invalid={fieldErrors.length ? true : undefined}
          aria-describedby={[options.hint ? `${id}-hint` : "", fieldErrors.length ? `${id}-error` : ""].filter(Boolean).join(" ") || undefined}
          className={inputClass}
        />
        {options.hint && (
          <p id={`${id}-hint`} className="text-xs text-slate-500 dark:text-slate-400">
            {options.hint}
          </p>
        )}
        {fieldErrors.length > 0 && (
          <p id={`${id}-error`} role="alert" className="text-xs font-medium text-critical">
            {fieldErrors.join(" ")}
          </p>
        )}
      </div>
    );
  };

  const select = (name: string, label: string, options: [string, string][], hint?: string) => {
    const id = `gauge-${name.replace(/\W/g, "-")}`;
    return (
      <div className="space-y-1">
        <label htmlFor={id} className="block text-sm font-medium">
          {label}
        </label>
        <select id={id} name={name} value={values[name] ?? ""} onChange={set(name)} className={inputClass}>
          {options.map(([value, text]) => (
            <option key={value} value={value}>
              {text}
            </option>
          ))}
        </select>
        {hint && <p className="text-xs text-slate-500 dark:text-slate-400">{hint}</p>}
        {errors[name] && (
          <p role="alert" className="text-xs font-medium text-critical">
            {errors[name]!.join(" ")}
          </p>
        )}
      </div>
    );
  };

  const section = (title: string, children: React.ReactNode) => (
    <fieldset className={`${cardClass} space-y-4 p-4`}>
      <legend className="px-1 text-sm font-semibold uppercase tracking-wide text-slate-600 dark:text-slate-300">{title}</legend>
      {children}
    </fieldset>
  );

  return (
    <form onSubmit={onSubmit} className="grid gap-6 lg:grid-cols-[1fr_20rem]" aria-label="Gauge" noValidate>
      <div className="space-y-6">
        {section(
          "Where it is",
          <div className="grid gap-4 sm:grid-cols-3">
            {mode === "edit" ? (
              <p className="text-sm">
                Tag <span className="font-mono font-semibold">{initial.tag}</span>
              </p>
            ) : (
              input("tag", "Tag", { required: true, hint: "As written on the gauge and the logger channel." })
            )}
            {input("label", "Location", { hint: "e.g. bottom flange at midspan" })}
            {input("member", "Member", { hint: "e.g. main girder 2" })}
          </div>,
        )}
        {section(
          "Sensor and wiring",
          <>
            <div role="radiogroup" aria-label="Kind" className="flex flex-wrap gap-4 text-sm">
              {(["foil", "vibrating-wire"] as const).map((kind) => (
                <label key={kind} className="flex items-center gap-2">
                  <input type="radio" name="kind" value={kind} checked={values.kind === kind} onChange={() => chooseKind(kind)} />
                  {kind === "foil" ? "Foil (resistance) gauge" : "Vibrating-wire gauge"}
                </label>
              ))}
            </div>
            <div className="grid gap-4 sm:grid-cols-2">
              {select(
                "input",
                "Logger output",
                (foil ? FOIL_INPUTS : VIBRATING_WIRE_INPUTS).map((value) => [value, inputName(value)]),
              )}
              {applies.bridge && select("bridge", "Bridge arrangement", BRIDGES.map((b) => [b, BRIDGE_NAMES[b]!]))}
              {input("gaugeFactor", gaugeFactorLabel(values.kind ?? "foil"), {
                unit: foil ? "GF" : WIRE_GAUGE_FACTOR_UNIT,
                required: true,
                hint: foil ? "From the gauge packet, e.g. 2.10." : "Fixed by the wire's free length: K = 4·L²·ρ·10⁹ / E, about 3.5 for 150 mm of steel wire.",
              })}
              {applies.loggerGaugeFactor && input("loggerGaugeFactor", "Gauge factor set in the logger", { hint: "Leave empty if the logger uses the gauge's own factor." })}
              {applies.calibrationFactor && input("calibrationFactor", CALIBRATION_FACTOR_LABEL, { hint: "From the gauge's calibration record; empty means 1." })}
              {select("polarity", "Polarity", [["1", "Normal (tension positive)"], ["-1", "Reversed (wired the other way)"]])}
              {applies.leadResistances && (
                <>
                  {select(
                    "wiring",
                    "Quarter-bridge wiring",
                    [["", "Not recorded"], ["2-wire", "2-wire (both leads in the gauge's arm)"], ["3-wire", "3-wire (one lead in the gauge's arm)"]],
                    "Decides how many leads dilute the gauge's signal.",
                  )}
                  {values.wiring
                    ? input("leadResistance", "Resistance of one lead", { unit: "Ω", hint: "Measured or from cable length; empty for no correction." })
                    : input("leadResistance", "Lead resistance in the gauge's arm", { unit: "Ω", hint: "Both leads for 2-wire, one for 3-wire; empty for no correction." })}
                </>
              )}
              {applies.gaugeResistance && input("gaugeResistance", "Gauge resistance", { unit: "Ω", hint: "e.g. 120 or 350; a shunt check needs it." })}
              {applies.excitationVoltage && input("excitationVoltage", "Bridge excitation", { unit: "V", hint: "As set in the logger, e.g. 2.5 or 5; empty if not known." })}
              {input("ratedRange", "Rated range", { unit: "µε", hint: "Either side of zero; readings beyond are flagged." })}
              {input("expectedInterval", "Expected interval between readings", { unit: "s", hint: "Used to tell when data stop arriving." })}
            </div>
            {select(
              "sampling.mode",
              "Sampling",
              [
                ["static", "Static: readings one at a time, minutes apart"],
                ["dynamic", "Dynamic: bursts at a fixed rate (traffic, footfall, machinery)"],
              ],
              "Changing it keeps the gauge's history. A dynamic gauge sends bursts to /bursts; they are kept as summaries and event waveforms.",
            )}
            {values["sampling.mode"] === "dynamic" && (
              <div className="grid gap-4 sm:grid-cols-2">
                {input("sampling.rateHz", "Sampling rate", { unit: "Hz", required: true, hint: "1 to 5000; every burst must be sent at this rate." })}
                {select(
                  "sampling.summaryMinutes",
                  "Summary interval",
                  SUMMARY_MINUTES.map((minutes): [string, string] => [String(minutes), `${minutes} min`]),
                  "Intervals start on the hour; extremes, mean, RMS and cycles are kept per interval.",
                )}
                {input("sampling.rangeBin", "Rainflow range bin", { unit: "MPa", hint: "Width of the stress-range bins of the histograms; 1 MPa suits steel details." })}
                {input("sampling.trigger.above", "Event trigger above", { unit: "MPa", hint: "A sample above starts an event; empty for none." })}
                {input("sampling.trigger.below", "Event trigger below", { unit: "MPa", hint: "A sample below starts an event; empty for none." })}
                {input("sampling.trigger.preSeconds", "Keep before the trigger", { unit: "s", hint: "Waveform kept before the first sample beyond (0 to 60)." })}
                {input("sampling.trigger.postSeconds", "Keep after the trigger", { unit: "s", hint: "Waveform kept after the last sample beyond (0 to 60)." })}
              </div>
            )}
          </>,
        )}
        {section(
          "Temperature compensation",
          <>
            {select(
              "thermal.method",
              "Method",
              [
                ["none", "None (self-compensated gauge matched to the host)"],
                ["polynomial", "Thermal-output polynomial of the gauge lot"],
                ["cte", foil ? "Gauge matched to another expansion coefficient" : "Wire expansion coefficient"],
              ],
              "Only stress-producing strain gives stress; free thermal expansion does not.",
            )}
            {applies.coefficients && (
              <div className="grid grid-cols-2 gap-3 sm:grid-cols-5">
                {COEFFICIENT_KEYS.map((key, power) => input(key, `A${power}`, { unit: power === 0 ? "µε" : `µε/°C${power > 1 ? `^${power}` : ""}` }))}
                {errors["thermal.coefficients"] && <p className="col-span-full text-xs text-critical">{errors["thermal.coefficients"]!.join(" ")}</p>}
              </div>
            )}
            {applies.gaugeCte && input("thermal.gaugeCte", foil ? "Coefficient the gauge is matched to" : "Wire coefficient", { unit: "µε/°C", hint: foil ? "" : `${STEEL_WIRE_CTE} for carbon-steel wire (handbook value).` })}
          </>,
        )}
        {section(
          "Host material",
          <>
            <div className="space-y-1">
              <label htmlFor="material-preset" className="block text-sm font-medium">
                Start from
              </label>
              <select id="material-preset" className={inputClass} defaultValue="" onChange={(event) => chooseMaterial(event.target.value)}>
                <option value="">Choose a material to fill in its values…</option>
                {Object.entries(MATERIALS).map(([id, material]) => (
                  <option key={id} value={id}>
                    {material.name}
                  </option>
                ))}
              </select>
              <p className="text-xs text-slate-500 dark:text-slate-400">Handbook values; override them with the project&apos;s own.</p>
            </div>
            <div className="grid gap-4 sm:grid-cols-2">
              {input("material.name", "Material name")}
              {input("material.E", "Young's modulus E", { unit: "MPa", required: true })}
              {input("material.nu", "Poisson's ratio ν", { required: true })}
              {input("material.alpha", "Expansion coefficient α", { unit: "µε/°C", required: true })}
              {input("material.yield", "Yield / proportional limit", { unit: "MPa", hint: "Stresses beyond it are flagged; empty for concrete." })}
              {input("material.compressiveStrength", "Concrete compressive strength f_ck", {
                unit: "MPa",
                hint: "Concrete only, empty for metals: utilisation is then compressive stress ÷ f_ck; tension is not rated.",
              })}
              {input("initialStress", "Initial (dead-load) stress", { unit: "MPa", hint: "Present when the gauge was zeroed; added to computed stress." })}
              {select(
                "detailCategory",
                "Fatigue detail category (Δσ_C at 2×10⁶ cycles, MPa)",
                [["", "Not assessed"], ...DETAIL_CATEGORY_VALUES.map((category): [string, string] => [String(category), `${category} MPa`])],
                "Chosen by the engineer for the detail at the gauge; the fatigue view uses it by default.",
              )}
            </div>
          </>,
        )}
        {mode !== "edit" &&
          section(
            "Zero reading",
            <div className="grid gap-4 sm:grid-cols-3">
              {input("zero.value", "Raw value at zero", { unit: rawUnit, required: true })}
              {input("zero.temperature", "Temperature at zero", { unit: "°C" })}
              <div className="space-y-1">
                <label htmlFor="gauge-zero-time" className="block text-sm font-medium">
                  Time of the zero reading <span className="font-normal text-slate-500">({timeZone} time)</span>
                </label>
                <input
                  id="gauge-zero-time"
                  type="datetime-local"
                  className={inputClass}
                  onChange={(event) =>
                    setValues((previous) => ({ ...previous, "zero.time": wallClockInputToIso(event.target.value, timeZone) }))
                  }
                />
                <p className="text-xs text-slate-500 dark:text-slate-400">Empty for now.</p>
              </div>
            </div>,
          )}
        {mode === "replace" && (
          <fieldset className={`${cardClass} space-y-2 p-4`}>
            <legend className="px-1 text-sm font-semibold uppercase tracking-wide">Why it is replaced</legend>
            <label htmlFor="replace-reason" className="block text-sm font-medium">
              Reason
            </label>
            <input id="replace-reason" className={inputClass} value={reason} onChange={(event) => setReason(event.target.value)} />
            {errors.reason && <p className="text-xs text-critical">{errors.reason.join(" ")}</p>}
          </fieldset>
        )}
      </div>
      <aside className={`${cardClass} h-fit space-y-3 p-4 lg:sticky lg:top-4 lg:col-start-2 lg:row-start-1`} aria-label="Conversion preview">
        <h2 className="font-semibold">Check before the first data</h2>
        <p className="text-xs text-slate-600 dark:text-slate-400">
          Type a raw reading as the logger would send it: the result below uses exactly the conversion applied to real data.
        </p>
        <div className="grid grid-cols-2 gap-3">
          <div className="space-y-1">
            <label htmlFor="sample-value" className="block text-sm font-medium">
              Sample <span className="font-normal text-slate-500">({rawUnit})</span>
            </label>
            <input id="sample-value" inputMode="decimal" className={inputClass} value={sample.value} onChange={(e) => setSample({ ...sample, value: e.target.value })} />
          </div>
          <div className="space-y-1">
            <label htmlFor="sample-temperature" className="block text-sm font-medium">
              At <span className="font-normal text-slate-500">(°C)</span>
            </label>
            <input id="sample-temperature" inputMode="decimal" className={inputClass} value={sample.temperature} onChange={(e) => setSample({ ...sample, temperature: e.target.value })} />
          </div>
        </div>
        <div aria-live="polite" data-testid="conversion-preview">
          {!preview ? (
            <p className="text-sm text-slate-500">Enter a sample reading to see its strain and stress.</p>
          ) : preview.ok ? (
            <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 text-sm">
              <dt>Indicated strain</dt>
              <dd className="text-right font-mono">{format(preview.indicatedStrain, 1)} µε</dd>
              <dt>Stress-producing strain</dt>
              <dd className="text-right font-mono" data-testid="preview-strain">{format(preview.strain, 1)} µε</dd>
              {preview.totalStrain !== null && (
                <>
                  <dt>Total strain</dt>
                  <dd className="text-right font-mono">{format(preview.totalStrain, 1)} µε</dd>
                </>
              )}
              <dt>Stress</dt>
              <dd className="text-right font-mono" data-testid="preview-stress">{format(preview.stress, 2)} MPa</dd>
              {preview.rating !== null && (
                <>
                  <dt>Utilisation</dt>
                  <dd className="text-right font-mono">{formatStressRating(preview.rating)}</dd>
                </>
              )}
              {preview.flags.length > 0 && <dd className="col-span-2 text-xs font-medium text-warning">Flagged: {preview.flags.join(", ")}</dd>}
            </dl>
          ) : (
            <p className="text-sm text-critical">{preview.message}</p>
          )}
        </div>
        <p className="text-xs text-slate-500">Tension is positive. A sign you did not expect usually means the polarity or the bridge is wrong.</p>
      </aside>
      <div className="flex flex-wrap items-center gap-3 lg:col-start-1">
        <button type="submit" className={buttonClass()} disabled={pending}>
          {pending ? "Saving…" : mode === "register" ? "Register gauge" : mode === "edit" ? "Save changes" : "Replace gauge"}
        </button>
        <FormMessage state={state} />
      </div>
    </form>
  );
}
