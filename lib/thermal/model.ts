import { AppError } from "@/lib/errors";
import { leastSquares } from "./least-squares";

/**
 * Thermal model of one gauge: stress-producing strain = a + b·T(t − lag) (+ c·t), fitted by
 * ordinary least squares over a reference period. The residual, measured − model, is what is
 * left once the daily and seasonal temperature swing is taken out.
 */

export const MINUTE_MS = 60_000;
export const DAY_MS = 86_400_000;
/** Fewer points than a day of hourly readings gives a slope that one disturbed hour can swing. */
export const MIN_FIT_READINGS = 24;
/** Product choice: below a few degrees of swing the slope is mostly the gauge's own noise. */
export const MIN_TEMPERATURE_RANGE_C = 3;
/** The automatic lag search looks at most this far back (thick concrete lags its air by hours, not days). */
export const MAX_AUTO_LAG_MINUTES = 24 * 60;
/** Steps of the automatic lag grid at most; the step grows for long searches. */
export const MAX_LAG_STEPS = 144;
/** Temperature is interpolated between readings no further apart than this; beyond it, it is unknown. */
export const MAX_TEMPERATURE_GAP_MS = 6 * 60 * MINUTE_MS;

export type ThermalSample = { time: number; strain: number; temperature: number | null };

export type ThermalFitRequest = {
  /** Epoch ms, inclusive. */
  from: number;
  /** Epoch ms, inclusive. */
  to: number;
  lagMinutes: number | "auto";
  /** How far back the automatic search looks, minutes; default the lesser of a day and half the period. */
  maxLagMinutes?: number;
  drift: boolean;
};

export type ThermalModel = {
  /** µε */
  intercept: number;
  /** µε/°C */
  slope: number;
  lagMinutes: number;
  /** µε/day, counted from `driftOrigin`; null without a drift term. */
  drift: number | null;
  /** Epoch ms from which the drift term counts days (the start of the reference period). */
  driftOrigin: number;
  r2: number;
  /** µε, √(SSres / (n − p)). */
  residualStd: number;
  readings: number;
};

type TemperaturePoint = { time: number; temperature: number };

/** Readings with a finite temperature, in time order: the history T(t) is interpolated from. */
export function temperatureHistory(samples: readonly ThermalSample[]): TemperaturePoint[] {
  return samples
    .filter((sample): sample is ThermalSample & { temperature: number } => sample.temperature !== null && Number.isFinite(sample.temperature))
    .map(({ time, temperature }) => ({ time, temperature }))
    .sort((a, b) => a.time - b.time);
}

/** T at `time` by linear interpolation between the neighbouring readings, or null where unknown. */
export function temperatureAt(history: readonly TemperaturePoint[], time: number): number | null {
  const first = history[0];
  const last = history[history.length - 1];
  if (!first || !last || time < first.time || time > last.time) return null;
  let low = 0;
  let high = history.length - 1;
  while (high - low > 1) {
    const middle = (low + high) >> 1;
    if ((history[middle]?.time ?? Infinity) <= time) low = middle;
    else high = middle;
  }
  const before = history[low] ?? first;
  const after = history[high] ?? last;
  if (before.time === time) return before.temperature;
  if (after.time === time) return after.temperature;
  if (after.time - before.time > MAX_TEMPERATURE_GAP_MS) return null;
  return before.temperature + ((after.temperature - before.temperature) * (time - before.time)) / (after.time - before.time);
}

/** Model strain at `time` for the lagged temperature given, µε. */
export function modelStrain(model: ThermalModel, laggedTemperature: number, time: number): number {
  const drift = model.drift === null ? 0 : (model.drift * (time - model.driftOrigin)) / DAY_MS;
  return model.intercept + model.slope * laggedTemperature + drift;
}

/**
 * Residual (measured − model, µε) of each sample, or null where the temperature `lag` earlier is
 * unknown. `history` must cover the lag before the first sample (pass earlier readings' temperatures).
 */
export function thermalResiduals(model: ThermalModel, samples: readonly ThermalSample[], history: readonly TemperaturePoint[]): (number | null)[] {
  const lagMs = model.lagMinutes * MINUTE_MS;
  return samples.map((sample) => {
    const lagged = temperatureAt(history, sample.time - lagMs);
    return lagged === null || !Number.isFinite(sample.strain) ? null : sample.strain - modelStrain(model, lagged, sample.time);
  });
}

const fitError = (field: string, message: string) =>
  new AppError("validation_failed", message, { issues: [{ path: field, message }] });

/**
 * Fits the model over [from, to]. `samples` may reach before `from` so a lagged temperature can be
 * read there; only samples inside the period are fitted. With `lagMinutes: "auto"` every lag of a
 * grid from 0 to the search bound is tried and the one with the smallest residual sum is kept.
 */
