import type { ObservationRows } from './observation-rows.ts';

/**
 * The sparsity of the problem, fixed for every robust pass (only the weights change between
 * passes): for each row group (block b, and group blockCount for the block-less rows) the free
 * globals its rows touch, sorted ascending, and for each global term of each row its slot in
 * that list. Computed once per solve so that a pass spends no time discovering structure, and
 * sorted so that the scatter of a block's t×t Schur update into the global matrix writes each
 * row left to right with no branch on index order. Memory: one Int32 per global term plus Σt.
 */
export interface BlockStructure {
  /** Group g's touched globals are touchedGlobal[touchedStart[g] … touchedStart[g+1]), ascending. */
  readonly touchedStart: Int32Array;
  readonly touchedGlobal: Int32Array;
  /** For global term p of any row (as in rows.globalIndex): its slot in its group's list, −1 when the global is fixed. */
  readonly termSlot: Int32Array;
  /** Largest touched count over the groups. */
  readonly maxTouched: number;
}

/**
 * Builds the BlockStructure from rows grouped by `order`/`groupStart` (prepared-problem.ts).
 * Cost O(terms + Σ t log t); `globalFixed[g]` = 1 leaves global g out of every list.
 */
export function blockStructure(
  rows: ObservationRows, order: Int32Array, groupStart: Int32Array, globalCount: number, globalFixed: Uint8Array,
): BlockStructure {
  const groups = groupStart.length - 1;
  const stamp = new Int32Array(globalCount).fill(-1);
  const slot = new Int32Array(globalCount);
  const touchedStart = new Int32Array(groups + 1);
  let listed: Int32Array<ArrayBuffer> = new Int32Array(Math.max(16, globalCount));
  let used = 0;
  let maxTouched = 0;
  const termSlot = new Int32Array(rows.globalIndex.length).fill(-1);
  for (let group = 0; group < groups; group++) {
    const first = used;
    for (let i = groupStart[group]; i < groupStart[group + 1]; i++) {
      const k = order[i];
      for (let p = rows.globalStart[k]; p < rows.globalStart[k + 1]; p++) {
        const g = rows.globalIndex[p];
        if (globalFixed[g] || stamp[g] === group) continue;
        stamp[g] = group;
        if (used === listed.length) listed = grown(listed);
        listed[used++] = g;
      }
    }
    listed.subarray(first, used).sort();
    for (let s = first; s < used; s++) slot[listed[s]] = s - first;
    for (let i = groupStart[group]; i < groupStart[group + 1]; i++) {
      const k = order[i];
      for (let p = rows.globalStart[k]; p < rows.globalStart[k + 1]; p++) {
        if (!globalFixed[rows.globalIndex[p]]) termSlot[p] = slot[rows.globalIndex[p]];
      }
    }
    touchedStart[group + 1] = used;
    maxTouched = Math.max(maxTouched, used - first);
  }
  return { touchedStart, touchedGlobal: listed.slice(0, used), termSlot, maxTouched };
}

function grown(array: Int32Array): Int32Array<ArrayBuffer> {
  const next = new Int32Array(array.length * 2);
  next.set(array);
  return next;
}
