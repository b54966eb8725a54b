import { describe, expect, it } from 'vitest';
import { jointSolve } from '../../core/solver/joint-solve.ts';
import { ObservationRowsBuilder } from '../../core/solver/observation-rows.ts';
import type { LinearConstraint } from '../../core/solver/problem.ts';
import { gaussian, seededRandom } from './random.ts';
import { starNightProblem } from './star-night-problem.ts';

const STARS = 10;
const NIGHTS = 40;
const zeroPointSum: LinearConstraint = {
  label: 'night zero points sum to zero',
  terms: Array.from({ length: NIGHTS }, (_, block) => ({ parameter: { kind: 'local' as const, block, index: 0 }, coefficient: 1 })),
  value: 0,
};
/** Night n is at t = (n/NIGHTS)·10 − 5 years in starNightProblem. */
const zeroPointTrend: LinearConstraint = {
  label: 'night zero points have no trend in time',
  terms: Array.from({ length: NIGHTS }, (_, block) => ({ parameter: { kind: 'local' as const, block, index: 0 }, coefficient: (block / NIGHTS) * 10 - 5 })),
  value: 0,
};

function allFinite(values: Float64Array): boolean {
  return values.every(Number.isFinite);
}

describe('a common shift and drift of every night zero point against every star offset and motion', () => {
  // DESIGN.md §4: with a free zero point per night, the zero point and the rate of the system
  // are not observable: zero(n) + ε₁ + ε₂·t(n) trades against every offset −ε₁ and motion −ε₂.
  const setup = starNightProblem(STARS, NIGHTS, () => 6, seededRandom(21));
  const starTerms = Array.from({ length: 2 * STARS }, (_, i) => `star ${i >> 1} ${i % 2 === 0 ? 'offset' : 'motion'}`);
  const namesOf = (directions: readonly { combination: readonly { name: string }[] }[]): string[] =>
    [...new Set(directions.flatMap((d) => d.combination.map((c) => c.name)))].sort();

  it('is reported as two singular directions spanning exactly the star offsets and motions', () => {
    const solution = jointSolve(setup.problem, { robust: false });
    const [first, second, third] = solution.degeneracy!.weakest;
    expect(first.status).toBe('singular');
    expect(second.status).toBe('singular');
    expect(third.status).not.toBe('singular');
    expect(namesOf([first, second])).toEqual([...starTerms].sort());
    expect(solution.degeneracy!.conditionNumber).toBeGreaterThan(1e12);
    // Unconstrained: solved as minimum norm, said so, and every number finite.
    expect(first.resolution).toBe('minimum-norm');
    expect(solution.warnings.join(' ')).toMatch(/2 global direction\(s\).*minimum norm/);
    expect(allFinite(solution.globalEstimate) && allFinite(solution.globalError) && allFinite(solution.localEstimate)).toBe(true);
    expect(allFinite(solution.globalCorrelation) && allFinite(solution.localError) && allFinite(solution.residual)).toBe(true);
    expect(solution.rank).toBe(2 * STARS + 2 * NIGHTS - 2);
    // Every star term is marked: its error holds only with the null directions pinned at zero.
    expect(solution.globalUndetermined.every((x) => x === 1)).toBe(true);
  });

  it('is fixed by "zero points sum to zero" and "no trend": finite, satisfied, named, truth recovered', () => {
    const constraints = [zeroPointSum, zeroPointTrend];
    const solution = jointSolve({ ...setup.problem, constraints }, { robust: false });
    for (const direction of solution.degeneracy!.weakest.slice(0, 2)) {
      expect(direction.status).toBe('singular');
      expect(direction.resolution).toBe('constraint');
      expect(direction.resolvedBy.length).toBeGreaterThan(0);
      for (const label of direction.resolvedBy) expect([zeroPointSum.label, zeroPointTrend.label]).toContain(label);
    }
    expect(solution.warnings).toEqual([]);
    expect(solution.rank).toBe(2 * STARS + 2 * NIGHTS - 2);
    expect(solution.globalUndetermined.every((x) => x === 0)).toBe(true);
    let sum = 0;
    let trend = 0;
    for (let b = 0; b < NIGHTS; b++) {
      sum += solution.localEstimate[solution.localOffset[b]];
      trend += zeroPointTrend.terms[b].coefficient * solution.localEstimate[solution.localOffset[b]];
    }
    expect(Math.abs(sum)).toBeLessThan(1e-10);
    expect(Math.abs(trend)).toBeLessThan(1e-9);
    // The truth moved onto the constraint surface: zero(n) − (a + b·t(n)) by least squares on t.
    const t = zeroPointTrend.terms.map((x) => x.coefficient);
    const meanT = t.reduce((s, x) => s + x, 0) / NIGHTS;
    const zero = t.map((_, n) => setup.truthLocal[2 * n]);
    const a = zero.reduce((s, x) => s + x, 0) / NIGHTS;
    const b = zero.reduce((s, x, n) => s + x * (t[n] - meanT), 0) / t.reduce((s, x) => s + (x - meanT) ** 2, 0);
    for (let s = 0; s < STARS; s++) {
      const offsetPull = (solution.globalEstimate[2 * s] - (setup.truthGlobal[2 * s] + a - b * meanT)) / solution.globalError[2 * s];
      const motionPull = (solution.globalEstimate[2 * s + 1] - (setup.truthGlobal[2 * s + 1] + b)) / solution.globalError[2 * s + 1];
      expect(Math.abs(offsetPull)).toBeLessThan(4);
      expect(Math.abs(motionPull)).toBeLessThan(4);
    }
  });

  it('is fixed by catalogue priors on one star, and the report names those priors', () => {
    const priors = [0, 1].map((index) => ({ parameter: { kind: 'global' as const, index }, value: setup.truthGlobal[index], sigma: 0.01 }));
    const solution = jointSolve({ ...setup.problem, priors }, { robust: false });
    const labels = solution.degeneracy!.weakest.slice(0, 2).flatMap((d) => d.resolvedBy);
    expect([...new Set(labels)].sort()).toEqual(['prior on star 0 motion', 'prior on star 0 offset']);
    expect(solution.warnings).toEqual([]);
    // Differences of offsets are estimable: they agree between the priors and the constraints.
    const constrained = jointSolve({ ...setup.problem, constraints: [zeroPointSum, zeroPointTrend] }, { robust: false });
    for (let s = 1; s < STARS; s++) {
      const x = solution.globalEstimate[2 * s] - solution.globalEstimate[0];
      const y = constrained.globalEstimate[2 * s] - constrained.globalEstimate[0];
      expect(Math.abs(x - y)).toBeLessThan(0.05 * setup.sigma);
    }
  });

  it('a night without observations is a singular block, reported and left at zero', () => {
    const sparse = starNightProblem(STARS, NIGHTS, (n) => (n === 5 ? 0 : 6), seededRandom(22));
    const solution = jointSolve({ ...sparse.problem, constraints: [zeroPointSum, zeroPointTrend] }, { robust: false });
    expect(solution.degeneracy!.singularBlockCount).toBe(1);
    expect(solution.degeneracy!.singularBlocks[0].block).toBe(5);
    expect(solution.localEstimate[solution.localOffset[5] + 1]).toBe(0);
    expect([...solution.localUndetermined.subarray(solution.localOffset[5], solution.localOffset[6])]).toEqual([1, 1]);
    expect(solution.localUndetermined.reduce((s, x) => s + x, 0)).toBe(2);
    expect(allFinite(solution.localError)).toBe(true);
  });
});