export function fitThermalModel(samples: readonly ThermalSample[], request: ThermalFitRequest): ThermalModel {
  const { from, to } = request;
  if (!(to > from)) throw fitError("to", "The reference period must end after it starts.");
  const periodMinutes = (to - from) / MINUTE_MS;
  if (request.lagMinutes !== "auto" && request.lagMinutes > periodMinutes) {
    throw fitError("lagMinutes", `A lag of ${request.lagMinutes} min is longer than the reference period (${Math.floor(periodMinutes)} min); choose a shorter lag or a longer period.`);
  }
  if (request.lagMinutes === "auto" && request.maxLagMinutes !== undefined && request.maxLagMinutes > periodMinutes) {
    throw fitError(
      "maxLagMinutes",
      `A lag search up to ${request.maxLagMinutes} min is longer than the reference period (${Math.floor(periodMinutes)} min); search a shorter lag or choose a longer period.`,
    );
  }
  const history = temperatureHistory(samples);
  const inPeriod = samples
    .filter((sample) => sample.time >= from && sample.time <= to && Number.isFinite(sample.strain))
    .sort((a, b) => a.time - b.time);
  const withTemperature = inPeriod.filter((sample) => sample.temperature !== null && Number.isFinite(sample.temperature));
  if (withTemperature.length < MIN_FIT_READINGS) {
    throw fitError("from", `The reference period holds ${withTemperature.length} readings with a temperature; a thermal fit needs at least ${MIN_FIT_READINGS}. Choose a longer period.`);
  }
  const temperatures = withTemperature.map((sample) => sample.temperature as number);
  const range = Math.max(...temperatures) - Math.min(...temperatures);
  if (range < MIN_TEMPERATURE_RANGE_C) {
    throw fitError("from", `The temperature in the reference period spans only ${range.toFixed(1)} °C; a thermal fit needs at least ${MIN_TEMPERATURE_RANGE_C} °C of range. Choose a period with a larger swing.`);
  }

  const lags = request.lagMinutes === "auto" ? lagGrid(periodMinutes, inPeriod, request.maxLagMinutes) : [request.lagMinutes];
  let best: ThermalModel | null = null;
  let bestResidualSum = Infinity;
  for (const lag of lags) {
    const fit = fitAtLag(inPeriod, history, lag, request.drift, from);
    if (fit && fit.residualSumOfSquares < bestResidualSum) {
      best = fit.model;
      bestResidualSum = fit.residualSumOfSquares;
    }
  }
  if (!best) {
    throw fitError("lagMinutes", `No lag left ${MIN_FIT_READINGS} readings with a known temperature that far back and ${MIN_TEMPERATURE_RANGE_C} °C of range; choose a smaller lag or a period with readings before it.`);
  }
  return best;
}

/** 0, step, 2·step, … up to `maxLagMinutes` (default the lesser of a day and half the period), at least the sampling interval apart. */
export function lagGrid(periodMinutes: number, inPeriod: readonly ThermalSample[], maxLagMinutes?: number): number[] {
  const bound = maxLagMinutes ?? Math.min(MAX_AUTO_LAG_MINUTES, Math.floor(periodMinutes / 2));
  const intervals = inPeriod.slice(1).map((sample, i) => sample.time - (inPeriod[i]?.time ?? sample.time)).filter((gap) => gap > 0).sort((a, b) => a - b);
  const typicalMinutes = (intervals[intervals.length >> 1] ?? MINUTE_MS) / MINUTE_MS;
  const step = Math.max(1, Math.round(typicalMinutes), Math.ceil(bound / MAX_LAG_STEPS));
  const grid: number[] = [];
  for (let lag = 0; lag <= bound; lag += step) grid.push(lag);
  return grid;
}

function fitAtLag(inPeriod: readonly ThermalSample[], history: readonly TemperaturePoint[], lagMinutes: number, drift: boolean, origin: number) {
  const lagMs = lagMinutes * MINUTE_MS;
  const points: { temperature: number; days: number; strain: number }[] = [];
  for (const sample of inPeriod) {
    const temperature = temperatureAt(history, sample.time - lagMs);
    if (temperature !== null) points.push({ temperature, days: (sample.time - origin) / DAY_MS, strain: sample.strain });
  }
  if (points.length < MIN_FIT_READINGS) return null;
  const temperatures = points.map((point) => point.temperature);
  if (Math.max(...temperatures) - Math.min(...temperatures) < MIN_TEMPERATURE_RANGE_C) return null;
  // Centred regressors keep the normal equations well conditioned (°C near 20, days near 15).
  const meanTemperature = mean(temperatures);
  const meanDays = mean(points.map((point) => point.days));
  const rows = points.map((point) => (drift ? [1, point.temperature - meanTemperature, point.days - meanDays] : [1, point.temperature - meanTemperature]));
  const fit = leastSquares(rows, points.map((point) => point.strain));
  if (!fit) return null;
  const [centredIntercept = NaN, slope = NaN, driftPerDay = 0] = fit.coefficients;
  const parameters = drift ? 3 : 2;
  const model: ThermalModel = {
    intercept: centredIntercept - slope * meanTemperature - driftPerDay * meanDays,
    slope,
    lagMinutes,
    drift: drift ? driftPerDay : null,
    driftOrigin: origin,
    r2: fit.totalSumOfSquares > 0 ? 1 - fit.residualSumOfSquares / fit.totalSumOfSquares : 1,
    residualStd: Math.sqrt(fit.residualSumOfSquares / Math.max(1, points.length - parameters)),
    readings: points.length,
  };
  return { model, residualSumOfSquares: fit.residualSumOfSquares };
}

const mean = (values: readonly number[]) => values.reduce((sum, value) => sum + value, 0) / values.length;
