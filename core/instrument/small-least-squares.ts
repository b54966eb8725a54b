/** Result of a small dense weighted least-squares fit. */
export interface LeastSquaresSolution {
  readonly parameters: readonly number[];
  /** Covariance scaled by the unit-weight error² when there is redundancy, else a priori. */
  readonly covariance: readonly (readonly number[])[];
  readonly residuals: readonly number[];
  readonly unitWeightError: number | null;
}

/** Neumaier's compensated addition (Neumaier 1974): [sum, compensation]. */
function addCompensated(state: [number, number], value: number): void {
  const t = state[0] + value;
  state[1] += Math.abs(state[0]) >= Math.abs(value) ? state[0] - t + value : value - t + state[0];
  state[0] = t;
}

/** Cholesky factor L of a symmetric positive-definite matrix (lower, row-major); throws if singular. */
function cholesky(matrix: number[][], names: readonly string[]): number[][] {
  const n = matrix.length;
  const l = matrix.map(() => new Array<number>(n).fill(0));
  for (let i = 0; i < n; i++) {
    for (let j = 0; j <= i; j++) {
      let sum = matrix[i][j];
      for (let k = 0; k < j; k++) sum -= l[i][k] * l[j][k];
      if (i === j) {
        if (!(sum > 1e-12 * Math.max(1, Math.abs(matrix[i][i])))) {
          throw new RangeError(`solveLeastSquares: the normal matrix is singular at parameter '${names[i]}'; the observations cannot separate it from the others — fix it or add observations that vary its factor`);
        }
        l[i][i] = Math.sqrt(sum);
      } else l[i][j] = sum / l[j][j];
    }
  }
  return l;
}

function invertFromCholesky(l: number[][]): number[][] {
  const n = l.length;
  const inverse = l.map(() => new Array<number>(n).fill(0));
  for (let col = 0; col < n; col++) {
    const y = new Array<number>(n).fill(0);
    for (let i = 0; i < n; i++) {
      let s = i === col ? 1 : 0;
      for (let k = 0; k < i; k++) s -= l[i][k] * y[k];
      y[i] = s / l[i][i];
    }
    for (let i = n - 1; i >= 0; i--) {
      let s = y[i];
      for (let k = i + 1; k < n; k++) s -= l[k][i] * inverse[k][col];
      inverse[i][col] = s / l[i][i];
    }
  }
  return inverse;
}

/**
 * Weighted least squares for a handful of parameters: minimises Σ w (y − A x)². Normal equations
 * accumulated with compensated sums, solved by Cholesky (any textbook of least squares). Meant for
 * per-night instrument fits, not for the joint solver.
 */
export function solveLeastSquares(
  design: readonly (readonly number[])[],
  observations: readonly number[],
  weights: readonly number[],
  names: readonly string[],
): LeastSquaresSolution {
  const p = names.length;
  const m = observations.length;
  if (m < p) throw new RangeError(`solveLeastSquares: ${m} observations for ${p} parameters (${names.join(', ')}); add observations or fix parameters`);
  const normal = names.map(() => names.map((): [number, number] => [0, 0]));
  const rhs = names.map((): [number, number] => [0, 0]);
  for (let k = 0; k < m; k++) {
    for (let i = 0; i < p; i++) {
      addCompensated(rhs[i], weights[k] * design[k][i] * observations[k]);
      for (let j = 0; j <= i; j++) addCompensated(normal[i][j], weights[k] * design[k][i] * design[k][j]);
    }
  }
  const n = normal.map((row, i) => names.map((_, j) => (j <= i ? row[j][0] + row[j][1] : normal[j][i][0] + normal[j][i][1])));
  const b = rhs.map((s) => s[0] + s[1]);
  const inverse = invertFromCholesky(cholesky(n, names));
  const parameters = inverse.map((row) => row.reduce((s, v, j) => s + v * b[j], 0));
  const residuals = observations.map((y, k) => y - design[k].reduce((s, v, j) => s + v * parameters[j], 0));
  const redundancy = m - p;
  const unitWeightError = redundancy > 0 ? Math.sqrt(residuals.reduce((s, r, k) => s + weights[k] * r * r, 0) / redundancy) : null;
  const factor = unitWeightError === null ? 1 : unitWeightError * unitWeightError;
  return { parameters, covariance: inverse.map((row) => row.map((v) => v * factor)), residuals, unitWeightError };
}
