import type { BlockWorkspace } from './block-workspace.ts';
import type { PreparedProblem } from './prepared-problem.ts';
import { symmetricGeneralisedInverse } from './small-inverse.ts';

/**
 * Forms block `block`'s normal equations in `ws` from its rows with weights `weight` (1/σ² times
 * the robust factor), adds its local priors, pins its fixed locals, and computes A⁻¹, G = A⁻¹N_lt,
 * y = A⁻¹b_l and H = A⁻¹cᵀ for its constraint terms. With `withTouched` it also forms N_tt and
 * b_t (needed for the reduction, not for back-substitution). Cost: Σ over the block's rows of
 * (terms per row)², plus l²·t for G. Sums are plain: a block holds few rows (≤ ~10³), so the
 * rounding error stays near 10³·ε; the large sums over blocks are compensated elsewhere.
 *
 * With `globalEstimate` (the cheap back-substitution of intermediate robust passes) the globals
 * are taken as known: each residual is reduced by Σ partial·estimate first, so that
 * y = A⁻¹(b_l − N_lt·g) comes out directly, and N_lt, G and the touched list are skipped
 * (touchedCount 0). Cost then Σ rows (local terms)² + (global terms), instead of + l²·t for G.
 */
export function accumulateBlock(
  prep: PreparedProblem, block: number, weight: Float64Array, ws: BlockWorkspace, withTouched: boolean,
  globalEstimate: Float64Array | null = null,
): void {
  const rows = prep.rows;
  const { order, groupStart, localFixed, effectiveResidual } = prep;
  const termSlot = prep.structure.termSlot;
  const first = groupStart[block];
  const end = groupStart[block + 1];
  const l = block < prep.blockCount ? prep.localOffset[block + 1] - prep.localOffset[block] : 0;
  const localBase = block < prep.blockCount ? prep.localOffset[block] : 0;
  ws.localCount = l;
  const t = globalEstimate ? 0 : loadTouched(prep, block, ws);
  if (globalEstimate) ws.touchedCount = 0;
  const A = ws.normalLocal;
  const Nlt = ws.normalLocalTouched;
  const Ntt = ws.normalTouched;
  const bl = ws.rhsLocal;
  const bt = ws.rhsTouched;
  A.fill(0, 0, l * l);
  bl.fill(0, 0, l);
  Nlt.fill(0, 0, l * t);
  if (withTouched) {
    Ntt.fill(0, 0, t * t);
    bt.fill(0, 0, t);
  }
  for (let i = first; i < end; i++) {
    const k = order[i];
    const w = weight[k];
    if (w === 0) continue;
    let r = effectiveResidual[k];
    // The row's free terms, compacted once: touched positions / local indices and partials.
    const g0 = rows.globalStart[k];
    const l0 = rows.localStart[k];
    ensureRowScratch(rows.globalStart[k + 1] - g0, rows.localStart[k + 1] - l0);
    let gn = 0;
    if (globalEstimate) {
      for (let p = g0; p < rows.globalStart[k + 1]; p++) if (termSlot[p] >= 0) r -= rows.globalPartial[p] * globalEstimate[rows.globalIndex[p]];
    } else {
      for (let p = g0; p < rows.globalStart[k + 1]; p++) {
        const slot = termSlot[p];
        if (slot < 0) continue;
        rowPosition[gn] = slot;
        rowGlobalPartial[gn++] = rows.globalPartial[p];
      }
    }
    let ln = 0;
    for (let p = l0; p < rows.localStart[k + 1]; p++) {
      const li = rows.localIndex[p];
      if (localFixed[localBase + li]) continue;
      rowLocal[ln] = li;
      rowLocalPartial[ln++] = rows.localPartial[p];
    }
    for (let p = 0; p < ln; p++) {
      const li = rowLocal[p];
      const wa = w * rowLocalPartial[p];
      bl[li] += wa * r;
      const rowA = li * l;
      for (let q = 0; q < ln; q++) A[rowA + rowLocal[q]] += wa * rowLocalPartial[q];
      const rowN = li * t;
      for (let q = 0; q < gn; q++) Nlt[rowN + rowPosition[q]] += wa * rowGlobalPartial[q];
    }
    if (!withTouched) continue;
    for (let p = 0; p < gn; p++) {
      const ti = rowPosition[p];
      const wa = w * rowGlobalPartial[p];
      bt[ti] += wa * r;
      const rowT = ti * t;
      for (let q = 0; q < gn; q++) Ntt[rowT + rowPosition[q]] += wa * rowGlobalPartial[q];
    }
  }
  finishBlock(prep, block, l, localBase, ws);
}

