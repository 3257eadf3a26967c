import type { GaugeConfig } from "@/lib/mechanics";
import { DAY, HOUR, MINUTE } from "@/lib/series";
import { gaussian, mulberry32, streamSeed, type Random } from "./random";
import { prepareInverseConversion, type InverseConversion } from "./inverse-conversion";

const DAYS_PER_YEAR = 365.2425;
/** 1970-01-01, day 0 of epoch days, was a Thursday (0 = Sunday). */
const EPOCH_WEEKDAY = 4;

/** Site weather, shared by every gauge of the demo structure. Times of day are UTC. */
export interface SyntheticClimate {
  /** °C, the year's mean. */
  meanTemperature: number;
  /** °C from the mean to the warmest day's mean. */
  seasonalAmplitude: number;
  /** °C from a day's mean to its afternoon peak. */
  dailyAmplitude: number;
  /** Day of the year (0 = 1 January) with the warmest mean. */
  warmestDay: number;
  /** °C, typical size of the weather's slow departures from the seasonal norm. */
  weatherSwing: number;
  /** °C, scatter of each gauge's own thermometer around the site temperature. */
  thermometerNoise: number;
}

export interface TimeWindow {
  /** Epoch ms, inclusive. */
  from: number;
  /** Epoch ms, exclusive. */
  to: number;
}

/** What a gauge's member goes through; every strain is mechanical (stress-producing), in µε. */
export interface GaugeStory {
  /** Strain of a heavy vehicle or crowd on the span; its sign makes the member pull or push. */
  trafficAmplitude?: number;
  /** Standard deviation of the reading-to-reading scatter. */
  noise?: number;
  /** A slowly creeping zero, as from a debonding gauge or a settling support. */
  driftPerDay?: number;
  /** Share (0 to 1) of the member's free thermal expansion that its supports prevent. */
  thermalRestraint?: number;
  /** One-reading spikes: added to the first reading at or after `time`. */
  spikes?: readonly { time: number; strain: number }[];
  /** Lasting offsets from `time` on, as from a connector working loose or a bond slipping. */
  steps?: readonly { time: number; strain: number }[];
  /** The logger was offline: no readings in this window. */
  offline?: TimeWindow;
  /** Strain held over a window (a heavy load parked on the span), planted to cross a limit. */
  sustainedLoad?: TimeWindow & { strain: number };
}

export interface SyntheticGauge {
  tag: string;
  config: GaugeConfig;
  story?: GaugeStory;
}

export interface SyntheticOptions {
  /** Epoch ms of the first reading. */
  start: number;
  /** Defaults to 90. */
  days?: number;
  /**
   * Epoch ms: readings before it are drawn but not converted or yielded, so a logger continuing the
   * story from its last reading sends exactly what a run from `start` would. Defaults to `start`.
   */
  from?: number;
  /** Epoch ms, exclusive: the end of the readings instead of `days`. */
  until?: number;
  /** Ms between readings; defaults to 10 minutes. */
  interval?: number;
  /** Defaults to 1. */
  seed?: number;
  climate?: Partial<SyntheticClimate>;
  gauges: readonly SyntheticGauge[];
}

/** A raw reading as a logger would send it, plus the mechanical strain the story intended. */
export interface SyntheticReading {
  gauge: string;
  time: number;
  /** Raw value in the gauge's input unit (µε, mV/V, Hz or f²/1000). */
  value: number;
  /** °C at the gauge. */
  temperature: number;
  /** µε that converting `value` at `temperature` gives back; for checks, not for ingestion. */
  mechanicalStrain: number;
}

/** An invented temperate site (roughly a mid-latitude northern climate, from memory). */
export const DEFAULT_CLIMATE: SyntheticClimate = {
  meanTemperature: 11,
  seasonalAmplitude: 7,
  dailyAmplitude: 4,
  warmestDay: 200,
  weatherSwing: 2.5,
  thermometerNoise: 0.1,
};

/** Weather departures fade over about three days. */
const WEATHER_MEMORY = 3 * DAY;

/**
 * Streams readings time step by time step, every gauge at each step, like a logger's batches.
 * The same options give the same readings. Each gauge draws from a random stream named by its
 * tag, and its draws go on through an offline window, so neither adding a gauge nor moving a gap
 * changes the other readings.
 */
