import type { DroppedDirection } from './small-inverse.ts';

/**
 * Scratch arrays for one block's normal equations, allocated once per solve and reused for every
 * block (no allocation in the inner loop). Matrices are row-major with the strides noted.
 * For the block being processed, with l its locals and t the globals its rows touch:
 * A = N_ll (l×l), N_lt (l×t, stride t), N_tt (t×t, stride t), b_l, b_t,
 * A⁻¹ (generalised if singular), G = A⁻¹·N_lt (l×t), y = A⁻¹·b_l,
 * and for each constraint with local terms in this block its coefficient row c (l) and H = A⁻¹·cᵀ.
 */
export class BlockWorkspace {
  localCount = 0;
  touchedCount = 0;
  /** Free global indices touched by the block, ascending (block-structure.ts). */
  readonly touched: Int32Array;
  /** position[g] = place of global g in `touched`, valid for the globals of the block being processed. */
  readonly position: Int32Array;
  readonly normalLocal: Float64Array;
  readonly inverseLocal: Float64Array;
  readonly rhsLocal: Float64Array;
  readonly solvedLocal: Float64Array;
  normalLocalTouched: Float64Array;
  gain: Float64Array;
  normalTouched: Float64Array;
  readonly rhsTouched: Float64Array;
  /** Constraints with local terms in this block: their numbers, rows c and H = A⁻¹cᵀ (stride maxLocals). */
  constraintCount = 0;
  constraintIndex: Int32Array;
  constraintRow: Float64Array;
  constraintGain: Float64Array;
  /** Directions of A dropped as singular (scaled coordinates); empty when A was regular. */
  dropped: DroppedDirection[] = [];
  readonly maxLocals: number;

  constructor(globalCount: number, maxLocals: number, maxConstraints: number) {
    const l = Math.max(1, maxLocals);
    this.maxLocals = l;
    this.touched = new Int32Array(globalCount);
    this.position = new Int32Array(globalCount);
    this.normalLocal = new Float64Array(l * l);
    this.inverseLocal = new Float64Array(l * l);
    this.rhsLocal = new Float64Array(l);
    this.solvedLocal = new Float64Array(l);
    this.normalLocalTouched = new Float64Array(l * 64);
    this.gain = new Float64Array(l * 64);
    this.normalTouched = new Float64Array(64 * 64);
    this.rhsTouched = new Float64Array(globalCount);
    this.constraintIndex = new Int32Array(Math.max(1, maxConstraints));
    this.constraintRow = new Float64Array(Math.max(1, maxConstraints) * l);
    this.constraintGain = new Float64Array(Math.max(1, maxConstraints) * l);
  }

  /** Makes room for `touched` globals. */
  reserve(touched: number): void {
    const l = this.maxLocals;
    if (this.normalLocalTouched.length < l * touched) {
      this.normalLocalTouched = new Float64Array(l * touched * 2);
      this.gain = new Float64Array(l * touched * 2);
    }
    if (this.normalTouched.length < touched * touched) this.normalTouched = new Float64Array(touched * touched * 2);
  }
}
