import { describe, expect, it } from 'vitest';
import { fDistributionCdf, fDistributionSurvival } from '../../core/solver/f-distribution.ts';
import { regularizedIncompleteBeta } from '../../core/solver/incomplete-beta.ts';
import { logGamma } from '../../core/solver/log-gamma.ts';
import {
  akaikeInformationCriterion, bayesianInformationCriterion, correctedAkaikeInformationCriterion, nestedFTest,
} from '../../core/solver/model-comparison.ts';
import { jointSolve } from '../../core/solver/joint-solve.ts';
import { starNightProblem } from './star-night-problem.ts';
import { seededRandom } from './random.ts';

describe('logGamma(x)', () => {
  it('matches Γ(1/2) = √π, Γ(n) = (n−1)! and Γ(10.5) (A&S 6.1.8, 6.1.6)', () => {
    expect(Math.abs(logGamma(0.5) - 0.5 * Math.log(Math.PI))).toBeLessThan(1e-14);
    let factorial = 1;
    for (let n = 1; n <= 20; n++) {
      expect(Math.abs(logGamma(n) - Math.log(factorial)) / Math.max(1, Math.log(factorial))).toBeLessThan(1e-14);
      factorial *= n;
    }
    // Γ(10.5) = 19!!/2^10·√π = 654729075/1024·√π = 1133278.3889487855 (A&S 6.1.12)
    expect(Math.abs(logGamma(10.5) - Math.log((654729075 / 1024) * Math.sqrt(Math.PI)))).toBeLessThan(1e-13);
    expect(() => logGamma(0)).toThrow(/positive/);
  });
});

describe('regularizedIncompleteBeta(x, a, b)', () => {
  it('obeys the closed forms I_x(1,b) = 1 − (1−x)^b, I_x(a,1) = x^a and I_½(a,a) = ½ (A&S 26.5.14–15)', () => {
    for (const x of [0.01, 0.2, 0.5, 0.77, 0.999]) {
      for (const p of [0.5, 1, 2.5, 7, 40]) {
        expect(Math.abs(regularizedIncompleteBeta(x, 1, p) - (1 - (1 - x) ** p))).toBeLessThan(5e-14);
        expect(Math.abs(regularizedIncompleteBeta(x, p, 1) - x ** p)).toBeLessThan(5e-14);
        expect(Math.abs(regularizedIncompleteBeta(0.5, p, p) - 0.5)).toBeLessThan(5e-14);
      }
    }
  });

  it('equals the binomial tail Σ_{j≥k} C(n,j)p^j(1−p)^(n−j) = I_p(k, n−k+1) (A&S 26.5.24)', () => {
    for (const [n, p] of [[10, 0.3], [25, 0.5], [60, 0.05], [200, 0.71]] as const) {
      for (let k = 1; k <= n; k += Math.max(1, Math.floor(n / 7))) {
        let tail = 0;
        let logChoose = 0; // ln C(n, j) built up exactly by recurrence
        for (let j = 0; j <= n; j++) {
          if (j > 0) logChoose += Math.log((n - j + 1) / j);
          if (j >= k) tail += Math.exp(logChoose + j * Math.log(p) + (n - j) * Math.log1p(-p));
        }
        expect(Math.abs(regularizedIncompleteBeta(p, k, n - k + 1) - tail)).toBeLessThan(1e-12);
      }
    }
  });

  it('names a bad argument', () => {
    expect(() => regularizedIncompleteBeta(1.5, 1, 1)).toThrow(/0 ≤ x ≤ 1/);
    expect(() => regularizedIncompleteBeta(0.5, 0, 1)).toThrow(/positive/);
  });
});

describe('fDistributionCdf / fDistributionSurvival', () => {
  it('reproduces the exact forms P(F(2,ν) > f) = (1 + 2f/ν)^(−ν/2) and P(F(2,2) ≤ f) = f/(1+f)', () => {
    // Both follow from the F density with d1 = 2 (A&S 26.6.4 with ν1 = 2).
    for (const f of [0.1, 1, 3.7, 20]) {
      expect(Math.abs(fDistributionCdf(f, 2, 2) - f / (1 + f))).toBeLessThan(1e-14);
      for (const nu of [1, 4, 9, 30]) expect(Math.abs(fDistributionSurvival(f, 2, nu) - (1 + (2 * f) / nu) ** (-nu / 2))).toBeLessThan(1e-14);
    }
  });

  it('gives the tabulated upper percentage points of F (A&S Table 26.9; digits from memory of R qf())', () => {
    // [alpha, d1, d2, F_alpha]: P(F > F_alpha) = alpha
    const table: [number, number, number, number][] = [
      [0.05, 1, 1, 161.4476],
      [0.05, 1, 10, 4.964603],
      [0.05, 5, 10, 3.325835],
      [0.05, 10, 20, 2.347878],
      [0.05, 3, 30, 2.922277],
      [0.01, 1, 10, 10.04429],
      [0.01, 2, 20, 5.848932],
    ];
    for (const [alpha, d1, d2, f] of table) {
      const p = fDistributionSurvival(f, d1, d2);
      expect(Math.abs(p - alpha) / alpha, `P(F(${d1},${d2}) > ${f}) want ${alpha} got ${p}`).toBeLessThan(2e-5);
      expect(Math.abs(fDistributionCdf(f, d1, d2) + p - 1)).toBeLessThan(1e-14);
    }
  });
});

describe('model comparison on joint solves', () => {
  it('the F-test finds a real extra term and not an empty one; AIC and BIC agree', () => {
    // Full model: per-night zero point and flexure; reduced: flexure fixed to zero. The data carry
    // flexure (truth ~N(0,1) per night, noise 0.2), so the test must reject the reduced model.
    const setup = starNightProblem(8, 20, () => 8, seededRandom(71));
    const constraints = [{
      label: 'zero points sum to zero',
      terms: Array.from({ length: 20 }, (_, block) => ({ parameter: { kind: 'local' as const, block, index: 0 }, coefficient: 1 })),
      value: 0,
    }, {
      label: 'zero points have no trend',
      terms: Array.from({ length: 20 }, (_, block) => ({ parameter: { kind: 'local' as const, block, index: 0 }, coefficient: (block / 20) * 10 - 5 })),
      value: 0,
    }];
    const fixFlexure = Array.from({ length: 20 }, (_, block) => ({ parameter: { kind: 'local' as const, block, index: 1 }, value: 0 }));
    const options = { robust: false as const, degeneracyReport: false };
    const full = jointSolve({ ...setup.problem, constraints }, options);
    const reduced = jointSolve({ ...setup.problem, constraints, fixed: fixFlexure }, options);
    expect(full.rank - reduced.rank).toBe(20);
    const test = nestedFTest(reduced, full);
    expect(test.numeratorDegrees).toBe(20);
    expect(test.pValue).toBeLessThan(1e-6);
    expect(akaikeInformationCriterion(full)).toBeLessThan(akaikeInformationCriterion(reduced));
    expect(bayesianInformationCriterion(full)).toBeLessThan(bayesianInformationCriterion(reduced));
    expect(correctedAkaikeInformationCriterion(full)).toBeGreaterThan(akaikeInformationCriterion(full));
    // Swapped arguments are refused rather than giving a meaningless negative F.
    expect(() => nestedFTest(full, reduced)).toThrow(/order/);
  });
});
