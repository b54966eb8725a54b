import { accumulateBlock } from './accumulate-block.ts';
import type { BlockWorkspace } from './block-workspace.ts';
import { CompensatedArraySum } from './compensated-sum.ts';
import type { PreparedProblem } from './prepared-problem.ts';

/**
 * The global system left after every block's locals are eliminated (Schur complement), data
 * only (no global priors), plus the pieces of the local-term constraints:
 *   normal  R  = Σ_blocks (N_tt − N_tlA⁻¹N_lt)   (n×n, full symmetric)
 *   rhs     b' = Σ_blocks (b_t − N_tlA⁻¹b_l)
 *   coupling B = C_g − Σ_blocks C_jA⁻¹N_lt         (m×n, m local-term constraints)
 *   constraintNormal E = Σ_blocks C_jA⁻¹C_jᵀ          (m×m)
 *   constraintRhs d' = d − Σ_blocks C_jA⁻¹b_l      (m)
 * so that the reduced KKT system is [R Bᵀ; B −E]·[g; λ] = [b'; d'] (solved in solve-globals.ts).
 */
export interface ReducedSystem {
  readonly n: number;
  readonly normal: Float64Array;
  readonly rhs: Float64Array;
  readonly constraintCount: number;
  readonly coupling: Float64Array;
  readonly constraintNormal: Float64Array;
  readonly constraintRhs: Float64Array;
  /**
   * Σ w·partial² per global over every row, before any elimination: how much data touches each
   * global at all. A unit-consistent scale where the reduced diagonal has been eaten by the
   * elimination (a global the locals fully absorb), used to scale global-only constraints.
   */
  readonly unreducedDiagonal: Float64Array;
  /** Blocks whose local matrix was singular, with the dropped directions (scaled coordinates). */
  readonly singularBlocks: readonly { block: number; vectors: readonly Float64Array[]; relativeEigenvalues: readonly number[] }[];
}

/** Blocks summed plainly before each compensated flush (plain error ~256·ε of a chunk; a flush costs n²). */
const BLOCKS_PER_CHUNK = 256;

function subtractSchur(ws: BlockWorkspace): void {
  // N_tt −= N_ltᵀ·G over the upper triangle; b_t −= N_ltᵀ·y. Cost l·t²/2. Up to four locals per
  // sweep of a row of N_tt (one load and store of N_tt per four products: about twice as fast in
  // V8 as one per product), the last sweep taking the 1–3 left over together.
  const l = ws.localCount;
  const t = ws.touchedCount;
  for (let i = 0; i < t; i++) {
    for (let a = 0; a < l; a += 4) subtractSweep(ws, i, a, Math.min(4, l - a));
  }
}

/** Row i of N_tt (j ≥ i) and b_t[i] minus Σ over locals a … a+count−1 of N_lt[a,i]·(G[a,j], y[a]). */
function subtractSweep(ws: BlockWorkspace, i: number, a: number, count: number): void {
  const t = ws.touchedCount;
  const Nlt = ws.normalLocalTouched;
  const G = ws.gain;
  const Ntt = ws.normalTouched;
  const y = ws.solvedLocal;
  const rowI = i * t;
  const r0 = a * t;
  const r1 = r0 + t;
  const r2 = r1 + t;
  const r3 = r2 + t;
  const n0 = Nlt[r0 + i];
  if (count === 1) {
    ws.rhsTouched[i] -= n0 * y[a];
    for (let j = i; j < t; j++) Ntt[rowI + j] -= n0 * G[r0 + j];
    return;
  }
  const n1 = Nlt[r1 + i];
  if (count === 2) {
    ws.rhsTouched[i] -= n0 * y[a] + n1 * y[a + 1];
    for (let j = i; j < t; j++) Ntt[rowI + j] -= n0 * G[r0 + j] + n1 * G[r1 + j];
    return;
  }
  const n2 = Nlt[r2 + i];
  if (count === 3) {
    ws.rhsTouched[i] -= n0 * y[a] + n1 * y[a + 1] + n2 * y[a + 2];
    for (let j = i; j < t; j++) Ntt[rowI + j] -= n0 * G[r0 + j] + n1 * G[r1 + j] + n2 * G[r2 + j];
    return;
  }
  const n3 = Nlt[r3 + i];
  ws.rhsTouched[i] -= n0 * y[a] + n1 * y[a + 1] + n2 * y[a + 2] + n3 * y[a + 3];
  for (let j = i; j < t; j++) Ntt[rowI + j] -= n0 * G[r0 + j] + n1 * G[r1 + j] + n2 * G[r2 + j] + n3 * G[r3 + j];
}

