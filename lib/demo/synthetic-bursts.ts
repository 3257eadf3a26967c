import type { GaugeConfig } from "@/lib/mechanics";
import { prepareInverseConversion } from "./inverse-conversion";
import { gaussian, mulberry32, streamSeed, type Random } from "./random";

/** What loads a dynamic demo gauge: people walking (about 2 Hz) or vehicles crossing. */
export type BurstStory =
  | { kind: "footfall"; /** µε of one busy burst's swing. */ amplitude: number; /** µε of the occasional group crossing in step. */ groupAmplitude: number }
  | { kind: "vehicles"; /** µε of a car's passage. */ carStrain: number; /** µε of a heavy vehicle's. */ heavyStrain: number };

export interface SyntheticBurstGauge {
  tag: string;
  config: GaugeConfig;
  story: BurstStory;
}

export interface SyntheticBurstOptions {
  start: number;
  /** Bursts per gauge, one every `everyMinutes` from `start`. */
  count: number;
  seed: number;
  rateHz: number;
  /** A burst of `burstSeconds` every `everyMinutes`: loggers that record a minute in five. */
  burstSeconds: number;
  everyMinutes: number;
  gauges: readonly SyntheticBurstGauge[];
}

export interface SyntheticBurst {
  gauge: string;
  start: number;
  rateHz: number;
  temperature: number;
  /** Raw samples in the gauge's input unit. */
  values: Float32Array;
}

const HOUR_MS = 3_600_000;

/** Busier by day: 0 at night, 1 at the peaks around 08:00 and 17:00 (hours in UTC, invented). */
function activity(time: number): number {
  const hour = (time % 86_400_000) / HOUR_MS;
  const peak = (centre: number) => Math.exp(-(((hour - centre) / 1.5) ** 2));
  return Math.min(1, 0.05 + 0.9 * Math.max(peak(8), peak(17)) + (hour > 7 && hour < 20 ? 0.3 : 0));
}

/** Mechanical strain (µε) of one burst's samples. */
function strainOf(story: BurstStory, random: Random, start: number, samples: number, rateHz: number): Float64Array {
  const strain = new Float64Array(samples);
  const busy = activity(start);
  for (let i = 0; i < samples; i++) strain[i] = 1.5 * gaussian(random);
  if (story.kind === "footfall") {
    const frequency = 1.8 + 0.4 * random();
    const amplitude = story.amplitude * busy * (0.5 + random());
    const phase = 2 * Math.PI * random();
    // Now and then a group walks in step for ten seconds: the swing several people make together.
    const group = random() < 0.04 * busy ? Math.floor(random() * (samples - 10 * rateHz)) : -1;
    for (let i = 0; i < samples; i++) {
      const inGroup = group >= 0 && i >= group && i < group + 10 * rateHz;
      const swing = inGroup ? story.groupAmplitude : amplitude;
      strain[i]! += swing * Math.sin((2 * Math.PI * frequency * i) / rateHz + phase);
    }
    return strain;
  }
  // Vehicles: each passage a smooth bump as the axles cross the span, 1 to 2 s long.
  const passages = Math.round(busy * 4 * random());
  for (let p = 0; p < passages; p++) {
    const heavy = random() < 0.08;
    const peak = (heavy ? story.heavyStrain : story.carStrain) * (0.7 + 0.6 * random());
    const length = Math.round((1 + random()) * rateHz);
    const at = Math.floor(random() * (samples - length));
    for (let i = 0; i < length; i++) strain[at + i]! += peak * Math.sin((Math.PI * i) / length) ** 2;
  }
  return strain;
}

/**
 * Invented bursts of dynamic demo gauges, the raw samples a logger would send, made by inverting
 * each gauge's conversion. Seeded per gauge by its tag, so a second run makes the same bursts.
 */
export function* syntheticBursts(options: SyntheticBurstOptions): Generator<SyntheticBurst> {
  const samples = options.burstSeconds * options.rateHz;
  const step = options.everyMinutes * 60_000;
  const { count } = options;
  for (const gauge of options.gauges) {
    const random = mulberry32(streamSeed(options.seed, gauge.tag));
    const toRaw = prepareInverseConversion(gauge.config);
    for (let k = 0; k < count; k++) {
      const start = options.start + k * step;
      const temperature = 11 + 6 * Math.sin((2 * Math.PI * (start % 86_400_000)) / 86_400_000 - Math.PI / 2);
      const strain = strainOf(gauge.story, random, start, samples, options.rateHz);
      const values = new Float32Array(samples);
      for (let i = 0; i < samples; i++) values[i] = toRaw(strain[i]!, temperature);
      yield { gauge: gauge.tag, start, rateHz: options.rateHz, temperature, values };
    }
  }
}
