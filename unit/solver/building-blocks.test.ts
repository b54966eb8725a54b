import { describe, expect, it } from 'vitest';
import { CompensatedArraySum } from '../../core/solver/compensated-sum.ts';
import { huberFactors, MAD_TO_SIGMA, ObservationFlag, robustScale } from '../../core/solver/huber-weights.ts';
import { jointSolve } from '../../core/solver/joint-solve.ts';
import { medianInPlace } from '../../core/solver/median.ts';
import { ObservationRowsBuilder } from '../../core/solver/observation-rows.ts';
import { symmetricGeneralisedInverse } from '../../core/solver/small-inverse.ts';
import { seededRandom } from './random.ts';

describe('medianInPlace(values, count)', () => {
  it('agrees with sorting for random odd and even counts, with ties', () => {
    const random = seededRandom(91);
    for (const count of [1, 2, 3, 10, 11, 1000, 1001]) {
      const values = Float64Array.from({ length: count }, () => Math.floor(random() * 50));
      const sorted = [...values].sort((a, b) => a - b);
      const want = count % 2 ? sorted[count >> 1] : (sorted[count / 2 - 1] + sorted[count / 2]) / 2;
      expect(medianInPlace(values, count)).toBe(want);
    }
    expect(() => medianInPlace(new Float64Array(0), 0)).toThrow(/no values/);
  });
});

describe('robustScale / huberFactors', () => {
  it('MAD_TO_SIGMA is 1/Φ⁻¹(3/4) (Φ⁻¹(0.75) = 0.6744897501960817, normal-law tables)', () => {
    expect(Math.abs(MAD_TO_SIGMA * 0.6744897501960817 - 1)).toBeLessThan(1e-15);
  });

  it('studentises by √(1 − h): residuals shrunk by leverage give back the unit scale', () => {
    const random = seededRandom(92);
    const n = 20001;
    const residual = new Float64Array(n);
    const weight = new Float64Array(n).fill(4); // σ = 0.5
    const leverage = new Float64Array(n).fill(0.36);
    for (let k = 0; k < n; k++) {
      const u = Math.sqrt(-2 * Math.log(1 - random())) * Math.cos(2 * Math.PI * random());
      residual[k] = 0.5 * u * Math.sqrt(1 - 0.36);
    }
    expect(Math.abs(robustScale(residual, weight, leverage) - 1)).toBeLessThan(0.03);
  });

  it('gives weight k/|u| beyond k, flags outliers, untestable and rejected rows', () => {
    const residual = Float64Array.of(0.5, 2, 5, 0.3, 7);
    const weight = Float64Array.of(1, 1, 1, 1, 0);
    const leverage = Float64Array.of(0.1, 0.1, 0.1, 1, 0);
    const factor = new Float64Array(5).fill(1);
    const u = new Float64Array(5);
    const flag = new Uint8Array(5);
    huberFactors(residual, weight, leverage, 1, 1.345, 3, factor, u, flag);
    expect([...factor]).toEqual([1, 1.345 / 2, 1.345 / 5, 1, 1]);
    expect([...flag]).toEqual([ObservationFlag.fit, ObservationFlag.downweighted, ObservationFlag.outlier, ObservationFlag.untestable, ObservationFlag.rejected]);
  });
});

describe('CompensatedArraySum', () => {
  it('keeps 1 + 1e6 × 1e-16 exact where a plain running sum loses it all', () => {
    const sum = new CompensatedArraySum(1);
    sum.chunk[0] = 1;
    sum.flush();
    let plain = 1;
    for (let i = 0; i < 1_000_000; i++) {
      sum.chunk[0] = 1e-16;
      sum.flush();
      plain += 1e-16;
    }
    expect(plain).toBe(1);
    expect(Math.abs(sum.result()[0] - (1 + 1e-10))).toBeLessThan(1e-15);
  });
});

