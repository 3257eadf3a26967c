import { dayOf } from "@/lib/time-format";

/** What an exported chart says above itself: where, which gauge and quantity in which unit, and when. */
export type ChartExportTitle = {
  structure: string;
  gauge: string;
  quantity: string;
  unit: string;
  from: number;
  to: number;
  timeZone: string;
  formatTime: (ms: number) => string;
};

export function chartExportTitleLines(title: ChartExportTitle): [string, string] {
  return [
    `${title.structure} · gauge ${title.gauge} · ${title.quantity} (${title.unit})`,
    `${title.formatTime(title.from)} to ${title.formatTime(title.to)} (${title.timeZone})`,
  ];
}

/** A file name that keeps what the title says, days on the structure's calendar: `MILL-FB-LC-Q1-stress-2026-11-01-to-2026-11-08.png`. */
export function chartExportFileName(structureCode: string, gauge: string, quantity: string, from: number, to: number, timeZone: string): string {
  return `${structureCode}-${gauge}-${quantity}-${dayOf(from, timeZone)}-to-${dayOf(to, timeZone)}.png`;
}
