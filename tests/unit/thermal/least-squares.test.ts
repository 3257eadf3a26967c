import { describe, expect, it } from "vitest";
import { leastSquares } from "@/lib/thermal";

// Montgomery & Runger, "Applied Statistics and Probability for Engineers", Example 11-1 (oxygen
// purity y in % against hydrocarbon level x in %, n = 20): ŷ = 74.283 + 14.947x, R² = 0.877,
// σ̂² = 1.18. Data and printed results from memory; all four figures agree to the printed digits.
const hydrocarbon = [0.99, 1.02, 1.15, 1.29, 1.46, 1.36, 0.87, 1.23, 1.55, 1.4, 1.19, 1.15, 0.98, 1.01, 1.11, 1.2, 1.26, 1.32, 1.43, 0.95];
const purity = [90.01, 89.05, 91.43, 93.74, 96.73, 94.45, 87.59, 91.77, 99.42, 93.65, 93.54, 92.52, 90.56, 89.54, 89.85, 90.39, 93.25, 93.41, 94.98, 87.33];

describe("ordinary least squares by the normal equations", () => {
  it("reproduces the worked simple-regression example of Montgomery & Runger (Example 11-1)", () => {
    const fit = leastSquares(hydrocarbon.map((x) => [1, x]), purity)!;
    expect(fit.coefficients[0]).toBeCloseTo(74.283, 3);
    expect(fit.coefficients[1]).toBeCloseTo(14.947, 3);
    expect(1 - fit.residualSumOfSquares / fit.totalSumOfSquares).toBeCloseTo(0.877, 3);
    expect(fit.residualSumOfSquares / (fit.observations - 2)).toBeCloseTo(1.18, 2);
  });

  it("agrees with the textbook closed form b = Sxy/Sxx, a = ȳ − b·x̄", () => {
    // textbook closed form of simple linear regression
    const x = [2, 4, 5, 7, 11, 13];
    const y = [3.1, 5.2, 5.9, 9.4, 13.8, 15.1];
    const xBar = x.reduce((s, v) => s + v, 0) / x.length;
    const yBar = y.reduce((s, v) => s + v, 0) / y.length;
    const sxy = x.reduce((s, v, i) => s + (v - xBar) * ((y[i] ?? NaN) - yBar), 0);
    const sxx = x.reduce((s, v) => s + (v - xBar) ** 2, 0);
    const fit = leastSquares(x.map((v) => [1, v]), y)!;
    expect(fit.coefficients[1]).toBeCloseTo(sxy / sxx, 12);
    expect(fit.coefficients[0]).toBeCloseTo(yBar - (sxy / sxx) * xBar, 12);
  });

  it("recovers an exact plane with two regressors and answers null for a regressor with no spread", () => {
    // Physical invariant of least squares: data lying exactly on the model is fitted with zero residual.
    const rows = [[1, 0, 0], [1, 1, 0], [1, 0, 1], [1, 2, 3], [1, 5, 1]];
    const y = rows.map(([, u = NaN, v = NaN]) => 2 - 3 * u + 0.5 * v);
    const fit = leastSquares(rows, y)!;
    expect(fit.coefficients.map((c) => Number(c.toFixed(9)))).toEqual([2, -3, 0.5]);
    expect(fit.residualSumOfSquares).toBeLessThan(1e-18);
    expect(leastSquares([[1, 4], [1, 4], [1, 4]], [1, 2, 3])).toBeNull();
  });
});
