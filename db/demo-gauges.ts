import type { BurstStory, GaugeStory } from "@/lib/demo";
import type { GaugeInput } from "@/lib/gauges/schema";
import { MATERIALS, STEEL_WIRE_CTE, normalWeightConcrete } from "@/lib/mechanics";
import { wireGaugeFactor } from "@/lib/mechanics/vibrating-wire";

/**
 * The invented demo installation. Each gauge has a story that the synthetic readings tell:
 * traffic, restraint against thermal movement, a drift, spikes, a logger outage and a planted
 * overload, so that the demo shows every kind of behaviour the product must make visible.
 */

const DAY_MS = 86_400_000;
const INTERVAL_MS = 600_000;
export const DEMO_DAYS = 90;

/** The demo's 90 days of readings end at the last whole 10 minutes before `now`. */
export function demoPeriod(now: number) {
  const end = Math.floor(now / INTERVAL_MS) * INTERVAL_MS;
  return { start: end - DEMO_DAYS * DAY_MS, end, interval: INTERVAL_MS };
}
const steel = { ...MATERIALS["structural-steel-eu"] };
const concrete = { ...normalWeightConcrete(40), yield: null };

type DemoGauge = { structure: string; input: GaugeInput; story: (start: number) => GaugeStory };

const foil = (fields: Partial<GaugeInput> & Pick<GaugeInput, "tag" | "input" | "gaugeFactor">): GaugeInput => ({
  kind: "foil",
  bridge: null,
  loggerGaugeFactor: null,
  calibrationFactor: null,
  polarity: 1,
  wiring: null,
  leadResistance: null,
  excitationVoltage: null,
  gaugeResistance: null,
  thermal: { method: "none" },
  material: steel,
  initialStress: 0,
  zero: { value: 0, temperature: 11.5 },
  expectedInterval: 600,
  ratedRange: 3000,
  detailCategory: null,
  sampling: { mode: "static" },
  ...fields,
});

/** The demo's embedment gauges: 150 mm of steel wire (ρ = 7850 kg/m³, E = 200 GPa), K ≈ 3.53 µε per f²/1000. */
const EMBEDMENT_WIRE_FACTOR = wireGaugeFactor(0.15, 7850, 200e9);

const vibratingWire = (fields: Partial<GaugeInput> & Pick<GaugeInput, "tag" | "input" | "zero">): GaugeInput => ({
  kind: "vibrating-wire",
  gaugeFactor: EMBEDMENT_WIRE_FACTOR,
  bridge: null,
  loggerGaugeFactor: null,
  calibrationFactor: 0.97,
  polarity: 1,
  wiring: null,
  leadResistance: null,
  excitationVoltage: null,
  gaugeResistance: null,
  thermal: { method: "cte", gaugeCte: STEEL_WIRE_CTE },
  material: concrete,
  initialStress: 0,
  expectedInterval: 600,
  ratedRange: 3000,
  detailCategory: null,
  sampling: { mode: "static" },
  ...fields,
});

/** Outage of the footbridge logger: a day and a half, a month into the period. */
const footbridgeOutage = (start: number) => ({ from: start + 31 * DAY_MS + 7 * 3_600_000, to: start + 32 * DAY_MS + 19 * 3_600_000 });

