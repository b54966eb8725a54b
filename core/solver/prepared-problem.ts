import type { BlockStructure } from './block-structure.ts';
import type { ObservationRows } from './observation-rows.ts';
import type { ParameterRef } from './problem.ts';

/** A linear constraint after fixed parameters were moved to its right-hand side. */
export interface PreparedConstraint {
  readonly label: string;
  readonly globalIndex: Int32Array;
  readonly globalCoefficient: Float64Array;
  /** Right-hand side after subtracting the fixed parameters' share. */
  readonly value: number;
}

/**
 * The problem checked and indexed once for every robust pass: rows grouped by block, fixed
 * parameters folded into the residuals, priors and constraints in flat arrays. Internal.
 */
export interface PreparedProblem {
  readonly rows: ObservationRows;
  readonly globalCount: number;
  readonly blockCount: number;
  /** Flat local numbering: block b owns locals localOffset[b] … localOffset[b+1]−1. */
  readonly localOffset: Int32Array;
  /** Row numbers grouped by block; group b is order[groupStart[b] … groupStart[b+1]), group blockCount holds block −1. */
  readonly order: Int32Array;
  readonly groupStart: Int32Array;
  /** Sorted touched globals per group and each term's slot in them (block-structure.ts). */
  readonly structure: BlockStructure;
  /** residual − Σ partial·(fixed value) over the row's fixed parameters. */
  readonly effectiveResidual: Float64Array;
  readonly globalFixed: Uint8Array;
  readonly globalFixedValue: Float64Array;
  readonly localFixed: Uint8Array;
  readonly localFixedValue: Float64Array;
  /** Σ 1/σ² and Σ value/σ² of the priors on each parameter. */
  readonly globalPriorWeight: Float64Array;
  readonly globalPriorWeightedValue: Float64Array;
  readonly localPriorWeight: Float64Array;
  readonly localPriorWeightedValue: Float64Array;
  readonly priorCount: number;
  /** Constraints with at least one free local term (multipliers eliminated with the blocks). */
  readonly localConstraints: readonly PreparedConstraint[];
  /** Per block b: entries blockConstraintStart[b] … [b+1]) of (constraint, local index, coefficient). */
  readonly blockConstraintStart: Int32Array;
  readonly blockConstraintIndex: Int32Array;
  readonly blockConstraintLocal: Int32Array;
  readonly blockConstraintCoefficient: Float64Array;
  /** Constraints on global parameters only. */
  readonly globalConstraints: readonly PreparedConstraint[];
}

function checkRows(rows: ObservationRows, globalCount: number, blockLocalCount: Int32Array): void {
  const blockCount = blockLocalCount.length;
  for (let k = 0; k < rows.count; k++) {
    const block = rows.block[k];
    const where = `observation row ${k}`;
    if (!(block >= -1 && block < blockCount)) {
      throw new RangeError(`${where}: block ${block} is outside 0…${blockCount - 1} (or −1 for none); fix the block index or blockLocalCount`);
    }
    if (!Number.isFinite(rows.residual[k])) throw new RangeError(`${where}: residual is ${rows.residual[k]}; pass a finite O−C`);
    const weight = rows.weight[k];
    if (!(weight >= 0 && Number.isFinite(weight))) throw new RangeError(`${where}: weight is ${weight}; pass 1/σ² ≥ 0 (0 rejects the row)`);
    for (let t = rows.globalStart[k]; t < rows.globalStart[k + 1]; t++) {
      const index = rows.globalIndex[t];
      if (!(index >= 0 && index < globalCount)) throw new RangeError(`${where}: global index ${index} is outside 0…${globalCount - 1}; add its name to globalNames`);
      if (!Number.isFinite(rows.globalPartial[t])) throw new RangeError(`${where}: partial for global ${index} is ${rows.globalPartial[t]}`);
    }
    const localCount = block >= 0 ? blockLocalCount[block] : 0;
    for (let t = rows.localStart[k]; t < rows.localStart[k + 1]; t++) {
      const index = rows.localIndex[t];
      if (!(index >= 0 && index < localCount)) {
        throw new RangeError(`${where}: local index ${index} is outside block ${block}'s ${localCount} locals; raise blockLocalCount[${block}] or fix the index`);
      }
      if (!Number.isFinite(rows.localPartial[t])) throw new RangeError(`${where}: partial for local ${index} is ${rows.localPartial[t]}`);
    }
  }
}

/** Flat index of a parameter: globals 0…G−1, locals G + localOffset[block] + index. */
function flatIndex(ref: ParameterRef, globalCount: number, localOffset: Int32Array, what: string): number {
  if (ref.kind === 'global') {
    if (!(Number.isInteger(ref.index) && ref.index >= 0 && ref.index < globalCount)) {
      throw new RangeError(`${what}: global index ${ref.index} is outside 0…${globalCount - 1}`);
    }
    return ref.index;
  }
  const blockCount = localOffset.length - 1;
  if (!(Number.isInteger(ref.block) && ref.block >= 0 && ref.block < blockCount)) {
    throw new RangeError(`${what}: block ${ref.block} is outside 0…${blockCount - 1}`);
  }
  const count = localOffset[ref.block + 1] - localOffset[ref.block];
  if (!(Number.isInteger(ref.index) && ref.index >= 0 && ref.index < count)) {
    throw new RangeError(`${what}: local ${ref.index} is outside block ${ref.block}'s ${count} locals`);
  }
  return globalCount + localOffset[ref.block] + ref.index;
}

function groupRowsByBlock(rows: ObservationRows, blockCount: number): { order: Int32Array; groupStart: Int32Array } {
  // Counting sort: O(rows + blocks), stable, no comparisons.
  const groupStart = new Int32Array(blockCount + 2);
  for (let k = 0; k < rows.count; k++) {
    const b = rows.block[k];
    groupStart[(b < 0 ? blockCount : b) + 1]++;
  }
  for (let g = 0; g <= blockCount; g++) groupStart[g + 1] += groupStart[g];
  const cursor = groupStart.slice(0, blockCount + 1);
  const order = new Int32Array(rows.count);
  for (let k = 0; k < rows.count; k++) {
    const b = rows.block[k];
    order[cursor[b < 0 ? blockCount : b]++] = k;
  }
  return { order, groupStart };
}

export { checkRows, flatIndex, groupRowsByBlock };
