import { describe, expect, it } from 'vitest';
import { ObservationFlag } from '../../core/solver/huber-weights.ts';
import { jointSolve } from '../../core/solver/joint-solve.ts';
import type { LinearConstraint } from '../../core/solver/problem.ts';
import { randomProblem } from './random-problem.ts';
import { seededRandom } from './random.ts';
import { starNightProblem } from './star-night-problem.ts';

describe('Huber IRLS', () => {
  it('down-weights and flags planted outliers, and beats plain least squares on them', () => {
    const random = seededRandom(31);
    const base = randomProblem({ globals: 15, blocks: 40, rows: 2000, globalsPerRow: 3 }, random);
    const rows = base.problem.rows;
    const planted = new Set<number>();
    while (planted.size < 20) planted.add(Math.floor(random() * rows.count));
    const residual = rows.residual.slice();
    for (const k of planted) residual[k] += (random() < 0.5 ? -1 : 1) * 15 * base.sigma[k];
    const problem = { ...base.problem, rows: { ...rows, residual } };
    const robust = jointSolve(problem, { degeneracyReport: false });
    const plain = jointSolve(problem, { robust: false, degeneracyReport: false });
    expect(robust.converged).toBe(true);
    for (const k of planted) {
      expect(robust.flag[k]).toBe(ObservationFlag.outlier);
      expect(robust.robustFactor[k]).toBeLessThan(0.15);
    }
    let falseOutliers = 0;
    for (let k = 0; k < rows.count; k++) if (!planted.has(k) && robust.flag[k] === ObservationFlag.outlier) falseOutliers++;
    // |u| > 3 has probability 0.27 % for normal errors (any table of the normal law): ~5 of 1980.
    expect(falseOutliers).toBeLessThan(15);
    // The robust scale stays near the unit weight of the clean rows (σ = 1 in weight units).
    expect(robust.robustScale).toBeGreaterThan(0.85);
    expect(robust.robustScale).toBeLessThan(1.15);
    const error = (s: typeof robust): number => s.globalEstimate.reduce((sum, x, g) => sum + (x - base.truth[g]) ** 2, 0);
    expect(error(robust)).toBeLessThan(0.5 * error(plain));
  });

  it('keeps the two good rows of a three-row night at full weight when the third is a blunder', () => {
    // Night 0 sees 3 stars; its second row carries a 25σ blunder. DESIGN.md §4: robust weights
    // must not throw the whole night away.
    const probe = starNightProblem(12, 30, (n) => (n === 0 ? 3 : 12), seededRandom(41));
    const blunderRow = probe.nightRows[0][1];
    const setup = starNightProblem(12, 30, (n) => (n === 0 ? 3 : 12), seededRandom(41), new Map([[blunderRow, 25 * 0.2]]));
    const constraints: LinearConstraint[] = [{
      label: 'zero points sum to zero',
      terms: Array.from({ length: 30 }, (_, block) => ({ parameter: { kind: 'local' as const, block, index: 0 }, coefficient: 1 })),
      value: 0,
    }, {
      label: 'zero points have no trend',
      terms: Array.from({ length: 30 }, (_, block) => ({ parameter: { kind: 'local' as const, block, index: 0 }, coefficient: (block / 30) * 10 - 5 })),
      value: 0,
    }];
    const solution = jointSolve({ ...setup.problem, constraints }, { degeneracyReport: false });
    expect(solution.converged).toBe(true);
    const [good1, bad, good2] = setup.nightRows[0];
    expect(bad).toBe(blunderRow);
    expect(solution.flag[bad]).toBe(ObservationFlag.outlier);
    expect(solution.robustFactor[bad]).toBeLessThan(0.2);
    expect(solution.robustFactor[good1]).toBeGreaterThan(0.95);
    expect(solution.robustFactor[good2]).toBeGreaterThan(0.95);
    // In plain least squares the night's zero point takes a share of the blunder and drags the good rows.
    const plain = jointSolve({ ...setup.problem, constraints }, { robust: false, degeneracyReport: false });
    const robustShift = Math.abs(solution.residual[good1]) + Math.abs(solution.residual[good2]);
    const plainShift = Math.abs(plain.residual[good1]) + Math.abs(plain.residual[good2]);
    expect(robustShift).toBeLessThan(0.5 * plainShift);
  });

  it('leaves clean Gaussian data essentially unweighted (≈ 18 % of rows beyond 1.345σ, none zero)', () => {
    const base = randomProblem({ globals: 10, blocks: 20, rows: 3000, globalsPerRow: 3 }, seededRandom(51));
    const solution = jointSolve(base.problem, { degeneracyReport: false });
    let downweighted = 0;
    for (let k = 0; k < base.problem.rows.count; k++) if (solution.robustFactor[k] < 1) downweighted++;
    // P(|u| > 1.345) = 0.1787 for the normal law (tables of the normal integral).
    expect(downweighted / base.problem.rows.count).toBeGreaterThan(0.13);
    expect(downweighted / base.problem.rows.count).toBeLessThan(0.23);
    expect(Math.min(...solution.robustFactor)).toBeGreaterThan(0.2);
  });

  it('names the phase when cancelled, and reports progress per phase and pass', () => {
    const base = randomProblem({ globals: 10, blocks: 600, rows: 3000, globalsPerRow: 3 }, seededRandom(52));
    const phases = new Set<string>();
    const token = { isCancelled: false };
    expect(() => jointSolve(base.problem, {
      cancellation: token,
      onProgress: (p) => {
        phases.add(`${p.phase}@${p.iteration}`);
        if (p.iteration === 2 && p.phase === 'back-substitute') token.isCancelled = true;
      },
    })).toThrow(/cancelled during back-substitute of pass 2/);
    for (const phase of ['accumulate@1', 'reduce@1', 'solve@1', 'back-substitute@1', 'reduce@2']) expect(phases).toContain(phase);
  });
});
