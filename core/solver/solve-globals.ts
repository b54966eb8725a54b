import { choleskyInPlace, choleskyInverse, choleskySolveInPlace } from './cholesky.ts';
import type { PreparedProblem } from './prepared-problem.ts';
import type { ReducedSystem } from './reduce-blocks.ts';
import { SINGULAR_RELATIVE_EIGENVALUE, symmetricGeneralisedInverse } from './small-inverse.ts';
import type { DroppedDirection } from './small-inverse.ts';

/**
 * The solved global system. `covariance` is the a-priori covariance Q of the global corrections
 * (the gg block of the inverse of the full constrained normal matrix); `multiplier` the Lagrange
 * multipliers λ of the local-term constraints; `constraintGain` F = BᵀE⁻¹ (n×m),
 * `covarianceGain` Q·F (n×m), `gainCovariance` FᵀQF (m×m), `constraintNormalInverse` E⁻¹ (m×m):
 * the back-substitution needs them for the blocks' covariances.
 */
export interface GlobalSolution {
  readonly estimate: Float64Array;
  /** Q (n×n); empty (length 0), like covarianceGain and gainCovariance, when solved without covariance. */
  readonly covariance: Float64Array;
  readonly multiplier: Float64Array;
  readonly constraintGain: Float64Array;
  readonly covarianceGain: Float64Array;
  readonly gainCovariance: Float64Array;
  readonly constraintNormalInverse: Float64Array;
  /** Directions no prior or constraint fixed, solved as minimum norm (scaled coordinates). */
  readonly minimumNormDirections: readonly DroppedDirection[];
  /** Effective rows of the local-term constraints acting on the globals, B (m×n), and the global-only ones (k×n). */
  readonly localConstraintRows: Float64Array;
  readonly globalConstraintRows: Float64Array;
}

function invertSmall(matrix: Float64Array, size: number, what: () => string): Float64Array {
  const factor = matrix.slice();
  const inverse = new Float64Array(size * size);
  if (size === 0) return inverse;
  if (!choleskyInPlace(factor, size, 1e-13)) throw new RangeError(what());
  choleskyInverse(factor, size, inverse);
  return inverse;
}

/** A·B for row-major A (r×k) and B (k×c). */
function multiply(a: Float64Array, b: Float64Array, r: number, k: number, c: number): Float64Array {
  const out = new Float64Array(r * c);
  for (let i = 0; i < r; i++) {
    for (let p = 0; p < k; p++) {
      const aip = a[i * k + p];
      if (aip === 0) continue;
      for (let j = 0; j < c; j++) out[i * c + j] += aip * b[p * c + j];
    }
  }
  return out;
}

function transpose(a: Float64Array, r: number, c: number): Float64Array {
  const out = new Float64Array(r * c);
  for (let i = 0; i < r; i++) for (let j = 0; j < c; j++) out[j * r + i] = a[i * c + j];
  return out;
}

/**
 * Solves the reduced, constrained global system (see ReducedSystem):
 * 1. S = R + global priors, with fixed globals pinned to a zero correction;
 * 2. local-term constraints: λ is eliminated, S += BᵀE⁻¹B and h = b' + BᵀE⁻¹d' (Schur complement
 *    on the −E block of [R Bᵀ; B −E]; E is positive definite when the constraints are
 *    independent in their local terms);
 * 3. global-only constraints C·g = d: M = S + CᵀC with rows scaled to unit norm in the
 *    unit-diagonal metric, g = M⁻¹h + M⁻¹Cᵀ·T⁻¹(d − CM⁻¹h), Q = M⁻¹ − M⁻¹CᵀT⁻¹CM⁻¹ with
 *    T = CM⁻¹Cᵀ (adding CᵀC leaves the constrained solution unchanged; e.g. Koch, Parameter
 *    Estimation and Hypothesis Testing in Linear Models, 2nd ed., 1999, §3.5, section from memory);
 * 4. M⁻¹ by Cholesky, falling back to an eigen-decomposition generalised inverse when M is
 *    singular to working precision; each such direction is returned, never hidden.
 */