let rowPosition = new Int32Array(32);
let rowGlobalPartial = new Float64Array(32);
let rowLocal = new Int32Array(32);
let rowLocalPartial = new Float64Array(32);

/** Grows the per-row scratch (module level: the solve is single-threaded and not re-entrant). */
function ensureRowScratch(globalTerms: number, localTerms: number): void {
  if (rowPosition.length < globalTerms) {
    rowPosition = new Int32Array(globalTerms * 2);
    rowGlobalPartial = new Float64Array(globalTerms * 2);
  }
  if (rowLocal.length < localTerms) {
    rowLocal = new Int32Array(localTerms * 2);
    rowLocalPartial = new Float64Array(localTerms * 2);
  }
}

/** Copies the group's sorted touched globals (block-structure.ts) into `ws`; returns their count. */
function loadTouched(prep: PreparedProblem, block: number, ws: BlockWorkspace): number {
  const { touchedStart, touchedGlobal } = prep.structure;
  const from = touchedStart[block];
  const t = touchedStart[block + 1] - from;
  for (let s = 0; s < t; s++) {
    const g = touchedGlobal[from + s];
    ws.touched[s] = g;
    ws.position[g] = s;
  }
  ws.touchedCount = t;
  ws.reserve(t);
  return t;
}

function finishBlock(prep: PreparedProblem, block: number, l: number, localBase: number, ws: BlockWorkspace): void {
  const A = ws.normalLocal;
  const bl = ws.rhsLocal;
  const t = ws.touchedCount;
  for (let i = 0; i < l; i++) {
    const at = localBase + i;
    if (prep.localFixed[at]) {
      A[i * l + i] = 1; // the correction stays at 0; the fixed value is in the residuals
      continue;
    }
    A[i * l + i] += prep.localPriorWeight[at];
    bl[i] += prep.localPriorWeightedValue[at];
  }
  ws.dropped = l > 0 ? symmetricGeneralisedInverse(A, l, ws.inverseLocal) : [];
  for (let i = 0; i < l; i++) if (prep.localFixed[localBase + i]) ws.inverseLocal[i * l + i] = 0;
  const Ainv = ws.inverseLocal;
  const G = ws.gain;
  const Nlt = ws.normalLocalTouched;
  G.fill(0, 0, l * t);
  for (let i = 0; i < l; i++) {
    let sum = 0;
    const rowG = i * t;
    for (let j = 0; j < l; j++) {
      const inverse = Ainv[i * l + j];
      sum += inverse * bl[j];
      if (inverse === 0) continue;
      const rowN = j * t;
      for (let c = 0; c < t; c++) G[rowG + c] += inverse * Nlt[rowN + c];
    }
    ws.solvedLocal[i] = sum;
  }
  ws.constraintCount = 0;
  if (block >= prep.blockCount) return;
  const from = prep.blockConstraintStart[block];
  const to = prep.blockConstraintStart[block + 1];
  const m = ws.maxLocals;
  for (let e = from; e < to; e++) {
    const constraint = prep.blockConstraintIndex[e];
    let slot = -1;
    for (let s = 0; s < ws.constraintCount; s++) if (ws.constraintIndex[s] === constraint) slot = s;
    if (slot < 0) {
      slot = ws.constraintCount++;
      ws.constraintIndex[slot] = constraint;
      ws.constraintRow.fill(0, slot * m, slot * m + m);
    }
    ws.constraintRow[slot * m + prep.blockConstraintLocal[e]] += prep.blockConstraintCoefficient[e];
  }
  for (let s = 0; s < ws.constraintCount; s++) {
    for (let i = 0; i < l; i++) {
      let sum = 0;
      for (let j = 0; j < l; j++) sum += Ainv[i * l + j] * ws.constraintRow[s * m + j];
      ws.constraintGain[s * m + i] = sum;
    }
  }
}
