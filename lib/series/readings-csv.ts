import { faultNames } from "@/lib/limits";
import { flagWords, type DerivedDecimals } from "@/lib/mechanics";
import { formatInTimeZone } from "@/lib/time-format";

/** The columns of GET …/readings as CSV, in the contract's names (what scripts look up). */
export const READINGS_CSV_COLUMNS = ["time", "value", "temperature", "strain", "stress", "flags"] as const;

/**
 * `names`: the contract's header. `units`: for people, after a byte-order mark so that
 * spreadsheets read µ and ° as UTF-8: the same columns with their units in the names, e.g.
 * `strain (µε)`, and beside the UTC time the structure's clock, its zone named.
 */
export type ReadingsCsvHeader = "names" | "units";

const INPUT_UNITS: Record<string, string> = { microstrain: "µε" };

export function readingsCsvHeader(header: ReadingsCsvHeader, input: string, timeZone: string): string {
  if (header === "names") return `${READINGS_CSV_COLUMNS.join(",")}\n`;
  const named = ["time (UTC)", `local time (${timeZone})`, `value (${INPUT_UNITS[input] ?? input})`, "temperature (°C)", "strain (µε)", "stress (MPa)", "flags"];
  return `\uFEFF${named.join(",")}\n`;
}

export type StoredReadingRow = { t: number; value: number; temperature: number | null; strain: number; stress: number; flags: number; fault: number };

/**
 * A reading's flag words: the conversion's (`outside-linear-range`, `out-of-range`) and sensor
 * health's verdict (`spike`, `jump`, `after-jump`, `flat-line`, `out-of-range`), each word once.
 */
export function readingFlagWords(row: Pick<StoredReadingRow, "flags" | "fault">): string[] {
  return [...new Set<string>([...flagWords(row.flags), ...faultNames(row.fault)])];
}

/**
 * One reading: raw value and temperature as the logger wrote them, strain and stress to the
 * gauge's resolution; with `localTimeZone` (the `units` header) the time on that clock as well.
 */
export function readingsCsvLine(row: StoredReadingRow, decimals: DerivedDecimals | null, localTimeZone: string | null = null): string {
  const strain = decimals ? row.strain.toFixed(decimals.strain) : String(row.strain);
  const stress = decimals ? row.stress.toFixed(decimals.stress) : String(row.stress);
  const local = localTimeZone ? `${formatInTimeZone(row.t, localTimeZone, { precision: "millisecond" })},` : "";
  return `${new Date(row.t).toISOString()},${local}${row.value},${row.temperature ?? ""},${strain},${stress},${readingFlagWords(row).join(" ")}\n`;
}