export function solveGlobals(prep: PreparedProblem, reduced: ReducedSystem, withCovariance = true): GlobalSolution {
  const n = reduced.n;
  const m = reduced.constraintCount;
  const { S, h } = withPriorsAndFixes(prep, reduced);
  const B = reduced.coupling;
  const { F, Einv } = eliminateMultipliers(prep, reduced, S, h);
  const k = prep.globalConstraints.length;
  const { C, d } = unitConstraintRows(prep, S, reduced.unreducedDiagonal, n);
  const M = S.slice();
  for (let i = 0; i < k; i++) {
    for (let a = 0; a < n; a++) {
      const ca = C[i * n + a];
      if (ca === 0) continue;
      for (let b = 0; b < n; b++) M[a * n + b] += ca * C[i * n + b];
    }
  }
  // Without covariance (intermediate robust passes) a regular M is only factored: n³/3 instead of
  // the n³ of its inverse. The same pivot test as symmetricGeneralisedInverse's regular path
  // decides, so both routes take the same branch and agree to rounding.
  const factor = withCovariance ? null : regularFactor(M, n);
  let Minv = new Float64Array(0);
  let minimumNormDirections: readonly DroppedDirection[] = [];
  if (factor === null) {
    Minv = new Float64Array(n * n);
    minimumNormDirections = symmetricGeneralisedInverse(M, n, Minv);
  }
  const applyInverse = (columns: Float64Array, count: number): Float64Array =>
    (factor ? solveColumns(factor, n, columns, count) : multiply(Minv, columns, n, n, count));
  const { estimate, Q } = constrainedSolution(prep, applyInverse, factor === null ? Minv : null, C, d, h, n, k);
  for (let p = 0; p < n; p++) {
    if (!prep.globalFixed[p]) continue;
    estimate[p] = 0;
    if (Q.length === 0) continue;
    for (let j = 0; j < n; j++) {
      Q[p * n + j] = 0;
      Q[j * n + p] = 0;
    }
  }
  const Bg = multiply(B, estimate, m, n, 1);
  const multiplier = multiply(Einv, Bg.map((x, i) => x - reduced.constraintRhs[i]), m, m, 1);
  const covarianceGain = Q.length > 0 ? multiply(Q, F, n, n, m) : new Float64Array(0);
  const gainCovariance = Q.length > 0 ? multiply(transpose(F, n, m), covarianceGain, m, n, m) : new Float64Array(0);
  return {
    estimate, covariance: Q, multiplier, constraintGain: F, covarianceGain, gainCovariance,
    constraintNormalInverse: Einv, minimumNormDirections, localConstraintRows: B, globalConstraintRows: C,
  };
}

/** Cholesky factor of M when symmetricGeneralisedInverse would take its regular path, else null. */
function regularFactor(M: Float64Array, n: number): Float64Array | null {
  for (let i = 0; i < n; i++) if (!(M[i * n + i] > 0)) return null;
  const factor = M.slice();
  return choleskyInPlace(factor, n, SINGULAR_RELATIVE_EIGENVALUE) ? factor : null;
}

/** M⁻¹·X for X n×count row-major, by `count` pairs of triangular solves with M's factor. */
function solveColumns(factor: Float64Array, n: number, columns: Float64Array, count: number): Float64Array {
  const out = new Float64Array(n * count);
  const column = new Float64Array(n);
  for (let c = 0; c < count; c++) {
    for (let i = 0; i < n; i++) column[i] = columns[i * count + c];
    choleskySolveInPlace(factor, n, column);
    for (let i = 0; i < n; i++) out[i * count + c] = column[i];
  }
  return out;
}

/** S = R + global priors, h = b' + prior terms; fixed globals pinned to a zero correction. */
function withPriorsAndFixes(prep: PreparedProblem, reduced: ReducedSystem): { S: Float64Array; h: Float64Array } {
  const n = reduced.n;
  const S = reduced.normal.slice();
  const h = reduced.rhs.slice();
  for (let p = 0; p < n; p++) {
    if (prep.globalFixed[p]) {
      S[p * n + p] = 1;
      h[p] = 0;
    } else {
      S[p * n + p] += prep.globalPriorWeight[p];
      h[p] += prep.globalPriorWeightedValue[p];
    }
  }
  return { S, h };
}

