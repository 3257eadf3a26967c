import { describe, expect, it } from "vitest";
import { createFatigueHistory, rainflow, type Cycle } from "@/lib/fatigue";
import { ASTM_EXAMPLE } from "./fixtures";

const MINUTE = 60_000;
const DAY = 86_400_000;

function countsByRange(cycles: readonly Cycle[]): Record<number, number> {
  const counts: Record<number, number> = {};
  for (const { range, count } of cycles) counts[range] = (counts[range] ?? 0) + count;
  return counts;
}

function count(history: ReturnType<typeof createFatigueHistory>, samples: readonly [number, number][]) {
  const cycles: Cycle[] = [];
  for (const [time, stress] of samples) {
    history.push(time, stress);
    cycles.push(...history.takeCounted());
  }
  return [...cycles, ...history.finish()];
}

describe("fatigue history by zero epoch", () => {
  // The ASTM E1049-85 (2017) 5.4.4 example gives ½ × 3, 1½ × 4, ½ × 6, 1 × 8 and ½ × 9 (residue as halves).
  const example = { 3: 0.5, 4: 1.5, 6: 0.5, 8: 1, 9: 0.5 };

  it("counts each zero epoch on its own, so the step of a re-zero is no range", () => {
    // The same loading before and after a re-zero that moved every later value up by 10.
    const before = ASTM_EXAMPLE.map((value, i): [number, number] => [i * MINUTE, value]);
    const after = ASTM_EXAMPLE.map((value, i): [number, number] => [(9 + i) * MINUTE, value + 10]);
    const cycles = count(createFatigueHistory([9 * MINUTE], 30 * MINUTE), [...before, ...after]);
    expect(countsByRange(cycles)).toEqual(Object.fromEntries(Object.entries(example).map(([range, n]) => [range, 2 * n])));
    // Counted as one history, the step joins the residues into ranges of 10 and more.
    const joined = rainflow([...before, ...after].map(([, value]) => value));
    expect(Math.max(...joined.map((cycle) => cycle.range))).toBeGreaterThanOrEqual(10);
  });

  it("counts an epoch start before the first reading as no restart", () => {
    const history = createFatigueHistory([-DAY, 0], 30 * MINUTE);
    const cycles = count(history, ASTM_EXAMPLE.map((value, i) => [i * MINUTE, value]));
    expect(countsByRange(cycles)).toEqual(example);
    expect(history.coverage().epochs).toBe(1);
  });

  it("covers the intervals between readings but not a gap longer than allowed", () => {
    const history = createFatigueHistory([], 30 * MINUTE);
    const first = ASTM_EXAMPLE.map((value, i): [number, number] => [i * MINUTE, value]);
    const second = ASTM_EXAMPLE.map((value, i): [number, number] => [5 * DAY + i * MINUTE, value]);
    count(history, [...first, ...second]);
    // By hand: 8 one-minute intervals in each block; the 5-day − 8-minute silence between them is a gap.
    expect(history.coverage()).toEqual({ coveredMs: 16 * MINUTE, gaps: 1, gapMs: 5 * DAY - 8 * MINUTE, epochs: 1 });
  });

  it("refuses readings out of time order", () => {
    const history = createFatigueHistory([], MINUTE);
    history.push(10, 1);
    expect(() => history.push(10, 2)).toThrow(RangeError);
  });
});
