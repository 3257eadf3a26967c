import { CALIBRATION_FACTOR_LABEL, WIRE_GAUGE_FACTOR_UNIT, gaugeFactorLabel, inputName } from "@/lib/gauges/labels";
import { STEEL_WIRE_CTE } from "@/lib/mechanics";
import type { GaugeView } from "@/lib/services/gauges";

const num = (value: number | null | undefined, unit = "") => (value === null || value === undefined ? "—" : `${value.toLocaleString("en-US")}${unit ? ` ${unit}` : ""}`);

function thermalText(gauge: GaugeView): string {
  const thermal = gauge.thermal ?? { method: "none" };
  if (thermal.method === "polynomial") {
    return `Thermal-output polynomial: ${thermal.coefficients.map((a, i) => `A${i} = ${a}`).join(", ")} (µε, T in °C)`;
  }
  if (thermal.method === "cte") {
    return `${gauge.kind === "foil" ? "Gauge matched to" : "Wire coefficient"} ${num(thermal.gaugeCte ?? STEEL_WIRE_CTE, "µε/°C")}`;
  }
  return "None (self-compensated)";
}

/** A gauge's configuration as label → value with units, as the engineer checks it. */
export function GaugeSummary({ gauge }: { gauge: GaugeView }) {
  const foil = gauge.kind === "foil";
  const rows: [string, string][] = [
    ["Kind", foil ? "Foil (resistance)" : "Vibrating wire"],
    ["Logger output", inputName(gauge.input)],
    ...(gauge.bridge ? [["Bridge", gauge.bridge] as [string, string]] : []),
    [gaugeFactorLabel(gauge.kind), foil ? num(gauge.gaugeFactor) : num(gauge.gaugeFactor, WIRE_GAUGE_FACTOR_UNIT)],
    ...(gauge.loggerGaugeFactor ? [["Logger gauge factor", num(gauge.loggerGaugeFactor)] as [string, string]] : []),
    ...(!foil ? [[CALIBRATION_FACTOR_LABEL, num(gauge.calibrationFactor ?? 1)] as [string, string]] : []),
    ["Polarity", gauge.polarity === -1 ? "Reversed (−1)" : "Normal (+1)"],
    ...(gauge.bridge === "quarter" ? [["Quarter-bridge wiring", gauge.wiring ?? "Not recorded"] as [string, string]] : []),
    ...(gauge.leadResistance != null
      ? [[gauge.wiring ? "Resistance of one lead / gauge" : "Lead resistance in arm / gauge", `${num(gauge.leadResistance, "Ω")} / ${num(gauge.gaugeResistance, "Ω")}`] as [string, string]]
      : []),
    ...(foil ? [["Bridge excitation", gauge.excitationVoltage != null ? num(gauge.excitationVoltage, "V") : "Not recorded"] as [string, string]] : []),
    ["Temperature compensation", thermalText(gauge)],
    ["Material", gauge.material.name ?? "—"],
    ["E / ν / α", `${num(gauge.material.E, "MPa")} / ${num(gauge.material.nu)} / ${num(gauge.material.alpha, "µε/°C")}`],
    gauge.material.compressiveStrength
      ? ["Compressive strength f_ck", num(gauge.material.compressiveStrength, "MPa")]
      : ["Yield", num(gauge.material.yield, "MPa")],
    ["Initial stress", num(gauge.initialStress, "MPa")],
    ["Rated range", gauge.ratedRange ? `± ${num(gauge.ratedRange, "µε")}` : "—"],
    ["Expected interval", num(gauge.expectedInterval, "s")],
    ["Fatigue detail category", gauge.detailCategory ? `Δσ_C = ${num(gauge.detailCategory, "MPa")} at 2×10⁶ cycles` : "Not assessed"],
  ];
  return (
    <dl className="grid grid-cols-1 gap-x-6 gap-y-2 text-sm sm:grid-cols-[auto_1fr]">
      {rows.map(([label, value]) => (
        <div key={label} className="contents">
          <dt className="text-slate-500 dark:text-slate-400">{label}</dt>
          <dd className="font-medium">{value}</dd>
        </div>
      ))}
    </dl>
  );
}
