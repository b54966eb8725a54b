import { blockStructure } from './block-structure.ts';
import { checkRows, flatIndex, groupRowsByBlock } from './prepared-problem.ts';
import type { PreparedConstraint, PreparedProblem } from './prepared-problem.ts';
import type { SolverProblem } from './problem.ts';

interface LocalTerm {
  readonly constraint: number;
  readonly block: number;
  readonly local: number;
  readonly coefficient: number;
}

/**
 * Checks a SolverProblem and indexes it for the solver (see PreparedProblem). Throws a
 * RangeError naming the row or entry and the fix for any index out of range, non-finite value,
 * non-positive prior sigma or parameter both fixed and constrained inconsistently.
 */
export function prepareProblem(problem: SolverProblem): PreparedProblem {
  const globalCount = problem.globalNames.length;
  const blockLocalCount = problem.blockLocalCount;
  const blockCount = blockLocalCount.length;
  const localOffset = new Int32Array(blockCount + 1);
  for (let b = 0; b < blockCount; b++) {
    if (!(blockLocalCount[b] >= 0)) throw new RangeError(`blockLocalCount[${b}] is ${blockLocalCount[b]}; pass a count ≥ 0`);
    localOffset[b + 1] = localOffset[b] + blockLocalCount[b];
  }
  const rows = problem.rows;
  checkRows(rows, globalCount, blockLocalCount);
  const { fixed, fixedValue, priorWeight, priorWeightedValue } = fixesAndPriors(problem, globalCount, localOffset);
  const effectiveResidual = rows.residual.slice();
  for (let k = 0; k < rows.count; k++) {
    for (let t = rows.globalStart[k]; t < rows.globalStart[k + 1]; t++) {
      const g = rows.globalIndex[t];
      if (fixed[g]) effectiveResidual[k] -= rows.globalPartial[t] * fixedValue[g];
    }
    const block = rows.block[k];
    if (block < 0) continue;
    for (let t = rows.localStart[k]; t < rows.localStart[k + 1]; t++) {
      const at = globalCount + localOffset[block] + rows.localIndex[t];
      if (fixed[at]) effectiveResidual[k] -= rows.localPartial[t] * fixedValue[at];
    }
  }
  const { localConstraints, globalConstraints, localTerms } = splitConstraints(problem, globalCount, localOffset, fixed, fixedValue);
  localTerms.sort((x, y) => x.block - y.block);
  const blockConstraintStart = new Int32Array(blockCount + 1);
  for (const term of localTerms) blockConstraintStart[term.block + 1]++;
  for (let b = 0; b < blockCount; b++) blockConstraintStart[b + 1] += blockConstraintStart[b];
  const { order, groupStart } = groupRowsByBlock(rows, blockCount);
  const structure = blockStructure(rows, order, groupStart, globalCount, fixed.subarray(0, globalCount));
  return {
    rows, globalCount, blockCount, localOffset, order, groupStart, structure, effectiveResidual,
    globalFixed: fixed.slice(0, globalCount),
    globalFixedValue: fixedValue.slice(0, globalCount),
    localFixed: fixed.slice(globalCount),
    localFixedValue: fixedValue.slice(globalCount),
    globalPriorWeight: priorWeight.slice(0, globalCount),
    globalPriorWeightedValue: priorWeightedValue.slice(0, globalCount),
    localPriorWeight: priorWeight.slice(globalCount),
    localPriorWeightedValue: priorWeightedValue.slice(globalCount),
    priorCount: (problem.priors ?? []).length,
    localConstraints, globalConstraints, blockConstraintStart,
    blockConstraintIndex: Int32Array.from(localTerms, (t) => t.constraint),
    blockConstraintLocal: Int32Array.from(localTerms, (t) => t.local),
    blockConstraintCoefficient: Float64Array.from(localTerms, (t) => t.coefficient),
  };
}

