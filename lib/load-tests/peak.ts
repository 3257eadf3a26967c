import { MICRO } from "@/lib/mechanics/stress";

/**
 * The measured response of one gauge to a diagnostic load test: the change of stress-producing
 * strain from the value just before the load, at its largest in the direction the model predicts.
 * Strain is tension-positive (µε), as everywhere in Hookeline.
 */

/**
 * A stretch of a gauge's record inside the test window: one reading (`low === high`, `start === end`)
 * or one summary interval of a dynamic gauge, whose lowest and highest strain are known but not
 * their instants (then the peak is placed at the interval).
 */
export interface StrainSpan {
  start: number;
  end: number;
  low: number;
  high: number;
}

/** The value the load is measured from: the last reading (or summary mean) before the window. */
export interface Baseline {
  time: number;
  strain: number;
}

export type LoadDirection = "tension" | "compression";

export type GaugeResponse =
  | { state: "no-data" }
  | { state: "no-baseline"; spans: number }
  | {
      state: "measured";
      direction: LoadDirection;
      baseline: Baseline;
      /**
       * Largest change from the baseline in the predicted sign, µε (signed like the prediction); 0
       * when the gauge never moved that way.
       */
      peak: number;
      /** The span holding the peak: a reading's instant, or a summary interval. */
      peakSpan: { start: number; end: number } | null;
      /** Largest change against the predicted sign, µε (signed; 0 when none): an engineer reads it beside the peak. */
      against: number;
      /** peak ÷ predicted: 1 when the structure strains as modelled, below 1 when it is stiffer. */
      ratio: number;
      spans: number;
    };

/** The direction a predicted strain points: tension for a positive one. */
export function directionOf(predicted: number): LoadDirection {
  return predicted > 0 ? "tension" : "compression";
}

/**
 * Measured peak and ratio from the spans in the window. Only the spans' extremes matter, so a
 * caller may pass every reading or just the window's highest and lowest: the answer is the same.
 * A prediction of 0 has no sign to measure in and is refused before this is reached.
 */
export function gaugeResponse(predicted: number, baseline: Baseline | null, spans: readonly StrainSpan[]): GaugeResponse {
  if (spans.length === 0) return { state: "no-data" };
  if (baseline === null) return { state: "no-baseline", spans: spans.length };
  const sign = predicted > 0 ? 1 : -1;
  // Signed distance from the baseline in the predicted direction: positive means "with the load".
  let withLoad = 0;
  let withSpan: StrainSpan | null = null;
  let againstLoad = 0;
  for (const span of spans) {
    const towards = sign * ((sign > 0 ? span.high : span.low) - baseline.strain);
    const away = -sign * ((sign > 0 ? span.low : span.high) - baseline.strain);
    if (towards > withLoad) {
      withLoad = towards;
      withSpan = span;
    }
    if (away > againstLoad) againstLoad = away;
  }
  // `|| 0`: no movement is 0, not the -0 a compressive sign would make of it.
  const peak = sign * withLoad || 0;
  return {
    state: "measured",
    direction: directionOf(predicted),
    baseline,
    peak,
    peakSpan: withSpan && { start: withSpan.start, end: withSpan.end },
    against: -sign * againstLoad || 0,
    ratio: peak / predicted || 0,
    spans: spans.length,
  };
}

/** The reading spans of points (time, strain). */
export function readingSpans(points: readonly { time: number; strain: number }[]): StrainSpan[] {
  return points.map((point) => ({ start: point.time, end: point.time, low: point.strain, high: point.strain }));
}

/**
 * Strain of a uniaxial gauge from its stress: the inverse of σ = E·ε + σ₀ (σ₀ the initial stress
 * added on conversion), so summaries kept in MPa read back in µε.
 */
export function strainFromStress(stressMPa: number, modulusMPa: number, initialStressMPa: number): number {
  return (stressMPa - initialStressMPa) / (modulusMPa * MICRO);
}
