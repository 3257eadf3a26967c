import { describe, expect, it } from "vitest";
import { emptyRows } from "@/lib/ingest/batch";
import { appendRollupValues, ROLLUP_COLUMNS } from "@/lib/ingest/rollup-rows";

const HOUR = 3_600_000;

describe("roll-up arithmetic", () => {
  it("leaves out a reading whose strain or stress is not finite, so no sum becomes Infinity or NaN", () => {
    const rows = emptyRows(1, "S1");
    const readings: [number, number, number, number | null, number | null][] = [
      [0, 10, 2, 20, null],
      [60_000, Infinity, Infinity, 20, 3],
      [120_000, 20, 4, null, -1.5],
      [180_000, -Infinity, NaN, 21, 2],
    ];
    for (const [time, strain, stress, temperature, residual] of readings) {
      rows.time.push(time);
      rows.value.push(strain);
      rows.strain.push(strain);
      rows.stress.push(stress);
      rows.temperature.push(temperature);
      rows.flags.push(0);
      rows.residual.push(residual);
    }
    const out: (number | null)[] = [];
    expect(appendRollupValues(rows, out)).toBe(2);
    const hourly = Object.fromEntries(ROLLUP_COLUMNS.map((column, i) => [column, out[i]]));
    // By hand over the two finite readings: strains 10 and 20, stresses 2 and 4, one temperature of 20 °C, one residual of −1.5 µε.
    expect(hourly).toEqual({
      gauge_id: 1,
      resolution: HOUR,
      bucket: 0,
      count: 2,
      strain_min: 10,
      strain_max: 20,
      strain_sum: 30,
      stress_min: 2,
      stress_max: 4,
      stress_sum: 6,
      temperature_count: 1,
      temperature_min: 20,
      temperature_max: 20,
      temperature_sum: 20,
      residual_count: 1,
      residual_min: -1.5,
      residual_max: -1.5,
      residual_sum: -1.5,
    });
    expect(out.every((value) => value === null || Number.isFinite(value))).toBe(true);
  });
});
