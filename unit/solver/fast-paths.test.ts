import { describe, expect, it } from 'vitest';
import { jointSolve } from '../../core/solver/joint-solve.ts';
import { lowestEigenpairs } from '../../core/solver/lowest-eigenpairs.ts';
import { symmetricGeneralisedInverse } from '../../core/solver/small-inverse.ts';
import type { LinearConstraint } from '../../core/solver/problem.ts';
import { denseSolve } from './dense-reference.ts';
import { randomProblem } from './random-problem.ts';
import { gaussian, seededRandom } from './random.ts';

/** A random orthogonal n×n matrix: product of n Householder reflections of random unit vectors. */
function randomOrthogonal(n: number, random: () => number): Float64Array {
  const q = new Float64Array(n * n);
  for (let i = 0; i < n; i++) q[i * n + i] = 1;
  for (let r = 0; r < n; r++) {
    const v = Float64Array.from({ length: n }, () => gaussian(random));
    const norm = Math.hypot(...v);
    for (let i = 0; i < n; i++) v[i] /= norm;
    for (let i = 0; i < n; i++) {
      let dot = 0;
      for (let k = 0; k < n; k++) dot += q[i * n + k] * v[k];
      for (let k = 0; k < n; k++) q[i * n + k] -= 2 * dot * v[k];
    }
  }
  return q;
}

describe('lowestEigenpairs(matrix, n, count)', () => {
  it('gives the second-difference matrix its known eigenvalues 2 − 2cos(kπ/(n+1)) and vectors sin(ikπ/(n+1)), rotated to a dense matrix', () => {
    // Eigenpairs of tridiag(−1, 2, −1): a textbook closed form (e.g. Strang, Computational
    // Science and Engineering, 2007, §1.5; from memory). A = Q·T·Qᵀ keeps them, vectors → Q·v.
    const n = 60;
    const q = randomOrthogonal(n, seededRandom(301));
    const t = (i: number, j: number): number => (i === j ? 2 : Math.abs(i - j) === 1 ? -1 : 0);
    const a = new Float64Array(n * n);
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < n; j++) {
        let sum = 0;
        for (let r = 0; r < n; r++) for (let c = Math.max(0, r - 1); c <= Math.min(n - 1, r + 1); c++) sum += q[i * n + r] * t(r, c) * q[j * n + c];
        a[i * n + j] = sum;
      }
    }
    const { values, vectors } = lowestEigenpairs(a, n, 4);
    for (let k = 1; k <= n; k++) expect(Math.abs(values[k - 1] - (2 - 2 * Math.cos((k * Math.PI) / (n + 1))))).toBeLessThan(1e-13);
    for (let k = 1; k <= 4; k++) {
      const want = Float64Array.from({ length: n }, (_, i) => {
        let sum = 0;
        for (let r = 0; r < n; r++) sum += q[i * n + r] * Math.sin(((r + 1) * k * Math.PI) / (n + 1));
        return sum;
      });
      const norm = Math.hypot(...want);
      let dot = 0;
      for (let i = 0; i < n; i++) dot += (want[i] / norm) * vectors[(k - 1) * n + i];
      // Neighbouring eigenvalues differ by ~3e-3 here, so the vector error is ~ε/3e-3.
      expect(1 - Math.abs(dot)).toBeLessThan(1e-12);
    }
  });

  it('spans the null space of a rank-deficient X·Xᵀ with orthonormal vectors (any basis of a repeated eigenvalue is right)', () => {
    const random = seededRandom(302);
    const n = 50;
    const rank = 46;
    const x = Float64Array.from({ length: n * rank }, () => gaussian(random));
    const a = new Float64Array(n * n);
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) for (let k = 0; k < rank; k++) a[i * n + j] += x[i * rank + k] * x[j * rank + k];
    const { values, vectors } = lowestEigenpairs(a, n, 5);
    const largest = values[n - 1];
    for (let j = 0; j < 4; j++) expect(Math.abs(values[j]) / largest).toBeLessThan(1e-14);
    expect(values[4] / largest).toBeGreaterThan(1e-6);
    for (let j = 0; j < 4; j++) {
      // Xᵀ·v = 0 exactly for a null vector of X·Xᵀ (a property of the construction, not of the solver).
      for (let k = 0; k < rank; k++) {
        let dot = 0;
        for (let i = 0; i < n; i++) dot += x[i * rank + k] * vectors[j * n + i];
        expect(Math.abs(dot)).toBeLessThan(1e-12 * Math.sqrt(largest));
      }
      for (let m = 0; m < 5; m++) {
        let dot = 0;
        for (let i = 0; i < n; i++) dot += vectors[j * n + i] * vectors[m * n + i];
        expect(Math.abs(dot - (j === m ? 1 : 0))).toBeLessThan(1e-12);
      }
    }
  });

  it('rejects a NaN with the element named', () => {
    expect(() => lowestEigenpairs(Float64Array.of(1, NaN, NaN, 1), 2, 1)).toThrow(/element \(0, 1\) is NaN/);
  });
});