describe('symmetricGeneralisedInverse(matrix, n, inverse)', () => {
  it('returns the exact inverse when regular and the minimum-norm generalised inverse when singular', () => {
    const inverse = new Float64Array(4);
    expect(symmetricGeneralisedInverse(Float64Array.of(4, 2, 2, 3), 2, inverse)).toEqual([]);
    // [[4,2],[2,3]]⁻¹ = [[3,−2],[−2,4]]/8
    [3 / 8, -2 / 8, -2 / 8, 4 / 8].forEach((x, i) => expect(Math.abs(inverse[i] - x)).toBeLessThan(1e-15));
    // [[1,1],[1,1]]: pseudo-inverse [[1,1],[1,1]]/4 (unit diagonal already), null direction (1,−1)/√2.
    const dropped = symmetricGeneralisedInverse(Float64Array.of(1, 1, 1, 1), 2, inverse);
    expect(dropped).toHaveLength(1);
    expect(Math.abs(Math.abs(dropped[0].vector[0]) - Math.SQRT1_2)).toBeLessThan(1e-15);
    expect(dropped[0].vector[0] * dropped[0].vector[1]).toBeLessThan(0);
    [0.25, 0.25, 0.25, 0.25].forEach((x, i) => expect(Math.abs(inverse[i] - x)).toBeLessThan(1e-15));
  });
});

describe('ObservationRowsBuilder and problem checks', () => {
  it('round-trips rows through growth of every array', () => {
    const builder = new ObservationRowsBuilder(1, 1);
    for (let k = 0; k < 100; k++) {
      builder.beginRow(k % 3, k, 1 + k);
      builder.addGlobal(k % 7, k * 0.5);
      builder.addGlobal((k + 1) % 7, 1);
      if (k % 2) builder.addLocal(0, -k);
    }
    const rows = builder.finish();
    expect(rows.count).toBe(100);
    expect(rows.globalStart[100]).toBe(200);
    expect(rows.localStart[100]).toBe(50);
    expect(rows.globalPartial[2 * 41]).toBe(20.5);
    expect(rows.localPartial[rows.localStart[41]]).toBe(-41);
    expect(rows.block[41]).toBe(2);
  });

  it('names the row and the fix for a bad index, weight or prior', () => {
    const builder = new ObservationRowsBuilder();
    builder.beginRow(0, 1, 1);
    builder.addGlobal(0, 1);
    builder.addLocal(2, 1);
    const base = { globalNames: ['g0'], blockLocalCount: Int32Array.of(2), rows: builder.finish() };
    expect(() => jointSolve(base)).toThrow(/observation row 0: local index 2 is outside block 0's 2 locals; raise blockLocalCount\[0\]/);
    const weightRows = { ...base.rows, localStart: Int32Array.of(0, 0), weight: Float64Array.of(-1) };
    expect(() => jointSolve({ ...base, rows: weightRows })).toThrow(/observation row 0: weight is -1; pass 1\/σ² ≥ 0/);
    const good = { ...base, rows: { ...base.rows, localStart: Int32Array.of(0, 0) } };
    expect(() => jointSolve({ ...good, priors: [{ parameter: { kind: 'global', index: 0 }, value: 0, sigma: 0 }] })).toThrow(/priors\[0\]: sigma is 0/);
    expect(() => jointSolve({ ...good, fixed: [{ parameter: { kind: 'local', block: 1, index: 0 }, value: 0 }] })).toThrow(/fixed\[0\]: block 1 is outside 0…0/);
  });

  it('solves a problem with locals only (no globals): each block on its own, like a per-night fit', () => {
    // Two nights, each y = clock + rate·t exactly; solution must be exact and finite.
    const builder = new ObservationRowsBuilder();
    for (const [block, clock, rate] of [[0, 1.5, -0.2], [1, -3, 0.7]] as const) {
      for (let i = 0; i < 5; i++) {
        builder.beginRow(block, clock + rate * i, 1);
        builder.addLocal(0, 1);
        builder.addLocal(1, i);
      }
    }
    const solution = jointSolve({ globalNames: [], blockLocalCount: Int32Array.of(2, 2), rows: builder.finish() });
    [1.5, -0.2, -3, 0.7].forEach((x, i) => expect(Math.abs(solution.localEstimate[i] - x)).toBeLessThan(1e-12));
    expect(solution.degeneracy!.eigenvalues).toHaveLength(0);
    expect(solution.degreesOfFreedom).toBe(6);
    expect(solution.localError.every(Number.isFinite)).toBe(true);
  });
});
