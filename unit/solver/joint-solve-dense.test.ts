import { describe, expect, it } from 'vitest';
import { jointSolve } from '../../core/solver/joint-solve.ts';
import type { JointSolution } from '../../core/solver/solution.ts';
import type { FixedParameter, LinearConstraint, ParameterPrior } from '../../core/solver/problem.ts';
import { denseSolve } from './dense-reference.ts';
import type { DenseSolution } from './dense-reference.ts';
import { randomProblem } from './random-problem.ts';
import type { RandomProblem } from './random-problem.ts';
import { seededRandom } from './random.ts';

/** The brief's agreement target between the block solver and the naive dense solve. */
const RELATIVE = 1e-9;

function expectClose(actual: number, expected: number, scale: number, what: string): void {
  if (!(Math.abs(actual - expected) <= RELATIVE * scale)) {
    throw new Error(`${what}: want ${expected} got ${actual} (difference ${actual - expected}, allowed ${RELATIVE * scale})`);
  }
}

/** Compares every estimate, the global and per-block covariances, residuals and leverages. */
function compare(random: RandomProblem, solution: JointSolution, dense: DenseSolution): void {
  const p = random.parameterCount;
  const n = solution.globalNames.length;
  const estimateScale = Math.max(...dense.estimate.map(Math.abs));
  // Fixed parameters have zero variance; the dense solve leaves rounding noise there, so their
  // entries are compared against a floor of 1e-6 of the largest variance.
  const floor = 1e-6 * Math.max(...Array.from({ length: p }, (_, i) => dense.covariance[i * p + i]));
  const sd = (i: number): number => Math.sqrt(Math.max(dense.covariance[i * p + i], floor));
  for (let i = 0; i < n; i++) {
    expectClose(solution.globalEstimate[i], dense.estimate[i], estimateScale, `global ${i} estimate`);
    for (let j = 0; j < n; j++) {
      expectClose(solution.globalCovariance[i * n + j], dense.covariance[i * p + j], sd(i) * sd(j), `global covariance (${i}, ${j})`);
    }
  }
  const blocks = solution.localOffset.length - 1;
  for (let b = 0; b < blocks; b++) {
    const l = solution.localOffset[b + 1] - solution.localOffset[b];
    for (let i = 0; i < l; i++) {
      const ci = random.column({ kind: 'local', block: b, index: i });
      expectClose(solution.localEstimate[solution.localOffset[b] + i], dense.estimate[ci], estimateScale, `block ${b} local ${i}`);
      for (let j = 0; j < l; j++) {
        const cj = random.column({ kind: 'local', block: b, index: j });
        expectClose(solution.localCovariance[solution.localCovarianceOffset[b] + i * l + j], dense.covariance[ci * p + cj],
          sd(ci) * sd(cj), `block ${b} covariance (${i}, ${j})`);
      }
    }
  }
  const residualScale = Math.max(...dense.residual.map(Math.abs));
  dense.residual.forEach((v, k) => expectClose(solution.residual[k], v, residualScale, `row ${k} residual`));
  dense.leverage.forEach((h, k) => expectClose(solution.leverage[k], h, 1, `row ${k} leverage`));
  expectClose(solution.chiSquare, dense.chiSquare, dense.chiSquare, 'χ²');
}

const shape = { globals: 20, blocks: 30, rows: 300, globalsPerRow: 3, blocklessFraction: 0.05 };

describe('jointSolve agrees with a naive dense least-squares solve', () => {
  it('300 rows, 20 globals, 30 blocks: estimates, covariances, residuals, leverages to 1e-9', () => {
    const random = randomProblem(shape, seededRandom(11));
    const solution = jointSolve(random.problem, { robust: false, covarianceScale: 'a-priori', degeneracyReport: false });
    compare(random, solution, denseSolve(random.dense()));
    expect(solution.rank).toBe(random.parameterCount);
    expect(solution.degreesOfFreedom).toBe(300 - random.parameterCount);
  });

  it('with fixed parameters, priors, a global and a local-term constraint', () => {
    const random = randomProblem(shape, seededRandom(12));
    const fixed: FixedParameter[] = [
      { parameter: { kind: 'global', index: 4 }, value: 0.7 },
      { parameter: { kind: 'local', block: 3, index: 1 }, value: -0.2 },
    ];
    const priors: ParameterPrior[] = [
      { parameter: { kind: 'global', index: 2 }, value: 1.5, sigma: 0.3 },
      { parameter: { kind: 'local', block: 7, index: 0 }, value: 0.1, sigma: 0.5 },
    ];
    const constraints: LinearConstraint[] = [
      { label: 'g5 + g6 − g7 = 1', terms: [5, 6, 7].map((index, i) => ({ parameter: { kind: 'global', index }, coefficient: i === 2 ? -1 : 1 })), value: 1 },
      {
        label: 'Σ local 0 + g9 = 2',
        terms: [
          ...Array.from({ length: 30 }, (_, block) => ({ parameter: { kind: 'local' as const, block, index: 0 }, coefficient: 1 })),
          { parameter: { kind: 'global', index: 9 }, coefficient: 1 },
        ],
        value: 2,
      },
    ];
    const problem = { ...random.problem, fixed, priors, constraints };
    const solution = jointSolve(problem, { robust: false, covarianceScale: 'a-priori', degeneracyReport: false });
    compare(random, solution, denseSolve(random.dense({ fixed, priors, constraints })));
    expect(solution.globalEstimate[4]).toBe(0.7);
    const sumLocal0 = Array.from({ length: 30 }, (_, b) => solution.localEstimate[solution.localOffset[b]]).reduce((s, x) => s + x, 0);
    expect(Math.abs(sumLocal0 + solution.globalEstimate[9] - 2)).toBeLessThan(1e-10);
  });
});