describe('robust jointSolve (intermediate passes solved from the factor, the last with covariance)', () => {
  it('ends at the dense weighted least-squares solution for its own final weights, to 1e-9', () => {
    // The independent dense solve (dense-reference.ts) is given the robust solve's final weights:
    // a robust pass that used a wrong factor or a stale global solution would not land there.
    const random = randomProblem({ globals: 15, blocks: 25, rows: 260, globalsPerRow: 3, blocklessFraction: 0.05 }, seededRandom(303));
    const residual = random.problem.rows.residual.slice();
    for (const k of [3, 40, 41, 100, 177, 250]) residual[k] += 25;
    const constraints: LinearConstraint[] = [
      { label: 'g1 − g2 = 0.5', terms: [{ parameter: { kind: 'global', index: 1 }, coefficient: 1 }, { parameter: { kind: 'global', index: 2 }, coefficient: -1 }], value: 0.5 },
      { label: 'Σ local 0 = 0', terms: Array.from({ length: 25 }, (_, block) => ({ parameter: { kind: 'local' as const, block, index: 0 }, coefficient: 1 })), value: 0 },
    ];
    const problem = { ...random.problem, rows: { ...random.problem.rows, residual }, constraints };
    const solution = jointSolve(problem, { robust: { maxIterations: 8 }, covarianceScale: 'a-priori', degeneracyReport: false });
    expect(solution.iterations).toBeGreaterThan(2);
    expect(Math.min(...solution.robustFactor)).toBeLessThan(0.2);
    const dense = denseSolve({ ...random.dense({ constraints }), residual, weight: solution.finalWeight });
    const scale = Math.max(...dense.estimate.map(Math.abs));
    const n = solution.globalNames.length;
    const p = random.parameterCount;
    for (let g = 0; g < n; g++) {
      expect(Math.abs(solution.globalEstimate[g] - dense.estimate[g])).toBeLessThan(1e-9 * scale);
      expect(Math.abs(solution.globalCovariance[g * n + g] - dense.covariance[g * p + g])).toBeLessThan(1e-9 * dense.covariance[g * p + g]);
    }
    dense.leverage.forEach((h, k) => expect(Math.abs(solution.leverage[k] - h)).toBeLessThan(1e-9));
  });
});

/** Gauss–Jordan inverse with partial pivoting of a small regular matrix (independent of core/solver). */
function gaussJordan(matrix: Float64Array, n: number): Float64Array {
  const a = matrix.slice();
  const inverse = new Float64Array(n * n);
  for (let i = 0; i < n; i++) inverse[i * n + i] = 1;
  for (let column = 0; column < n; column++) {
    let pivot = column;
    for (let r = column + 1; r < n; r++) if (Math.abs(a[r * n + column]) > Math.abs(a[pivot * n + column])) pivot = r;
    for (let c = 0; c < n; c++) {
      [a[column * n + c], a[pivot * n + c]] = [a[pivot * n + c], a[column * n + c]];
      [inverse[column * n + c], inverse[pivot * n + c]] = [inverse[pivot * n + c], inverse[column * n + c]];
    }
    const p = a[column * n + column];
    for (let c = 0; c < n; c++) {
      a[column * n + c] /= p;
      inverse[column * n + c] /= p;
    }
    for (let r = 0; r < n; r++) {
      if (r === column) continue;
      const f = a[r * n + column];
      for (let c = 0; c < n; c++) {
        a[r * n + c] -= f * a[column * n + c];
        inverse[r * n + c] -= f * inverse[column * n + c];
      }
    }
  }
  return inverse;
}