export const DEMO_GAUGES: DemoGauge[] = [
  {
    structure: "MILL-FB",
    input: foil({
      tag: "LC-M1",
      label: "Lower chord, midspan, bottom face",
      member: "Lower chord, north truss",
      input: "mV/V",
      // The footbridge's bridges were wired with the output leads reversed: their readings fall under tension.
      polarity: -1,
      bridge: "quarter",
      gaugeFactor: 2.1,
      leadResistance: 0.9,
      gaugeResistance: 350,
      zero: { value: 0.0123, temperature: 11.5 },
      initialStress: 38,
      // The repaired lower chord: a fillet-welded cover plate end at the gauge (invented assessment, EN 1993-1-9 style category).
      detailCategory: 71,
    }),
    story: (start) => ({
      trafficAmplitude: 55,
      thermalRestraint: 0.15,
      offline: footbridgeOutage(start),
      spikes: [{ time: start + 12 * DAY_MS + 14 * 3_600_000, strain: 420 }],
    }),
  },
  {
    structure: "MILL-FB",
    input: foil({
      tag: "LC-Q1",
      label: "Lower chord, quarter span",
      member: "Lower chord, north truss",
      input: "mV/V",
      polarity: -1,
      bridge: "full-axial-poisson",
      gaugeFactor: 2.05,
      zero: { value: -0.0041, temperature: 11.5 },
      initialStress: 31,
      detailCategory: 80,
    }),
    story: (start) => ({
      trafficAmplitude: 40,
      thermalRestraint: 0.1,
      offline: footbridgeOutage(start),
      // A maintenance vehicle parked on the deck over a weekend it was not rated for.
      sustainedLoad: { from: start + 61 * DAY_MS + 9 * 3_600_000, to: start + 61 * DAY_MS + 15 * 3_600_000, strain: 610 },
    }),
  },
  {
    structure: "MILL-FB",
    input: foil({
      tag: "DG-3",
      label: "Diagonal D3, mid-length",
      member: "Diagonal D3, south truss",
      input: "mV/V",
      polarity: -1,
      bridge: "half-bending",
      gaugeFactor: 2.08,
      zero: { value: 0.0007, temperature: 11.5 },
      detailCategory: 90,
    }),
    // A slowly debonding gauge: its reading creeps away from the member's real strain.
    story: (start) => ({ trafficAmplitude: 30, driftPerDay: 1.6, offline: footbridgeOutage(start) }),
  },
  {
    structure: "MILL-FB",
    input: foil({
      tag: "TC-M1",
      label: "Top chord, midspan, top face",
      member: "Top chord, north truss",
      input: "microstrain",
      gaugeFactor: 2.12,
      loggerGaugeFactor: 2,
      // Thermal output of the gauge lot, as printed on its data sheet (µε, T in °C).
      thermal: { method: "polynomial", coefficients: [-29.5, 2.61, -0.062, 0.00041] },
      zero: { value: 4.2, temperature: 11.5 },
      initialStress: -27,
    }),
    story: (start) => ({ trafficAmplitude: -45, thermalRestraint: 0.2, offline: footbridgeOutage(start) }),
  },
  ...(["a", "b", "c"] as const).map((leg, i) => ({
    structure: "MILL-FB",
    input: foil({
      tag: `GP-R1${leg}`,
      label: `Gusset plate G2, rosette R1 gauge ${leg} (${[0, 45, 90][i]}°)`,
      member: "Gusset plate G2, lower chord joint",
      input: "microstrain" as const,
      gaugeFactor: 2.09,
      zero: { value: 0, temperature: 11.5 },
    }),
    story: (start: number) => ({ trafficAmplitude: [60, 25, -18][i], offline: footbridgeOutage(start) }),
  })),
  {
    structure: "ORCH-PD",
    input: vibratingWire({
      tag: "L2-S1",
      label: "Level 2 slab, bay C4, bottom, east-west",
      member: "Level 2 slab, bay C4",
      input: "Hz",
      zero: { value: 812.4, temperature: 9.8 },
    }),
    story: () => ({ trafficAmplitude: 18, thermalRestraint: 0.45 }),
  },
  {
    structure: "ORCH-PD",
    input: vibratingWire({
      tag: "L2-S2",
      label: "Level 2 slab, bay C4, bottom, north-south",
      member: "Level 2 slab, bay C4",
      input: "Hz",
      zero: { value: 798.1, temperature: 9.8 },
    }),
    story: () => ({ trafficAmplitude: 14, thermalRestraint: 0.45, driftPerDay: -0.8 }),
  },
  {
    structure: "ORCH-PD",
    input: vibratingWire({
      tag: "L2-B7",
      label: "Beam B7, midspan soffit",
      member: "Post-tensioned beam B7",
      input: "frequency-squared",
      zero: { value: 671.3, temperature: 9.8 },
    }),
    story: (start) => ({ trafficAmplitude: 22, thermalRestraint: 0.3, spikes: [{ time: start + 47 * DAY_MS + 3 * 3_600_000, strain: -350 }] }),
  },
  {
    structure: "ORCH-PD",
    input: vibratingWire({
      tag: "L3-C2",
      label: "Column C2 at level 3, north face",
      member: "Column C2",
      input: "frequency-squared",
      zero: { value: 702.9, temperature: 9.8 },
    }),
    // A loose connector: the reading steps further than any column moves and stays there, a jump (a sensor fault, not a load).
    story: (start) => ({ trafficAmplitude: -9, thermalRestraint: 0.2, steps: [{ time: start + 70 * DAY_MS + 11 * 3_600_000, strain: 2600 }] }),
  },
];

