import type { ConditionState, GaugeCondition } from "./condition";

/**
 * The one code for a gauge's condition: a word, a shape and a colour, the same on badges, drawing
 * markers, legends, the report and e-mail. Each state has its own shape, so the code reads
 * without colour. Shapes are drawn in a 16 × 16 box; `fill` shapes take the state's colour,
 * `stroke` shapes are outlined in it. A retired gauge is no condition but is shown in the same code.
 */
export type ShownState = ConditionState | "retired";

type Mark = { kind: "fill" | "stroke" | "knockout"; d: string; dashed?: boolean };

export type StateLook = {
  word: string;
  /** What the shape is, for a legend read aloud or a plain-text reader. */
  shapeName: string;
  marks: readonly Mark[];
  /** Text colour class: the shape is drawn in currentColor. */
  colour: string;
  /** Badge classes around the shape and the word. */
  badge: string;
  /** The colour on paper (the PDF report), the light theme's shade of `colour`. */
  ink: string;
};

const CIRCLE = "M8 2a6 6 0 1 0 0.001 0Z";

export const STATE_LOOK: Record<ShownState, StateLook> = {
  critical: {
    word: "Critical",
    shapeName: "square",
    marks: [
      { kind: "fill", d: "M1 1h14v14H1Z" },
      { kind: "knockout", d: "M8 3.5v5.5M8 11.3v1.2" },
    ],
    colour: "text-critical",
    badge: "border-critical bg-red-50 text-critical dark:bg-red-950/40 dark:text-red-200",
    ink: "#b42318",
  },
  warning: {
    word: "Warning",
    shapeName: "diamond",
    marks: [{ kind: "fill", d: "M8 0.5 15.5 8 8 15.5 0.5 8Z" }],
    colour: "text-warning",
    badge: "border-warning bg-orange-50 text-warning dark:bg-orange-950/40 dark:text-orange-200",
    ink: "#b45309",
  },
  watch: {
    word: "Watch",
    shapeName: "triangle",
    marks: [{ kind: "fill", d: "M8 1.5 15 14.5H1Z" }],
    colour: "text-watch",
    badge: "border-watch bg-yellow-50 text-watch dark:bg-yellow-950/40 dark:text-yellow-200",
    ink: "#8a6d00",
  },
  "sensor-fault": {
    word: "Sensor fault",
    shapeName: "cross",
    marks: [{ kind: "stroke", d: "M2.5 2.5l11 11M13.5 2.5l-11 11" }],
    colour: "text-fuchsia-800 dark:text-fuchsia-300",
    badge: "border-fuchsia-800 bg-fuchsia-50 text-fuchsia-900 dark:bg-fuchsia-950/40 dark:text-fuchsia-200",
    ink: "#86198f",
  },
  "no-data": {
    word: "No current data",
    shapeName: "dashed ring",
    marks: [{ kind: "stroke", d: CIRCLE, dashed: true }],
    colour: "text-slate-600 dark:text-slate-300",
    badge: "border-dashed border-slate-500 text-slate-700 dark:text-slate-200",
    ink: "#475569",
  },
  "within-limits": {
    word: "Within limits",
    shapeName: "disc",
    marks: [{ kind: "fill", d: CIRCLE }],
    colour: "text-emerald-700 dark:text-emerald-400",
    badge: "border-emerald-700 bg-emerald-50 text-emerald-800 dark:bg-emerald-950/40 dark:text-emerald-200",
    ink: "#047857",
  },
  "no-limits": {
    word: "No limits",
    shapeName: "ring with a bar",
    marks: [{ kind: "stroke", d: `${CIRCLE}M5 8h6` }],
    colour: "text-sky-800 dark:text-sky-300",
    badge: "border-sky-800 bg-sky-50 text-sky-900 dark:bg-sky-950/40 dark:text-sky-200",
    ink: "#075985",
  },
  retired: {
    word: "Retired",
    shapeName: "bar",
    marks: [{ kind: "stroke", d: "M2 8h12" }],
    colour: "text-slate-400",
    badge: "border-slate-300 bg-slate-100 text-slate-600 dark:bg-slate-800 dark:text-slate-400",
    ink: "#94a3b8",
  },
};

/** What a gauge shows: its condition's state, or retired. */
export const shownState = (condition: Pick<GaugeCondition, "state">, retired = false): ShownState => (retired ? "retired" : condition.state);

/** Legends list the states in their order of precedence, then retired. */
export const SHOWN_STATES: readonly ShownState[] = ["critical", "warning", "watch", "sensor-fault", "no-data", "within-limits", "no-limits", "retired"];

const FAULT_WORDS: Record<string, string> = { jump: "jump", "flat-line": "flat line", "out-of-range": "beyond rated range", stale: "no data arriving", sensor: "sensor" };

/** A sensor fault's code in words: "flat-line" → "flat line". */
export const faultWord = (code: string) => FAULT_WORDS[code] ?? code;

/**
 * The condition in one line of words: "Sensor fault (jump)", "Within limits, data stale".
 * Never "within limits" alone for old data.
 */
export function conditionText(condition: Pick<GaugeCondition, "state" | "faults" | "stale">, retired = false): string {
  if (retired) return STATE_LOOK.retired.word;
  const parts = [STATE_LOOK[condition.state].word];
  const faults = condition.faults.map(faultWord);
  if (faults.length && condition.state === "sensor-fault") parts[0] += ` (${faults.join(", ")})`;
  else if (faults.length) parts.push(`sensor fault: ${faults.join(", ")}`);
  if (condition.stale && condition.state !== "no-data") parts.push("data stale");
  return parts.join("; ");
}