/** S += BᵀE⁻¹B, h += BᵀE⁻¹d' in place; returns F = BᵀE⁻¹ and E⁻¹. */
function eliminateMultipliers(prep: PreparedProblem, reduced: ReducedSystem, S: Float64Array, h: Float64Array): { F: Float64Array; Einv: Float64Array } {
  const n = reduced.n;
  const m = reduced.constraintCount;
  const B = reduced.coupling;
  const Einv = invertSmall(reduced.constraintNormal, m, () =>
    `constraints ${prep.localConstraints.map((c) => `"${c.label}"`).join(', ')} are linearly dependent in their local terms (or touch only locals without data); drop one of them`);
  const F = multiply(transpose(B, m, n), Einv, n, m, m);
  if (m > 0) {
    const FB = multiply(F, B, n, m, n);
    for (let i = 0; i < n * n; i++) S[i] += FB[i];
    const Fd = multiply(F, reduced.constraintRhs, n, m, 1);
    for (let i = 0; i < n; i++) h[i] += Fd[i];
  }
  return { F, Einv };
}

/**
 * Global-only constraint rows C (k×n) and values d, each scaled to unit norm in the metric diag(S)⁻¹
 * (unit-diagonal coordinates). Where the elimination left a global less than 1e-8 of the
 * information its rows carried (`unreduced`), or none, that raw information (else 1) stands in for
 * S_gg: dividing by a vanishing S_gg would shrink the row of exactly the constraint that fixes an
 * undetermined global to nothing, and T = C·M⁻¹·Cᵀ would look singular. Any positive row scale
 * gives the same constrained solution; this one only keeps it well conditioned.
 */
function unitConstraintRows(prep: PreparedProblem, S: Float64Array, unreduced: Float64Array, n: number): { C: Float64Array; d: Float64Array } {
  const k = prep.globalConstraints.length;
  const C = new Float64Array(k * n);
  const d = new Float64Array(k);
  prep.globalConstraints.forEach((constraint, i) => {
    let norm2 = 0;
    constraint.globalIndex.forEach((g, j) => {
      C[i * n + g] += constraint.globalCoefficient[j];
    });
    for (let g = 0; g < n; g++) {
      if (C[i * n + g] === 0) continue;
      const raw = unreduced[g] + prep.globalPriorWeight[g];
      const metric = S[g * n + g] > 1e-8 * raw ? S[g * n + g] : raw > 0 ? raw : 1;
      norm2 += (C[i * n + g] * C[i * n + g]) / metric;
    }
    const factor = 1 / Math.sqrt(norm2);
    for (let g = 0; g < n; g++) C[i * n + g] *= factor;
    d[i] = constraint.value * factor;
  });
  return { C, d };
}

/**
 * g = M⁻¹h + M⁻¹Cᵀ·T⁻¹(d − CM⁻¹h), Q = M⁻¹ − M⁻¹CᵀT⁻¹CM⁻¹ with T = CM⁻¹Cᵀ (k = 0: g = M⁻¹h,
 * Q = M⁻¹). `applyInverse` gives M⁻¹·X; Q is computed only when `Minv` is passed (else empty).
 */
function constrainedSolution(
  prep: PreparedProblem, applyInverse: (columns: Float64Array, count: number) => Float64Array, Minv: Float64Array | null,
  C: Float64Array, d: Float64Array, h: Float64Array, n: number, k: number,
): { estimate: Float64Array; Q: Float64Array } {
  const unconstrained = applyInverse(h, 1);
  if (k === 0) return { estimate: unconstrained, Q: Minv ?? new Float64Array(0) };
  const P = applyInverse(transpose(C, k, n), k);
  const Tinv = invertSmall(multiply(C, P, k, n, k), k, () =>
    `constraints ${prep.globalConstraints.map((c) => `"${c.label}"`).join(', ')} on global parameters are linearly dependent; drop one of them`);
  // d − C·M⁻¹·h, with C·M⁻¹ = Pᵀ (M⁻¹ symmetric)
  const misfit = d.slice();
  for (let j = 0; j < n; j++) for (let i = 0; i < k; i++) misfit[i] -= P[j * k + i] * h[j];
  const PT = multiply(P, Tinv, n, k, k);
  const correction = multiply(PT, misfit, n, k, 1);
  const estimate = unconstrained.map((x, i) => x + correction[i]);
  if (Minv === null) return { estimate, Q: new Float64Array(0) };
  const PTPt = multiply(PT, transpose(P, n, k), n, k, n);
  return { estimate, Q: Minv.map((x, i) => x - PTPt[i]) };
}
