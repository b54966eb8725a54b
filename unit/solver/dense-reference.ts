/**
 * A plain dense least-squares solver, written independently of core/solver for the tests:
 * full design matrix, normal equations with priors as extra rows, every fixed parameter and
 * linear constraint as a Lagrange row, and the whole bordered (KKT) matrix inverted by
 * Gauss–Jordan elimination with partial pivoting (no Cholesky, no Schur complement, no blocks).
 * The covariance is the parameter block of the inverse (e.g. Koch 1999, §3.5).
 */
export interface DenseProblem {
  /** m×p design matrix, row-major. */
  readonly design: Float64Array;
  readonly residual: Float64Array;
  readonly weight: Float64Array;
  readonly parameterCount: number;
  /** Equality constraints Σ coefficient·x = value (fixes are constraints with one coefficient). */
  readonly equalities: readonly { readonly coefficients: Float64Array; readonly value: number }[];
  readonly priors: readonly { readonly index: number; readonly value: number; readonly sigma: number }[];
}

export interface DenseSolution {
  readonly estimate: Float64Array;
  /** p×p a-priori covariance. */
  readonly covariance: Float64Array;
  readonly residual: Float64Array;
  readonly leverage: Float64Array;
  readonly chiSquare: number;
}

function gaussJordanInverse(matrix: Float64Array, n: number): Float64Array {
  const a = matrix.slice();
  const inverse = new Float64Array(n * n);
  for (let i = 0; i < n; i++) inverse[i * n + i] = 1;
  for (let column = 0; column < n; column++) {
    let pivotRow = column;
    for (let r = column + 1; r < n; r++) if (Math.abs(a[r * n + column]) > Math.abs(a[pivotRow * n + column])) pivotRow = r;
    if (a[pivotRow * n + column] === 0) throw new Error(`dense reference: singular at column ${column}`);
    for (let c = 0; c < n; c++) {
      [a[column * n + c], a[pivotRow * n + c]] = [a[pivotRow * n + c], a[column * n + c]];
      [inverse[column * n + c], inverse[pivotRow * n + c]] = [inverse[pivotRow * n + c], inverse[column * n + c]];
    }
    const pivot = a[column * n + column];
    for (let c = 0; c < n; c++) {
      a[column * n + c] /= pivot;
      inverse[column * n + c] /= pivot;
    }
    for (let r = 0; r < n; r++) {
      if (r === column) continue;
      const f = a[r * n + column];
      if (f === 0) continue;
      for (let c = 0; c < n; c++) {
        a[r * n + c] -= f * a[column * n + c];
        inverse[r * n + c] -= f * inverse[column * n + c];
      }
    }
  }
  return inverse;
}

export function denseSolve(problem: DenseProblem): DenseSolution {
  const p = problem.parameterCount;
  const m = problem.residual.length;
  const c = problem.equalities.length;
  const size = p + c;
  const kkt = new Float64Array(size * size);
  const rhs = new Float64Array(size);
  for (let k = 0; k < m; k++) {
    const w = problem.weight[k];
    for (let i = 0; i < p; i++) {
      const xi = problem.design[k * p + i];
      if (xi === 0) continue;
      rhs[i] += w * xi * problem.residual[k];
      for (let j = 0; j < p; j++) kkt[i * size + j] += w * xi * problem.design[k * p + j];
    }
  }
  for (const prior of problem.priors) {
    kkt[prior.index * size + prior.index] += 1 / prior.sigma ** 2;
    rhs[prior.index] += prior.value / prior.sigma ** 2;
  }
  problem.equalities.forEach((e, r) => {
    for (let j = 0; j < p; j++) {
      kkt[(p + r) * size + j] = e.coefficients[j];
      kkt[j * size + p + r] = e.coefficients[j];
    }
    rhs[p + r] = e.value;
  });
  const inverse = gaussJordanInverse(kkt, size);
  const estimate = new Float64Array(p);
  for (let i = 0; i < p; i++) for (let j = 0; j < size; j++) estimate[i] += inverse[i * size + j] * rhs[j];
  const covariance = new Float64Array(p * p);
  for (let i = 0; i < p; i++) for (let j = 0; j < p; j++) covariance[i * p + j] = inverse[i * size + j];
  const residual = new Float64Array(m);
  const leverage = new Float64Array(m);
  let chiSquare = 0;
  for (let k = 0; k < m; k++) {
    let fitted = 0;
    let variance = 0;
    for (let i = 0; i < p; i++) {
      const xi = problem.design[k * p + i];
      if (xi === 0) continue;
      fitted += xi * estimate[i];
      for (let j = 0; j < p; j++) variance += xi * covariance[i * p + j] * problem.design[k * p + j];
    }
    residual[k] = problem.residual[k] - fitted;
    leverage[k] = problem.weight[k] * variance;
    chiSquare += problem.weight[k] * residual[k] ** 2;
  }
  for (const prior of problem.priors) chiSquare += ((estimate[prior.index] - prior.value) / prior.sigma) ** 2;
  return { estimate, covariance, residual, leverage, chiSquare };
}