/** Flat arrays (globals, then locals by localOffset) of the fixes and the summed prior weights. */
function fixesAndPriors(problem: SolverProblem, globalCount: number, localOffset: Int32Array):
  { fixed: Uint8Array; fixedValue: Float64Array; priorWeight: Float64Array; priorWeightedValue: Float64Array } {
  const size = globalCount + localOffset[localOffset.length - 1];
  const fixed = new Uint8Array(size);
  const fixedValue = new Float64Array(size);
  for (const [i, entry] of (problem.fixed ?? []).entries()) {
    const at = flatIndex(entry.parameter, globalCount, localOffset, `fixed[${i}]`);
    if (!Number.isFinite(entry.value)) throw new RangeError(`fixed[${i}]: value is ${entry.value}; pass a finite correction`);
    fixed[at] = 1;
    fixedValue[at] = entry.value;
  }
  const priorWeight = new Float64Array(size);
  const priorWeightedValue = new Float64Array(size);
  for (const [i, prior] of (problem.priors ?? []).entries()) {
    const at = flatIndex(prior.parameter, globalCount, localOffset, `priors[${i}]`);
    if (!(prior.sigma > 0 && Number.isFinite(prior.sigma))) throw new RangeError(`priors[${i}]: sigma is ${prior.sigma}; pass a positive finite σ (or fix the parameter instead)`);
    if (!Number.isFinite(prior.value)) throw new RangeError(`priors[${i}]: value is ${prior.value}`);
    if (fixed[at]) throw new RangeError(`priors[${i}]: the parameter is also fixed; keep either the prior or the fix`);
    priorWeight[at] += 1 / (prior.sigma * prior.sigma);
    priorWeightedValue[at] += prior.value / (prior.sigma * prior.sigma);
  }
  return { fixed, fixedValue, priorWeight, priorWeightedValue };
}

function splitConstraints(
  problem: SolverProblem, globalCount: number, localOffset: Int32Array, fixed: Uint8Array, fixedValue: Float64Array,
): { localConstraints: PreparedConstraint[]; globalConstraints: PreparedConstraint[]; localTerms: LocalTerm[] } {
  const localConstraints: PreparedConstraint[] = [];
  const globalConstraints: PreparedConstraint[] = [];
  const localTerms: LocalTerm[] = [];
  for (const [i, constraint] of (problem.constraints ?? []).entries()) {
    const what = `constraints[${i}] "${constraint.label}"`;
    if (!Number.isFinite(constraint.value)) throw new RangeError(`${what}: value is ${constraint.value}`);
    let value = constraint.value;
    const globals = new Map<number, number>();
    const locals: { block: number; local: number; coefficient: number }[] = [];
    for (const term of constraint.terms) {
      if (!Number.isFinite(term.coefficient)) throw new RangeError(`${what}: a coefficient is ${term.coefficient}`);
      const at = flatIndex(term.parameter, globalCount, localOffset, what);
      if (fixed[at]) {
        value -= term.coefficient * fixedValue[at];
      } else if (term.parameter.kind === 'global') {
        globals.set(at, (globals.get(at) ?? 0) + term.coefficient);
      } else {
        locals.push({ block: term.parameter.block, local: term.parameter.index, coefficient: term.coefficient });
      }
    }
    const prepared: PreparedConstraint = {
      label: constraint.label,
      globalIndex: Int32Array.from(globals.keys()),
      globalCoefficient: Float64Array.from(globals.values()),
      value,
    };
    if (locals.length > 0) {
      for (const term of locals) localTerms.push({ constraint: localConstraints.length, ...term });
      localConstraints.push(prepared);
    } else if (prepared.globalIndex.length > 0) {
      globalConstraints.push(prepared);
    } else if (Math.abs(value) > 0) {
      throw new RangeError(`${what}: every term is fixed and the fixed values miss the constraint by ${value}; change the fix or drop the constraint`);
    }
  }
  return { localConstraints, globalConstraints, localTerms };
}
