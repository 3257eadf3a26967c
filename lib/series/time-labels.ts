import { axisText, formatInTimeZone, type AxisPart } from "@/lib/time-format";
import { DAY, MINUTE, SECOND } from "./bucket-grid";

/**
 * Chart times as people on site read them: on the structure's clock, whatever zone the browser is
 * in, in the app's one date format (lib/time-format.ts). Times arrive in epoch seconds, as uPlot
 * keeps them.
 */

/**
 * What a tick shows at each spacing, coarsest first (uPlot's own steps: a year is 365 days, a month
 * at least 28). The first tick, and any tick where the year or the day turns over, adds a second line
 * naming the year or the day, so a reader can place the short labels after it.
 */
const TICK_STYLES: readonly { from: number; label: AxisPart; newYear?: AxisPart; newDay?: AxisPart }[] = [
  { from: 365 * DAY, label: "year" },
  { from: 28 * DAY, label: "month" },
  { from: DAY, label: "monthDay", newYear: "year" },
  { from: MINUTE, label: "minute", newYear: "day", newDay: "day" },
  { from: 0, label: "second", newYear: "day", newDay: "day" },
];

/** Time-axis labels for uPlot's ticks (`splits`, epoch seconds) `increment` seconds apart: "2026", "2026-03", "03-02", "14:30". */
export function timeTickLabels(splits: readonly number[], increment: number, timeZone: string): string[] {
  const styles = TICK_STYLES.find((tick) => increment * SECOND >= tick.from)!;
  let previousYear: string | undefined;
  let previousDay: string | undefined;
  return splits.map((seconds) => {
    const year = axisText(seconds * SECOND, timeZone, "year");
    const day = axisText(seconds * SECOND, timeZone, "day");
    const context = year !== previousYear ? styles.newYear : day !== previousDay ? styles.newDay : undefined;
    previousYear = year;
    previousDay = day;
    const label = axisText(seconds * SECOND, timeZone, styles.label);
    return context ? `${label}\n${axisText(seconds * SECOND, timeZone, context)}` : label;
  });
}

/** "2026-03-01 14:30 GMT", the way the app's other times read; a dash where the legend has no time to show. */
export function legendTime(seconds: number | null, timeZone: string): string {
  return seconds === null || !Number.isFinite(seconds) ? "—" : formatInTimeZone(seconds * SECOND, timeZone);
}