export const DEMO_ROSETTES = [{ structure: "MILL-FB", tag: "R1", layout: "rectangular" as const, gauges: ["GP-R1a", "GP-R1b", "GP-R1c"] as [string, string, string] }];

type DemoLimit = { quantity: "stress" | "strain" | "utilisation"; level: "watch" | "warning" | "critical"; upper?: number; lower?: number; hysteresis?: number; persistence?: number };

/**
 * Example limits of the demo engineer, chosen so that the demo's stories cross some of them:
 * the parked vehicle on LC-Q1 goes to warning, and DG-3's drifting reading stays at watch.
 * Examples only: real limits are the responsible engineer's, under local codes.
 */
export const DEMO_LIMITS: { structure: string; tag: string; limits: DemoLimit[] }[] = [
  {
    structure: "MILL-FB",
    tag: "LC-Q1",
    limits: [
      { quantity: "stress", level: "watch", upper: 120, hysteresis: 10, persistence: 2 },
      { quantity: "stress", level: "warning", upper: 150, hysteresis: 10, persistence: 2 },
      { quantity: "stress", level: "critical", upper: 240, hysteresis: 10, persistence: 2 },
    ],
  },
  {
    structure: "MILL-FB",
    tag: "LC-M1",
    limits: [
      { quantity: "stress", level: "watch", upper: 70, lower: -20, hysteresis: 8, persistence: 3 },
      { quantity: "utilisation", level: "critical", upper: 0.8, hysteresis: 0.05, persistence: 2 },
    ],
  },
  {
    structure: "MILL-FB",
    tag: "DG-3",
    limits: [
      { quantity: "strain", level: "watch", upper: 110, lower: -110, hysteresis: 60, persistence: 6 },
      { quantity: "strain", level: "warning", upper: 220, lower: -220, hysteresis: 60, persistence: 6 },
    ],
  },
  {
    structure: "MILL-FB",
    tag: "DK-V1",
    limits: [{ quantity: "stress", level: "watch", upper: 15, lower: -15, hysteresis: 2 }],
  },
  {
    structure: "ORCH-PD",
    tag: "L2-S1",
    limits: [
      { quantity: "strain", level: "watch", upper: 250, lower: -400, hysteresis: 20, persistence: 3 },
      { quantity: "strain", level: "warning", upper: 400, lower: -600, hysteresis: 20, persistence: 3 },
    ],
  },
];

/** Days of bursts the demo's dynamic gauges carry, ending where the static readings end. */
export const DEMO_BURST_DAYS = 3;
export const DEMO_BURST_RATE_HZ = 100;

/**
 * Dynamic demo gauges: footfall on the footbridge deck (people at about 2 Hz) and vehicles on the
 * parking deck's level-2 slab, at 100 Hz, a minute's burst every five minutes.
 */
export const DEMO_DYNAMIC_GAUGES: { structure: string; input: GaugeInput; story: BurstStory }[] = [
  {
    structure: "MILL-FB",
    input: foil({
      tag: "DK-V1",
      label: "Deck stringer, midspan, bottom flange",
      member: "Deck stringer S3",
      input: "microstrain",
      gaugeFactor: 2.1,
      zero: { value: 0, temperature: 11.5 },
      detailCategory: 71,
      sampling: { mode: "dynamic", rateHz: DEMO_BURST_RATE_HZ, summaryMinutes: 10, rangeBin: 1, trigger: { above: 14, below: -14, preSeconds: 2, postSeconds: 5 } },
    }),
    story: { kind: "footfall", amplitude: 12, groupAmplitude: 80 },
  },
  {
    structure: "ORCH-PD",
    input: foil({
      tag: "L2-V1",
      label: "Level 2 slab, bay C4, bottom, dynamic",
      member: "Level 2 slab, bay C4",
      input: "microstrain",
      gaugeFactor: 2.1,
      material: concrete,
      zero: { value: 0, temperature: 9.8 },
      detailCategory: 80,
      sampling: { mode: "dynamic", rateHz: DEMO_BURST_RATE_HZ, summaryMinutes: 10, rangeBin: 0.25, trigger: { above: 2.5, below: null, preSeconds: 2, postSeconds: 5 } },
    }),
    story: { kind: "vehicles", carStrain: 25, heavyStrain: 110 },
  },
];