describe('symmetricGeneralisedInverse on a singular matrix above the null-space route size', () => {
  it('agrees with the pseudo-inverse Y(YᵀY)⁻²Yᵀ of A = Y·Yᵀ to 1e-9 and returns the null space', () => {
    // For A = Y·Yᵀ with Y (n×r) of full column rank, A⁺ = Y·(YᵀY)⁻²·Yᵀ (it satisfies the four
    // Penrose conditions; Ben-Israel & Greville, Generalized Inverses, ch. 1, from memory). Rows of
    // Y are scaled so that A has unit diagonal, where the solver's minimum norm (in scaled
    // coordinates) is the Moore–Penrose one. n = 40 ≥ 24 takes the null-space route.
    const random = seededRandom(304);
    const n = 40;
    const r = 35;
    const y = Float64Array.from({ length: n * r }, () => gaussian(random));
    for (let i = 0; i < n; i++) {
      const norm = Math.hypot(...y.subarray(i * r, i * r + r));
      for (let k = 0; k < r; k++) y[i * r + k] /= norm;
    }
    const a = new Float64Array(n * n);
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) for (let k = 0; k < r; k++) a[i * n + j] += y[i * r + k] * y[j * r + k];
    const gram = new Float64Array(r * r);
    for (let p = 0; p < r; p++) for (let q = 0; q < r; q++) for (let i = 0; i < n; i++) gram[p * r + q] += y[i * r + p] * y[i * r + q];
    const g = gaussJordan(gram, r);
    const g2 = new Float64Array(r * r);
    for (let p = 0; p < r; p++) for (let q = 0; q < r; q++) for (let k = 0; k < r; k++) g2[p * r + q] += g[p * r + k] * g[k * r + q];
    const want = new Float64Array(n * n);
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < n; j++) {
        let sum = 0;
        for (let p = 0; p < r; p++) for (let q = 0; q < r; q++) sum += y[i * r + p] * g2[p * r + q] * y[j * r + q];
        want[i * n + j] = sum;
      }
    }
    const got = new Float64Array(n * n);
    const dropped = symmetricGeneralisedInverse(a, n, got);
    expect(dropped.length).toBe(n - r);
    const scale = Math.max(...want.map(Math.abs));
    for (let i = 0; i < n * n; i++) expect(Math.abs(got[i] - want[i])).toBeLessThan(1e-9 * scale);
    for (const direction of dropped) {
      expect(direction.relativeEigenvalue).toBeLessThan(1e-12);
      for (let k = 0; k < r; k++) {
        let dot = 0;
        for (let i = 0; i < n; i++) dot += y[i * r + k] * direction.vector[i];
        expect(Math.abs(dot)).toBeLessThan(1e-12);
      }
    }
  });
});

describe('a global-only constraint on a global the block locals absorb completely', () => {
  it('holds that global (no "linearly dependent" error) and agrees with the dense solve to 1e-9', () => {
    // commonShift: every blocked row carries global 0 and its block's local 0 with partial 1, and
    // no row is block-less, so after elimination global 0 has (to rounding) no information left:
    // only the constraint fixes it. The dense reference solves the bordered system directly.
    const random = randomProblem({ globals: 12, blocks: 20, rows: 240, globalsPerRow: 3, blocklessFraction: 0, commonShift: true }, seededRandom(305));
    const constraints: LinearConstraint[] = [{ label: 'g0 held at 0.3', terms: [{ parameter: { kind: 'global', index: 0 }, coefficient: 1 }], value: 0.3 }];
    const solution = jointSolve({ ...random.problem, constraints }, { robust: false, covarianceScale: 'a-priori', degeneracyReport: false });
    const dense = denseSolve(random.dense({ constraints }));
    expect(Math.abs(solution.globalEstimate[0] - 0.3)).toBeLessThan(1e-10);
    const scale = Math.max(...dense.estimate.map(Math.abs));
    for (let g = 0; g < 12; g++) expect(Math.abs(solution.globalEstimate[g] - dense.estimate[g])).toBeLessThan(1e-9 * scale);
    for (let b = 0; b < 20; b++) {
      const at = solution.localOffset[b];
      expect(Math.abs(solution.localEstimate[at] - dense.estimate[random.column({ kind: 'local', block: b, index: 0 })])).toBeLessThan(1e-9 * scale);
    }
    expect(solution.warnings.filter((w) => /not determined/.test(w))).toEqual([]);
  });
});
