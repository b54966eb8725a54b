/**
 * Observation rows for the joint solver, held in flat typed arrays so that a million rows cost
 * a few hundred megabytes and no per-row objects (common practice for sparse least squares: a
 * compressed-row layout, as in compressed sparse row matrices).
 *
 * Row k is one scalar equation  residual[k] ≈ Σ globalPartial·Δglobal + Σ localPartial·Δlocal
 * with weight[k] = 1/σ_k² (σ_k in the residual's unit). The residual is O−C in the caller's
 * unit (radians, seconds of time…); partials are ∂C/∂parameter in residual unit per parameter
 * unit, so the solved corrections Δ make the computed value C + partial·Δ closer to O.
 * Its global terms are globalIndex/globalPartial[globalStart[k] .. globalStart[k+1]), its local
 * terms localIndex/localPartial[localStart[k] .. localStart[k+1]); local indices count within
 * the row's block (0 ≤ index < that block's local count). block[k] = −1 means a row with global
 * terms only. A weight of 0 keeps the row for residuals but out of the fit (user-rejected).
 */
export interface ObservationRows {
  readonly count: number;
  readonly block: Int32Array;
  readonly residual: Float64Array;
  readonly weight: Float64Array;
  readonly globalStart: Int32Array;
  readonly globalIndex: Int32Array;
  readonly globalPartial: Float64Array;
  readonly localStart: Int32Array;
  readonly localIndex: Int32Array;
  readonly localPartial: Float64Array;
}

function grownFloat(array: Float64Array, need: number): Float64Array {
  if (need <= array.length) return array;
  const next = new Float64Array(Math.max(need, array.length * 2));
  next.set(array);
  return next;
}

function grownInt(array: Int32Array, need: number): Int32Array {
  if (need <= array.length) return array;
  const next = new Int32Array(Math.max(need, array.length * 2));
  next.set(array);
  return next;
}

/**
 * Builds ObservationRows one row at a time without allocating per row:
 * `beginRow(block, residual, weight)`, then `addGlobal`/`addLocal` for each nonzero partial.
 * Arrays grow by doubling, so building n rows costs O(n) amortised.
 */
export class ObservationRowsBuilder {
  private rowCount = 0;
  private globalCount = 0;
  private localCount = 0;
  private block: Int32Array;
  private residual: Float64Array;
  private weight: Float64Array;
  private globalStart: Int32Array;
  private localStart: Int32Array;
  private globalIndex: Int32Array;
  private globalPartial: Float64Array;
  private localIndex: Int32Array;
  private localPartial: Float64Array;

  /** `expectedRows` and `termsPerRow` only size the first allocation. */
  constructor(expectedRows = 1024, termsPerRow = 8) {
    const rows = Math.max(1, expectedRows);
    const terms = rows * Math.max(1, termsPerRow);
    this.block = new Int32Array(rows);
    this.residual = new Float64Array(rows);
    this.weight = new Float64Array(rows);
    this.globalStart = new Int32Array(rows + 1);
    this.localStart = new Int32Array(rows + 1);
    this.globalIndex = new Int32Array(terms);
    this.globalPartial = new Float64Array(terms);
    this.localIndex = new Int32Array(terms);
    this.localPartial = new Float64Array(terms);
  }

  /** Starts row number `this.count`; `block` −1 for a row without local terms. */
  beginRow(block: number, residual: number, weight: number): number {
    const k = this.rowCount;
    this.block = grownInt(this.block, k + 1);
    this.residual = grownFloat(this.residual, k + 1);
    this.weight = grownFloat(this.weight, k + 1);
    this.globalStart = grownInt(this.globalStart, k + 2);
    this.localStart = grownInt(this.localStart, k + 2);
    this.block[k] = block;
    this.residual[k] = residual;
    this.weight[k] = weight;
    this.globalStart[k] = this.globalCount;
    this.localStart[k] = this.localCount;
    this.rowCount = k + 1;
    this.globalStart[k + 1] = this.globalCount;
    this.localStart[k + 1] = this.localCount;
    return k;
  }

  /** Adds ∂C/∂global[index] to the current row. */
  addGlobal(index: number, partial: number): void {
    if (this.rowCount === 0) throw new Error('ObservationRowsBuilder.addGlobal: call beginRow first');
    const at = this.globalCount;
    this.globalIndex = grownInt(this.globalIndex, at + 1);
    this.globalPartial = grownFloat(this.globalPartial, at + 1);
    this.globalIndex[at] = index;
    this.globalPartial[at] = partial;
    this.globalCount = at + 1;
    this.globalStart[this.rowCount] = this.globalCount;
  }

  /** Adds ∂C/∂local[index] (index within the row's block) to the current row. */
  addLocal(index: number, partial: number): void {
    if (this.rowCount === 0) throw new Error('ObservationRowsBuilder.addLocal: call beginRow first');
    const at = this.localCount;
    this.localIndex = grownInt(this.localIndex, at + 1);
    this.localPartial = grownFloat(this.localPartial, at + 1);
    this.localIndex[at] = index;
    this.localPartial[at] = partial;
    this.localCount = at + 1;
    this.localStart[this.rowCount] = this.localCount;
  }

  get count(): number {
    return this.rowCount;
  }

  /** The rows built so far, trimmed to size (the builder may be dropped afterwards). */
  finish(): ObservationRows {
    const n = this.rowCount;
    return {
      count: n,
      block: this.block.slice(0, n),
      residual: this.residual.slice(0, n),
      weight: this.weight.slice(0, n),
      globalStart: this.globalStart.slice(0, n + 1),
      globalIndex: this.globalIndex.slice(0, this.globalCount),
      globalPartial: this.globalPartial.slice(0, this.globalCount),
      localStart: this.localStart.slice(0, n + 1),
      localIndex: this.localIndex.slice(0, this.localCount),
      localPartial: this.localPartial.slice(0, this.localCount),
    };
  }
}