describe('a star seen in one season only', () => {
  it('shows its offset and parallax as the weak combination, and no other star', () => {
    // Invented: 4 stars, offset (partial 1) and parallax (partial sin of the year's phase, an
    // idealised parallax factor). Stars 1–3 are seen all year; star 0 only on days 80–100 of
    // each year, where the factor is ≈ 1, so its parallax can hardly be told from its offset.
    const random = seededRandom(23);
    const builder = new ObservationRowsBuilder();
    for (let star = 0; star < 4; star++) {
      for (let k = 0; k < 200; k++) {
        const day = star === 0 ? 365.25 * Math.floor(k / 20) + 80 + (k % 20) : random() * 3652;
        const factor = Math.sin((2 * Math.PI * day) / 365.25);
        builder.beginRow(-1, 0.1 * gaussian(random), 100);
        builder.addGlobal(2 * star, 1);
        builder.addGlobal(2 * star + 1, factor);
      }
    }
    const names = [0, 1, 2, 3].flatMap((s) => [`star ${s} offset`, `star ${s} parallax`]);
    const solution = jointSolve({ globalNames: names, blockLocalCount: new Int32Array(0), rows: builder.finish() }, { robust: false });
    const [weakest, next] = solution.degeneracy!.weakest;
    expect(weakest.status).toBe('weak');
    expect(weakest.resolution).toBe('data');
    expect(weakest.combination.map((c) => c.name).sort()).toEqual(['star 0 offset', 'star 0 parallax']);
    expect(weakest.combination[0].coefficient * weakest.combination[1].coefficient).toBeLessThan(0);
    expect(next.status).toBe('determined');
    expect(Math.abs(solution.globalCorrelation[0 * 8 + 1])).toBeGreaterThan(0.999);
  });
});
