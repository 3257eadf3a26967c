import { describe, expect, it } from "vitest";
import { validateLimits, type LimitInput, type LimitProblem } from "@/lib/limits";

// Each refusal is a limit no alarm could act on (an upper bound below its lower one, a negative dead
// band, a level named twice); levels escalate watch → warning → critical (common practice).

function problemsOf(inputs: LimitInput[]): LimitProblem[] {
  const result = validateLimits(inputs);
  if (result.ok) throw new Error("expected the limits to be refused");
  return result.problems;
}

function onlyProblem(inputs: LimitInput[]): LimitProblem {
  const problems = problemsOf(inputs);
  expect(problems).toHaveLength(1);
  return problems[0]!;
}

describe("a sound limit set", () => {
  it("is accepted with defaults applied: hysteresis 0, persistence 1", () => {
    const result = validateLimits([
      { quantity: "stress", level: "watch", upper: 150, lower: -150 },
      { quantity: "stress", level: "critical", upper: 250, lower: -250, hysteresis: 10, persistence: 3 },
      { quantity: "strain", level: "watch", upper: 800 },
    ]);
    expect(result).toEqual({
      ok: true,
      limits: [
        { quantity: "stress", level: "watch", upper: 150, lower: -150, hysteresis: 0, persistence: 1 },
        { quantity: "stress", level: "critical", upper: 250, lower: -250, hysteresis: 10, persistence: 3 },
        { quantity: "strain", level: "watch", upper: 800, hysteresis: 0, persistence: 1 },
      ],
    });
  });

  it("accepts equal bounds at two levels and a dead band of exactly half the span", () => {
    const result = validateLimits([
      { quantity: "stress", level: "watch", upper: 100, lower: -100, hysteresis: 100 },
      { quantity: "stress", level: "warning", upper: 100, lower: -120 },
    ]);
    expect(result.ok).toBe(true);
  });
});

describe("refusals of a single limit", () => {
  it("refuses a limit with neither bound", () => {
    expect(onlyProblem([{ quantity: "stress", level: "watch" }])).toMatchObject({ index: 0, field: "upper", code: "no-bound" });
  });

  it.each([
    [100, 100],
    [120, 100],
  ])("refuses lower %d with upper %d", (lower, upper) => {
    const problem = onlyProblem([{ quantity: "stress", level: "watch", upper, lower }]);
    expect(problem).toMatchObject({ field: "lower", code: "lower-not-below-upper" });
    expect(problem.message).toContain("must be below the upper bound");
  });

  it("refuses a negative hysteresis", () => {
    expect(onlyProblem([{ quantity: "stress", level: "watch", upper: 100, hysteresis: -1 }])).toMatchObject({
      field: "hysteresis",
      code: "negative-hysteresis",
    });
  });

  it("refuses a dead band wider than the span, and one over half of it, which could never clear", () => {
    for (const hysteresis of [250, 101]) {
      const problem = onlyProblem([{ quantity: "stress", level: "watch", upper: 100, lower: -100, hysteresis }]);
      expect(problem).toMatchObject({ field: "hysteresis", code: "hysteresis-too-wide" });
      expect(problem.message).toContain("at most half the span, 100");
    }
  });

  it.each([0, -2, 1.5])("refuses persistence %d", (persistence) => {
    expect(onlyProblem([{ quantity: "stress", level: "watch", upper: 100, persistence }])).toMatchObject({
      field: "persistence",
      code: "invalid-persistence",
    });
  });

  it("refuses non-finite numbers in each field and reports nothing else for that limit", () => {
    const problems = problemsOf([
      { quantity: "stress", level: "watch", upper: Number.NaN, lower: -Infinity, hysteresis: Infinity, persistence: Number.NaN },
    ]);
    expect(problems.map((problem) => [problem.field, problem.code])).toEqual([
      ["upper", "non-finite"],
      ["lower", "non-finite"],
      ["hysteresis", "non-finite"],
      ["persistence", "non-finite"],
    ]);
  });

  it("addresses each problem to its limit's index", () => {
    const problems = problemsOf([
      { quantity: "stress", level: "watch", upper: 100 },
      { quantity: "stress", level: "warning", upper: 150, persistence: 0 },
    ]);
    expect(problems).toEqual([expect.objectContaining({ index: 1, field: "persistence" })]);
  });
});

describe("refusals across levels", () => {
  it("refuses a second limit for the same quantity and level, but not for another quantity", () => {
    const problem = onlyProblem([
      { quantity: "stress", level: "watch", upper: 100 },
      { quantity: "strain", level: "watch", upper: 500 },
      { quantity: "stress", level: "watch", upper: 120 },
    ]);
    expect(problem).toMatchObject({ index: 2, field: "level", code: "duplicate-level" });
  });

  it("refuses a higher level whose upper bound is inside a milder level's", () => {
    const problem = onlyProblem([
      { quantity: "stress", level: "watch", upper: 100 },
      { quantity: "stress", level: "critical", upper: 90 },
    ]);
    expect(problem).toMatchObject({ index: 1, field: "upper", code: "levels-out-of-order" });
    expect(problem.message).toBe(
      "The critical upper bound (90) must be at or above the watch upper bound (100): levels escalate outward.",
    );
  });

  it("refuses a higher level whose lower bound is inside a milder level's, listed in any order", () => {
    const problem = onlyProblem([
      { quantity: "strain", level: "warning", lower: -400 },
      { quantity: "strain", level: "watch", lower: -500 },
    ]);
    expect(problem).toMatchObject({ index: 0, field: "lower", code: "levels-out-of-order" });
  });

  it("does not compare levels of different quantities", () => {
    const result = validateLimits([
      { quantity: "stress", level: "watch", upper: 100 },
      { quantity: "utilisation", level: "critical", upper: 0.9 },
    ]);
    expect(result.ok).toBe(true);
  });

  it("refuses bounds of different levels that leave no value at which an alert could clear", () => {
    const problem = onlyProblem([
      { quantity: "stress", level: "watch", upper: 100, hysteresis: 10 },
      { quantity: "stress", level: "warning", lower: 95 },
    ]);
    expect(problem).toMatchObject({ index: 0, field: "hysteresis", code: "never-clears" });
    expect(problem.message).toContain("at most 90 and at least 95");
  });
});