/**
 * Adds the block's reduced N_tt (upper triangle) and b_t into the global sums. The global upper
 * triangle is packed by rows (row g at rowStart[g], columns g…n−1: half the memory of the full
 * matrix, so more of it stays in cache); touched is ascending, so gi ≤ gj for j ≥ i.
 */
function scatter(ws: BlockWorkspace, rowStart: Int32Array, normal: Float64Array, rhs: Float64Array): void {
  const t = ws.touchedCount;
  const Ntt = ws.normalTouched;
  const touched = ws.touched;
  for (let i = 0; i < t; i++) {
    const base = rowStart[touched[i]] - touched[i];
    rhs[touched[i]] += ws.rhsTouched[i];
    const rowI = i * t;
    for (let j = i; j < t; j++) normal[base + touched[j]] += Ntt[rowI + j];
  }
}

function addConstraintTerms(ws: BlockWorkspace, m: number, n: number, B: Float64Array, E: Float64Array, d: Float64Array): void {
  // With c the constraint's row over the block's locals (usually one nonzero): d −= c·y,
  // E += c·A⁻¹·cᵀ = c·H, B −= c·A⁻¹·N_lt = c·G (A⁻¹ symmetric), skipping c's zeros.
  const l = ws.localCount;
  const t = ws.touchedCount;
  const stride = ws.maxLocals;
  const G = ws.gain;
  for (let s = 0; s < ws.constraintCount; s++) {
    const c = ws.constraintIndex[s];
    const rowB = c * n;
    for (let i = 0; i < l; i++) {
      const coefficient = ws.constraintRow[s * stride + i];
      if (coefficient === 0) continue;
      d[c] -= coefficient * ws.solvedLocal[i];
      for (let u = 0; u < ws.constraintCount; u++) E[c * m + ws.constraintIndex[u]] += coefficient * ws.constraintGain[u * stride + i];
      const rowG = i * t;
      for (let x = 0; x < t; x++) B[rowB + ws.touched[x]] -= coefficient * G[rowG + x];
    }
  }
}

/**
 * Eliminates every block (and accumulates the block-less rows) into a ReducedSystem. Cost is
 * linear in the rows plus Σ_blocks l·t²/2 for the Schur updates. `onBlock(done, total)` is
 * called every few hundred blocks; it may throw to cancel.
 */
export function reduceBlocks(
  prep: PreparedProblem, weight: Float64Array, ws: BlockWorkspace, recordSingular: boolean,
  onBlock: (done: number, total: number) => void,
): ReducedSystem {
  const n = prep.globalCount;
  const m = prep.localConstraints.length;
  const rowStart = new Int32Array(n + 1);
  for (let g = 0; g < n; g++) rowStart[g + 1] = rowStart[g] + n - g;
  const normalSum = new CompensatedArraySum(rowStart[n]);
  const unreducedDiagonal = new Float64Array(n);
  const rhsSum = new CompensatedArraySum(n);
  const B = new Float64Array(m * n);
  const E = new Float64Array(m * m);
  const d = Float64Array.from(prep.localConstraints, (c) => c.value);
  prep.localConstraints.forEach((c, i) => c.globalIndex.forEach((g, j) => { B[i * n + g] += c.globalCoefficient[j]; }));
  const singularBlocks: { block: number; vectors: Float64Array[]; relativeEigenvalues: number[] }[] = [];
  const total = prep.blockCount + 1;
  for (let block = 0; block < total; block++) {
    if ((block & 255) === 0) onBlock(block, total);
    accumulateBlock(prep, block, weight, ws, true);
    if (ws.dropped.length > 0 && recordSingular) {
      singularBlocks.push({ block, vectors: ws.dropped.map((x) => x.vector), relativeEigenvalues: ws.dropped.map((x) => x.relativeEigenvalue) });
    }
    for (let i = 0; i < ws.touchedCount; i++) unreducedDiagonal[ws.touched[i]] += ws.normalTouched[i * ws.touchedCount + i];
    subtractSchur(ws);
    scatter(ws, rowStart, normalSum.chunk, rhsSum.chunk);
    if (ws.constraintCount > 0) addConstraintTerms(ws, m, n, B, E, d);
    if (block % BLOCKS_PER_CHUNK === BLOCKS_PER_CHUNK - 1) {
      normalSum.flush();
      rhsSum.flush();
    }
  }
  onBlock(total, total);
  const packed = normalSum.result();
  const normal = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = i; j < n; j++) {
      const value = packed[rowStart[i] + j - i];
      normal[i * n + j] = value;
      normal[j * n + i] = value;
    }
  }
  return { n, normal, rhs: rhsSum.result(), constraintCount: m, coupling: B, constraintNormal: E, constraintRhs: d, unreducedDiagonal, singularBlocks };
}