export function* syntheticReadings(options: SyntheticOptions): Generator<SyntheticReading, void, undefined> {
  const { start, days = 90, interval = 10 * MINUTE, seed = 1, gauges, from = start } = options;
  if (!Number.isSafeInteger(start) || !Number.isSafeInteger(interval) || interval <= 0 || !(days > 0)) {
    throw new RangeError("Synthetic readings need an integer start, a positive integer interval and a positive number of days.");
  }
  const climate = { ...DEFAULT_CLIMATE, ...options.climate };
  const weather = weatherWalk(climate, interval, mulberry32(seed));
  const stories = gauges.map((gauge) => gaugeStory(gauge, climate, start, mulberry32(streamSeed(seed, gauge.tag))));
  const steps = options.until === undefined ? Math.floor((days * DAY) / interval) : Math.ceil((options.until - start) / interval);
  for (let step = 0; step < steps; step++) {
    const time = start + step * interval;
    const siteTemperature = seasonalTemperature(climate, time) + weather();
    const wanted = time >= from;
    for (const story of stories) {
      const reading = story(time, interval, siteTemperature, wanted);
      if (reading) yield reading;
    }
  }
}

function seasonalTemperature(climate: SyntheticClimate, time: number): number {
  // Epoch days modulo the mean year stay within a day of the calendar's day of the year.
  const dayOfYear = (time / DAY) % DAYS_PER_YEAR;
  const hourOfDay = (time % DAY) / HOUR;
  return (
    climate.meanTemperature +
    climate.seasonalAmplitude * Math.cos((2 * Math.PI * (dayOfYear - climate.warmestDay)) / DAYS_PER_YEAR) +
    climate.dailyAmplitude * Math.cos((2 * Math.PI * (hourOfDay - 15)) / 24)
  );
}

/** A first-order autoregressive walk whose spread stays at `weatherSwing`. */
function weatherWalk(climate: SyntheticClimate, interval: number, random: Random): () => number {
  const persistence = Math.exp(-interval / WEATHER_MEMORY);
  const kick = climate.weatherSwing * Math.sqrt(1 - persistence * persistence);
  let departure = climate.weatherSwing * gaussian(random);
  return () => {
    departure = persistence * departure + kick * gaussian(random);
    return departure;
  };
}

/** Every step draws its random numbers; only a `wanted` one is converted into a reading. */
type GaugeStep = (time: number, interval: number, siteTemperature: number, wanted: boolean) => SyntheticReading | null;

function gaugeStory({ tag, config, story = {} }: SyntheticGauge, climate: SyntheticClimate, start: number, random: Random): GaugeStep {
  const toRaw: InverseConversion = prepareInverseConversion(config);
  const referenceTemperature = config.zero.temperature ?? climate.meanTemperature;
  const { trafficAmplitude = 0, noise = 1.5, driftPerDay = 0, thermalRestraint = 0, spikes = [], steps = [], offline, sustainedLoad } = story;
  const restrainedStrainPerDegree = -thermalRestraint * config.material.alpha;
  return (time, interval, siteTemperature, wanted) => {
    const temperature = siteTemperature + climate.thermometerNoise * gaussian(random);
    const traffic = random() < trafficIntensity(time) ? trafficAmplitude * (0.4 + 0.6 * random()) : 0;
    let strain =
      traffic +
      noise * gaussian(random) +
      (driftPerDay * (time - start)) / DAY +
      restrainedStrainPerDegree * (temperature - referenceTemperature);
    if (sustainedLoad && within(sustainedLoad, time)) strain += sustainedLoad.strain;
    for (const spike of spikes) if (time >= spike.time && time < spike.time + interval) strain += spike.strain;
    for (const step of steps) if (time >= step.time) strain += step.strain;
    if (!wanted || (offline && within(offline, time))) return null;
    return { gauge: tag, time, value: toRaw(strain, temperature), temperature, mechanicalStrain: strain };
  };
}

function within(window: TimeWindow, time: number): boolean {
  return time >= window.from && time < window.to;
}

/**
 * Chance that a heavy vehicle is on the span at a reading (invented): weekday peaks at 08:00 and
 * 17:30, a broad weekend midday, little at night.
 */
function trafficIntensity(time: number): number {
  const hour = (time % DAY) / HOUR;
  const weekday = (Math.floor(time / DAY) + EPOCH_WEEKDAY) % 7;
  const daytime = hour >= 6 && hour < 22 ? 0.25 : 0.03;
  if (weekday === 0 || weekday === 6) return daytime + 0.35 * bump(hour, 13, 3);
  return daytime + 0.6 * bump(hour, 8, 1.2) + 0.6 * bump(hour, 17.5, 1.2);
}

function bump(hour: number, peakHour: number, width: number): number {
  return Math.exp(-(((hour - peakHour) / width) ** 2));
}
