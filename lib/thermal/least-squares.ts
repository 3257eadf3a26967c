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
  const normal = new Matrix(unknowns, unknowns + 1);
  rows.forEach((row, i) => {
    const observed = y[i] ?? NaN;
    row.forEach((xj, j) => {
      row.forEach((xk, k) => normal.add(j, k, xj * xk));
      normal.add(j, unknowns, xj * observed);
    });
  });
  const coefficients = solveAugmented(normal);
  if (!coefficients) return null;
  const mean = y.reduce((sum, value) => sum + value, 0) / y.length;
  let residualSumOfSquares = 0;
  let totalSumOfSquares = 0;
  rows.forEach((row, i) => {
    const observed = y[i] ?? NaN;
    const predicted = row.reduce((sum, x, j) => sum + x * (coefficients[j] ?? NaN), 0);
    residualSumOfSquares += (observed - predicted) ** 2;
    totalSumOfSquares += (observed - mean) ** 2;
  });
  return { coefficients, residualSumOfSquares, totalSumOfSquares, observations: rows.length };
}

/** Dense row-major matrix; reading outside it is a programming error, so it answers NaN rather than undefined. */
class Matrix {
  private readonly cells: Float64Array;
  constructor(
    readonly rowCount: number,
    readonly columnCount: number,
  ) {
    this.cells = new Float64Array(rowCount * columnCount);
  }
  get(row: number, column: number): number {
    return this.cells[row * this.columnCount + column] ?? NaN;
  }
  set(row: number, column: number, value: number) {
    this.cells[row * this.columnCount + column] = value;
  }
  add(row: number, column: number, value: number) {
    this.set(row, column, this.get(row, column) + value);
  }
  swapRows(a: number, b: number) {
    for (let column = 0; column < this.columnCount; column++) {
      const held = this.get(a, column);
      this.set(a, column, this.get(b, column));
      this.set(b, column, held);
    }
  }
}

function solveAugmented(matrix: Matrix): number[] | null {
  const size = matrix.rowCount;
  let scale = 0;
  for (let i = 0; i < size; i++) scale = Math.max(scale, Math.abs(matrix.get(i, i)));
  if (scale === 0) return null;
  for (let column = 0; column < size; column++) {
    let pivot = column;
    for (let row = column + 1; row < size; row++) {
      if (Math.abs(matrix.get(row, column)) > Math.abs(matrix.get(pivot, column))) pivot = row;
    }
    // Relative to the largest diagonal: a regressor with no spread leaves a zero pivot up to rounding.
    if (Math.abs(matrix.get(pivot, column)) <= scale * 1e-12) return null;
    matrix.swapRows(column, pivot);
    for (let row = column + 1; row < size; row++) {
      const factor = matrix.get(row, column) / matrix.get(column, column);
      for (let k = column; k <= size; k++) matrix.add(row, k, -factor * matrix.get(column, k));
    }
  }
  const solution = new Array<number>(size).fill(0);
  for (let row = size - 1; row >= 0; row--) {
    let sum = matrix.get(row, size);
    for (let k = row + 1; k < size; k++) sum -= matrix.get(row, k) * (solution[k] ?? NaN);
    solution[row] = sum / matrix.get(row, row);
  }
  return solution;
}
