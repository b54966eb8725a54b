import { ObservationRowsBuilder } from '../../core/solver/observation-rows.ts';
import type { FixedParameter, LinearConstraint, ParameterPrior, ParameterRef, SolverProblem } from '../../core/solver/problem.ts';
import type { DenseProblem } from './dense-reference.ts';
import { gaussian } from './random.ts';

export interface RandomProblemShape {
  readonly globals: number;
  readonly blocks: number;
  readonly rows: number;
  /** Globals per row (distinct, chosen at random). */
  readonly globalsPerRow: number;
  /** Fraction of rows without a block. */
  readonly blocklessFraction?: number;
  /** Add this to every row's partial of each block's local 0 and take it away from global 0 …: a common shift. */
  readonly commonShift?: boolean;
}

export interface RandomProblem {
  readonly problem: SolverProblem;
  readonly truth: Float64Array;
  readonly localOffset: Int32Array;
  readonly parameterCount: number;
  readonly sigma: Float64Array;
  /** Column of a parameter in the dense design matrix. */
  column(ref: ParameterRef): number;
  dense(extra?: { fixed?: readonly FixedParameter[]; priors?: readonly ParameterPrior[]; constraints?: readonly LinearConstraint[] }): DenseProblem;
}

/**
 * A random linear problem with known truth: each row has `globalsPerRow` random globals and every
 * local of its block, partials N(0,1), noise σ_k ∈ [0.5, 2] (weights 1/σ²). With `commonShift`,
 * every row of a block carries local 0 with partial 1 and global 0 with partial 1 as well, so
 * "all zero points +ε, global 0 −ε" is exactly unobservable.
 */
export function randomProblem(shape: RandomProblemShape, random: () => number): RandomProblem {
  const localCount = Int32Array.from({ length: shape.blocks }, () => 2 + Math.floor(random() * 3));
  const localOffset = new Int32Array(shape.blocks + 1);
  for (let b = 0; b < shape.blocks; b++) localOffset[b + 1] = localOffset[b] + localCount[b];
  const parameterCount = shape.globals + localOffset[shape.blocks];
  const truth = Float64Array.from({ length: parameterCount }, () => gaussian(random) * 3);
  const builder = new ObservationRowsBuilder(shape.rows);
  const design = new Float64Array(shape.rows * parameterCount);
  const sigma = new Float64Array(shape.rows);
  for (let k = 0; k < shape.rows; k++) {
    const block = random() < (shape.blocklessFraction ?? 0) ? -1 : k % shape.blocks;
    const chosen = new Set<number>();
    if (shape.commonShift && block >= 0) chosen.add(0);
    const first = shape.commonShift ? 1 : 0;
    while (chosen.size < shape.globalsPerRow) chosen.add(first + Math.floor(random() * (shape.globals - first)));
    const terms: [number, number][] = [];
    for (const g of chosen) terms.push([g, shape.commonShift && g === 0 && block >= 0 ? 1 : gaussian(random)]);
    const localTerms: [number, number][] = [];
    if (block >= 0) {
      for (let j = 0; j < localCount[block]; j++) localTerms.push([j, shape.commonShift && j === 0 ? 1 : gaussian(random)]);
    }
    sigma[k] = 0.5 + 1.5 * random();
    let value = gaussian(random) * sigma[k];
    for (const [g, a] of terms) {
      design[k * parameterCount + g] = a;
      value += a * truth[g];
    }
    for (const [j, a] of localTerms) {
      const column = shape.globals + localOffset[block] + j;
      design[k * parameterCount + column] = a;
      value += a * truth[column];
    }
    builder.beginRow(block, value, 1 / sigma[k] ** 2);
    for (const [g, a] of terms) builder.addGlobal(g, a);
    for (const [j, a] of localTerms) builder.addLocal(j, a);
  }
  const rows = builder.finish();
  const globalNames = Array.from({ length: shape.globals }, (_, i) => `g${i}`);
  const problem: SolverProblem = { globalNames, blockLocalCount: localCount, rows, localName: (b, i) => `b${b}.l${i}` };
  const column = (ref: ParameterRef): number => (ref.kind === 'global' ? ref.index : shape.globals + localOffset[ref.block] + ref.index);
  return {
    problem, truth, localOffset, parameterCount, sigma, column,
    dense(extra = {}) {
      const equalities = [
        ...(extra.fixed ?? []).map((f) => {
          const coefficients = new Float64Array(parameterCount);
          coefficients[column(f.parameter)] = 1;
          return { coefficients, value: f.value };
        }),
        ...(extra.constraints ?? []).map((c) => {
          const coefficients = new Float64Array(parameterCount);
          for (const t of c.terms) coefficients[column(t.parameter)] += t.coefficient;
          return { coefficients, value: c.value };
        }),
      ];
      const priors = (extra.priors ?? []).map((p) => ({ index: column(p.parameter), value: p.value, sigma: p.sigma }));
      return { design, residual: rows.residual, weight: rows.weight, parameterCount, equalities, priors };
    },
  };
}
