import { describe, expect, it } from 'vitest';
import { symmetricEigen } from '../../core/solver/symmetric-eigen.ts';
import { choleskyInPlace, choleskyInverse, choleskySolveInPlace } from '../../core/solver/cholesky.ts';
import { seededRandom } from './random.ts';

function randomSymmetric(n: number, random: () => number): Float64Array {
  const a = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j <= i; j++) {
      const value = random() * 2 - 1;
      a[i * n + j] = value;
      a[j * n + i] = value;
    }
  }
  return a;
}

describe('symmetricEigen(matrix, n)', () => {
  it('reproduces A·v = λ·v and orthonormal vectors for random symmetric matrices (n = 1…40)', () => {
    const random = seededRandom(7);
    for (const n of [1, 2, 3, 5, 17, 40]) {
      const a = randomSymmetric(n, random);
      const { values, vectors } = symmetricEigen(a, n);
      for (let j = 0; j < n; j++) {
        if (j > 0) expect(values[j]).toBeGreaterThanOrEqual(values[j - 1]);
        for (let i = 0; i < n; i++) {
          let av = 0;
          for (let k = 0; k < n; k++) av += a[i * n + k] * vectors[j * n + k];
          expect(Math.abs(av - values[j] * vectors[j * n + i])).toBeLessThan(1e-12 * n);
        }
        for (let m = 0; m <= j; m++) {
          let dot = 0;
          for (let k = 0; k < n; k++) dot += vectors[j * n + k] * vectors[m * n + k];
          expect(Math.abs(dot - (m === j ? 1 : 0))).toBeLessThan(1e-12 * n);
        }
      }
    }
  });

  it('gives the textbook eigenvalues of the 2×2 matrix [[2,1],[1,2]]: 1 and 3', () => {
    // Worked example found in any linear algebra text (common practice).
    const { values } = symmetricEigen(Float64Array.of(2, 1, 1, 2), 2);
    expect(values[0]).toBeCloseTo(1, 14);
    expect(values[1]).toBeCloseTo(3, 14);
  });

  it('finds the exact zero eigenvalue of a rank-deficient matrix', () => {
    const u = [1, -2, 0.5, 3];
    const a = new Float64Array(16);
    for (let i = 0; i < 4; i++) for (let j = 0; j < 4; j++) a[i * 4 + j] = u[i] * u[j];
    const { values } = symmetricEigen(a, 4);
    expect(Math.abs(values[0])).toBeLessThan(1e-14);
    expect(values[3]).toBeCloseTo(1 + 4 + 0.25 + 9, 12);
  });

  it('names a NaN element instead of iterating on it', () => {
    expect(() => symmetricEigen(Float64Array.of(1, NaN, NaN, 1), 2)).toThrow(/element \(0, 1\) is NaN/);
  });
});

describe('choleskyInPlace / choleskySolveInPlace / choleskyInverse', () => {
  it('solves and inverts a random positive definite matrix to 1e-12', () => {
    const random = seededRandom(3);
    const n = 12;
    const x = randomSymmetric(n, random);
    const a = new Float64Array(n * n);
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
      let sum = i === j ? 0.5 : 0;
      for (let k = 0; k < n; k++) sum += x[i * n + k] * x[j * n + k];
      a[i * n + j] = sum;
    }
    const factor = a.slice();
    expect(choleskyInPlace(factor, n)).toBe(true);
    const inverse = new Float64Array(n * n);
    choleskyInverse(factor, n, inverse);
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
      let sum = 0;
      for (let k = 0; k < n; k++) sum += a[i * n + k] * inverse[k * n + j];
      expect(Math.abs(sum - (i === j ? 1 : 0))).toBeLessThan(1e-11);
    }
    const b = Float64Array.from({ length: n }, (_, i) => i - 3);
    const solution = b.slice();
    choleskySolveInPlace(factor, n, solution);
    for (let i = 0; i < n; i++) {
      let sum = 0;
      for (let k = 0; k < n; k++) sum += a[i * n + k] * solution[k];
      expect(Math.abs(sum - b[i])).toBeLessThan(1e-11);
    }
  });

  it('refuses a singular matrix instead of returning infinities', () => {
    expect(choleskyInPlace(Float64Array.of(1, 1, 1, 1), 2)).toBe(false);
  });
});
