/**
 * Ordinary least squares by the textbook normal equations (XᵀX)β = Xᵀy, solved by Gaussian
 * elimination with partial pivoting. The models fitted here have two or three unknowns, so the
 * normal equations are small and well conditioned once the regressors are centred (the caller
 * centres them); a general statistics package would add nothing.
 */

export type LeastSquaresFit = {
  /** Coefficients in the order of the regressor columns. */
  coefficients: number[];
  /** Sum of squared residuals. */
  residualSumOfSquares: number;
  /** Σ (y − ȳ)². */
  totalSumOfSquares: number;
  observations: number;
};

/**
 * Fits y ≈ Σ βⱼ·xⱼ, where each row of `rows` holds the regressors x (include a column of ones for
 * an intercept). Returns null when the normal matrix is singular (a regressor that does not vary).
 */
export function leastSquares(rows: readonly (readonly number[])[], y: readonly number[]): LeastSquaresFit | null {
  const unknowns = rows[0]?.length ?? 0;
  if (unknowns === 0 || rows.length !== y.length || rows.length < unknowns) return null;
  const normal = Array.from({ length: unknowns }, () => new Array<number>(unknowns + 1).fill(0));
  for (let i = 0; i < rows.length; i++) {
    const row = rows[i];
    for (let j = 0; j < unknowns; j++) {
      for (let k = 0; k < unknowns; k++) normal[j][k] += row[j] * row[k];
      normal[j][unknowns] += row[j] * y[i];
    }
  }
  const coefficients = solveAugmented(normal);
  if (!coefficients) return null;
  const mean = y.reduce((sum, value) => sum + value, 0) / y.length;
  let residualSumOfSquares = 0;
  let totalSumOfSquares = 0;
  for (let i = 0; i < rows.length; i++) {
    const predicted = rows[i].reduce((sum, x, j) => sum + x * coefficients[j], 0);
    residualSumOfSquares += (y[i] - predicted) ** 2;
    totalSumOfSquares += (y[i] - mean) ** 2;
  }
  return { coefficients, residualSumOfSquares, totalSumOfSquares, observations: rows.length };
}

function solveAugmented(matrix: number[][]): number[] | null {
  const size = matrix.length;
  const scale = Math.max(...matrix.map((row, i) => Math.abs(row[i])), 0);
  if (scale === 0) return null;
  for (let column = 0; column < size; column++) {
    let pivot = column;
    for (let row = column + 1; row < size; row++) {
      if (Math.abs(matrix[row][column]) > Math.abs(matrix[pivot][column])) pivot = row;
    }
    // Relative to the largest diagonal: a regressor with no spread leaves a zero pivot up to rounding.
    if (Math.abs(matrix[pivot][column]) <= scale * 1e-12) return null;
    [matrix[column], matrix[pivot]] = [matrix[pivot], matrix[column]];
    for (let row = column + 1; row < size; row++) {
      const factor = matrix[row][column] / matrix[column][column];
      for (let k = column; k <= size; k++) matrix[row][k] -= factor * matrix[column][k];
    }
  }
  const solution = new Array<number>(size).fill(0);
  for (let row = size - 1; row >= 0; row--) {
    let sum = matrix[row][size];
    for (let k = row + 1; k < size; k++) sum -= matrix[row][k] * solution[k];
    solution[row] = sum / matrix[row][row];
  }
  return solution;
}
