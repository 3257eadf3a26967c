import { MATERIALS, prepareGauge, type GaugeConfig, type GaugeConverter } from "@/lib/mechanics";

export interface BenchResult {
  label: string;
  value: number;
  unit: string;
}

const READINGS = 2_000_000;
const steel = MATERIALS["structural-steel-eu"];
const concrete = MATERIALS["normal-weight-concrete-30"];

/** A mix of the gauge kinds a structure carries, with compensation on most. */
const GAUGES: readonly { config: GaugeConfig; centre: number; spread: number }[] = [
  {
    config: {
      kind: "foil",
      input: "mV/V",
      bridge: "quarter",
      gaugeFactor: 2.1,
      leadResistance: 1.1,
      gaugeResistance: 350,
      material: steel,
      zero: { value: 0.12, temperature: 15 },
    },
    centre: 0.12,
    spread: 0.5,
  },
  {
    config: {
      kind: "foil",
      input: "mV/V",
      bridge: "full-axial-poisson",
      gaugeFactor: 2.05,
      material: steel,
      thermal: { method: "polynomial", coefficients: [-25, 2.2, -0.05, 2e-4, -1e-6] },
      zero: { value: -0.3, temperature: 15 },
    },
    centre: -0.3,
    spread: 1,
  },
  {
    config: {
      kind: "foil",
      input: "microstrain",
      gaugeFactor: 2.1,
      loggerGaugeFactor: 2,
      material: steel,
      thermal: { method: "cte", gaugeCte: 10.8 },
      zero: { value: 40, temperature: 15 },
      ratedRange: 3000,
    },
    centre: 40,
    spread: 1500,
  },
  {
    config: { kind: "vibrating-wire", input: "Hz", gaugeFactor: 3.53, material: concrete, zero: { value: 800, temperature: 15 } },
    centre: 800,
    spread: 40,
  },
  {
    config: {
      kind: "vibrating-wire",
      input: "frequency-squared",
      gaugeFactor: 2.6,
      calibrationFactor: 0.97,
      material: steel,
      zero: { value: 2600, temperature: 15 },
    },
    centre: 2600,
    spread: 300,
  },
];

function prepareAll(): GaugeConverter[] {
  return GAUGES.map(({ config }) => {
    const gauge = prepareGauge(config);
    if (!gauge.ok) throw new Error(`bench gauge rejected: ${gauge.message}`);
    return gauge;
  });
}

/** Deterministic pseudo-random numbers (mulberry32) so every run converts the same readings. */
function random(seed: number): () => number {
  let state = seed;
  return () => {
    state = (state + 0x6d2b79f5) | 0;
    let t = Math.imul(state ^ (state >>> 15), 1 | state);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function syntheticReadings(count: number) {
  const next = random(42);
  const gauge = new Uint8Array(count);
  const value = new Float64Array(count);
  const temperature = new Float64Array(count);
  for (let i = 0; i < count; i++) {
    const g = Math.floor(next() * GAUGES.length);
    const { centre, spread } = GAUGES[g]!;
    gauge[i] = g;
    value[i] = centre + (next() - 0.5) * spread;
    temperature[i] = 15 + (next() - 0.5) * 30;
  }
  return { gauge, value, temperature };
}

function convertAll(converters: GaugeConverter[], readings: ReturnType<typeof syntheticReadings>): number {
  let checksum = 0;
  for (let i = 0; i < readings.value.length; i++) {
    const result = converters[readings.gauge[i]!]!.convert(readings.value[i]!, readings.temperature[i]);
    if (result.ok) checksum += result.stress;
  }
  return checksum;
}

export async function benchMechanics(): Promise<BenchResult[]> {
  const converters = prepareAll();
  const readings = syntheticReadings(READINGS);
  convertAll(converters, syntheticReadings(100_000));
  const start = performance.now();
  const checksum = convertAll(converters, readings);
  const seconds = (performance.now() - start) / 1000;
  if (!Number.isFinite(checksum)) throw new Error("bench produced a non-finite stress sum");
  const label = `mechanics: readings converted (${GAUGES.length} gauge kinds, ${READINGS.toLocaleString("en-US")} readings)`;
  return [
    { label, value: Math.round(READINGS / seconds), unit: "readings/s" },
    { label: "mechanics: time per reading", value: Number(((seconds / READINGS) * 1e9).toFixed(1)), unit: "ns" },
  ];
}
