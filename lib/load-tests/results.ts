import type { LoadTestGauge, LoadTestResults } from "@/lib/api/load-test-schemas";
import { csvField } from "@/lib/ingest/csv-preview";
import { formatInTimeZone } from "@/lib/time-format";
import { directionOf, type GaugeResponse } from "./peak";

export const LOAD_TEST_CAUTION =
  "The ratio of measured to predicted strain is one input to the engineer's judgement of the structure, not a verdict: it depends on the model, " +
  "the gauge's position, temperature during the test and how the load was placed. Its meaning, and any decision taken on it, rest with a licensed " +
  "engineer under local codes.";

const iso = (ms: number) => new Date(ms).toISOString();

/** How each state reads on screen, in the report and in the CSV. */
export function responseMessage(response: GaugeResponse): string {
  switch (response.state) {
    case "no-data":
      return "No data in window: no believed reading or summary between start and end.";
    case "no-baseline":
      return "No baseline: nothing was recorded before the window start to measure the load from.";
    case "measured":
      return response.peak === 0 ? `Measured: the gauge did not move in the predicted ${response.direction} direction.` : "Measured.";
  }
}

export type GaugeOfTest = { gauge: string; label: string | null; member: string | null; source: LoadTestGauge["source"]; predicted: number };

/** One gauge's line of the results. */
export function gaugeResult(gauge: GaugeOfTest, response: GaugeResponse): LoadTestGauge {
  const measured = response.state === "measured" ? response : null;
  return {
    ...gauge,
    direction: directionOf(gauge.predicted),
    state: response.state,
    message: responseMessage(response),
    baseline: measured && { time: iso(measured.baseline.time), strain: measured.baseline.strain },
    measured: measured?.peak ?? null,
    peakAt: measured?.peakSpan ? { start: iso(measured.peakSpan.start), end: iso(measured.peakSpan.end) } : null,
    against: measured?.against ?? null,
    ratio: measured?.ratio ?? null,
    readings: response.state === "no-data" ? 0 : response.spans,
  };
}

/** Whether every gauge, some, or none could be measured. */
export function dataStateOf(gauges: readonly Pick<LoadTestGauge, "state">[]): LoadTestResults["dataState"] {
  const measured = gauges.filter((gauge) => gauge.state === "measured").length;
  return measured === gauges.length ? "complete" : measured === 0 ? "none" : "partial";
}

/** Strain to 0.1 µε, about the resolution of a foil gauge logger (common practice); ratios to 0.01. */
export const roundStrain = (value: number) => Math.round(value * 10) / 10;
export const roundRatio = (value: number) => Math.round(value * 100) / 100;

const cell = (value: number | null, round: (value: number) => number, digits: number) => (value === null ? "" : round(value).toFixed(digits));

export const RESULTS_CSV_HEADER = [
  "gauge",
  "member",
  "source",
  "predicted (µε)",
  "baseline (µε)",
  "baseline time (UTC)",
  "measured peak (µε)",
  "ratio (measured/predicted)",
  "largest change against (µε)",
  "peak from (UTC)",
  "peak to (UTC)",
  "state",
] as const;

/** The results as CSV for the report: units in the header, strain to 0.1 µε and ratios to 0.01, empty cells where nothing was measured. */
export function resultsCsv(results: Pick<LoadTestResults, "gauges">): string {
  const lines = results.gauges.map((gauge) =>
    [
      gauge.gauge,
      gauge.member ?? "",
      gauge.source,
      cell(gauge.predicted, roundStrain, 1),
      cell(gauge.baseline?.strain ?? null, roundStrain, 1),
      gauge.baseline?.time ?? "",
      cell(gauge.measured, roundStrain, 1),
      cell(gauge.ratio, roundRatio, 2),
      cell(gauge.against, roundStrain, 1),
      gauge.peakAt?.start ?? "",
      gauge.peakAt?.end ?? "",
      gauge.message,
    ]
      .map(csvField)
      .join(","),
  );
  return [RESULTS_CSV_HEADER.map(csvField).join(","), ...lines].join("\r\n") + "\r\n";
}

/** A strain for the screen: to 0.1 µε with its unit; a dash where nothing was measured. */
export const strainText = (value: number | null) => (value === null ? "—" : `${roundStrain(value).toFixed(1)} µε`);
export const ratioText = (value: number | null) => (value === null ? "—" : roundRatio(value).toFixed(2));

/** A test as lines of text for the printed report: a heading, the window and load, then one line per gauge. */
export function loadTestReportLines(test: LoadTestResults, timeZone: string): { title: string; lines: string[] } {
  const when = `${formatInTimeZone(new Date(test.start), timeZone)} to ${formatInTimeZone(new Date(test.end), timeZone)}`;
  return {
    title: `Load test: ${test.title}`,
    lines: [
      `${when}; ${test.load}; recorded by ${test.createdBy}.`,
      ...test.gauges.map((gauge) =>
        gauge.state === "measured"
          ? `${gauge.gauge}: measured ${strainText(gauge.measured)} from a baseline of ${strainText(gauge.baseline?.strain ?? null)}, predicted ${strainText(gauge.predicted)}, ratio ${ratioText(gauge.ratio)}.`
          : `${gauge.gauge}: predicted ${strainText(gauge.predicted)}. ${gauge.message}`,
      ),
    ],
  };
}
