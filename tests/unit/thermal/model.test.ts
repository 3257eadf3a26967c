import { describe, expect, it } from "vitest";
import { AppError } from "@/lib/errors";
import { DAY_MS, MINUTE_MS, fitThermalModel, temperatureHistory, thermalResiduals, type ThermalSample } from "@/lib/thermal";

// Synthetic physics made here: a restrained member whose stress-producing strain follows its own
// temperature, which lags the air temperature the logger records: ε = a + b·T(t − lag) (+ step).
const START = Date.UTC(2025, 5, 1);
const STEP_MS = 10 * MINUTE_MS;
const A = 35; // µε
const B = -9.6; // µε/°C
const LAG_MINUTES = 180;

function airTemperature(time: number) {
  const days = (time - START) / DAY_MS;
  // Daily swing of ±6 °C with a slower weather swing of ±3 °C over about five days.
  return 18 + 6 * Math.sin(2 * Math.PI * days) + 3 * Math.sin((2 * Math.PI * days) / 5.3 + 1);
}

/** Small deterministic noise (a fixed linear congruential sequence), ±0.5 µε. */
function noiseSequence() {
  let state = 12345;
  return () => {
    state = (state * 1103515245 + 12345) % 2147483648;
    return state / 2147483648 - 0.5;
  };
}

function synthetic(days: number, options: { stepAt?: number; step?: number; driftPerDay?: number } = {}): ThermalSample[] {
  const noise = noiseSequence();
  const samples: ThermalSample[] = [];
  for (let time = START; time <= START + days * DAY_MS; time += STEP_MS) {
    const lagged = airTemperature(time - LAG_MINUTES * MINUTE_MS);
    const step = options.stepAt !== undefined && time >= options.stepAt ? (options.step ?? 0) : 0;
    const drift = ((options.driftPerDay ?? 0) * (time - START)) / DAY_MS;
    samples.push({ time, strain: A + B * lagged + drift + step + noise(), temperature: airTemperature(time) });
  }
  return samples;
}

describe("thermal model fit", () => {
  it("recovers the planted coefficient and lag with an automatic lag search", () => {
    const samples = synthetic(14);
    const model = fitThermalModel(samples, { from: START + DAY_MS, to: START + 14 * DAY_MS, lagMinutes: "auto", drift: false });
    expect(model.lagMinutes).toBe(LAG_MINUTES);
    expect(model.slope).toBeCloseTo(B, 2);
    expect(model.intercept).toBeCloseTo(A, 0);
    expect(model.r2).toBeGreaterThan(0.999);
    // Uniform noise on ±0.5 has standard deviation 1/√12 = 0.289 µε.
    expect(model.residualStd).toBeGreaterThan(0.25);
    expect(model.residualStd).toBeLessThan(0.33);
  });

  it("searches only as far back as asked: a bound short of the true lag stops at the bound", () => {
    const samples = synthetic(10);
    const period = { from: START + DAY_MS, to: START + 10 * DAY_MS, drift: false, lagMinutes: "auto" as const };
    expect(fitThermalModel(samples, { ...period, maxLagMinutes: 6 * 60 }).lagMinutes).toBe(LAG_MINUTES);
    expect(fitThermalModel(samples, { ...period, maxLagMinutes: 60 }).lagMinutes).toBe(60);
  });

  it("fits worse at a wrong fixed lag than at the true one", () => {
    const samples = synthetic(10);
    const period = { from: START + DAY_MS, to: START + 10 * DAY_MS, drift: false };
    const right = fitThermalModel(samples, { ...period, lagMinutes: LAG_MINUTES });
    const wrong = fitThermalModel(samples, { ...period, lagMinutes: 0 });
    expect(right.residualStd).toBeLessThan(wrong.residualStd / 10);
  });

  it("recovers a linear drift term in µε/day", () => {
    const samples = synthetic(20, { driftPerDay: 1.5 });
    const model = fitThermalModel(samples, { from: START + DAY_MS, to: START + 20 * DAY_MS, lagMinutes: LAG_MINUTES, drift: true });
    expect(model.drift).toBeCloseTo(1.5, 2);
    expect(model.slope).toBeCloseTo(B, 2);
    expect(model.driftOrigin).toBe(START + DAY_MS);
  });

  it("shows a planted 20 µε step in the residual and stays near zero before it", () => {
    const stepAt = START + 20 * DAY_MS;
    const samples = synthetic(30, { stepAt, step: 20 });
    const model = fitThermalModel(samples, { from: START + DAY_MS, to: START + 15 * DAY_MS, lagMinutes: "auto", drift: false });
    const residuals = thermalResiduals(model, samples, temperatureHistory(samples));
    const before = residuals.filter((_, i) => samples[i]!.time >= START + DAY_MS && samples[i]!.time < stepAt) as number[];
    const after = residuals.filter((_, i) => samples[i]!.time >= stepAt) as number[];
    const mean = (values: number[]) => values.reduce((s, v) => s + v, 0) / values.length;
    expect(Math.max(...before.map(Math.abs))).toBeLessThan(1);
    expect(mean(before)).toBeCloseTo(0, 1);
    expect(mean(after)).toBeCloseTo(20, 0);
    // The raw strain swings by far more than the step: the residual is what makes it visible.
    const strains = samples.map((sample) => sample.strain);
    expect(Math.max(...strains) - Math.min(...strains)).toBeGreaterThan(100);
    // Readings whose lagged temperature precedes the history have no residual.
    expect(residuals[0]).toBeNull();
  });

  it("refuses too few readings, too little temperature range and a lag longer than the period, saying what is needed", () => {
    const samples = synthetic(3);
    const fit = (request: Partial<Parameters<typeof fitThermalModel>[1]>, data = samples) => () =>
      fitThermalModel(data, { from: START, to: START + 3 * DAY_MS, lagMinutes: 0, drift: false, ...request });
    expect(fit({ to: START + 2 * 60 * MINUTE_MS })).toThrow(/holds 13 readings with a temperature; a thermal fit needs at least 24/);
    const flat = samples.map((sample) => ({ ...sample, temperature: 20 + (sample.temperature! - 18) / 10 }));
    expect(fit({}, flat)).toThrow(/spans only 1\.[0-9] °C; a thermal fit needs at least 3 °C/);
    expect(fit({ lagMinutes: 5000 })).toThrow(/lag of 5000 min is longer than the reference period \(4320 min\)/);
    expect(fit({ lagMinutes: "auto", maxLagMinutes: 4321 })).toThrow(/lag search up to 4321 min is longer than the reference period \(4320 min\)/);
    expect(fit({ to: START - 1 })).toThrow(AppError);
  });
});
