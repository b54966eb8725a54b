/**
 * Element-wise compensated accumulator for a long sum of arrays (Neumaier's improvement of Kahan
 * summation: A. Neumaier, Z. Angew. Math. Mech. 54, 39–51, 1974). Error bound 2ε·Σ|terms|
 * independent of the number of terms, against (terms)·ε for a plain running sum.
 *
 * Used in two levels: contributions are first added plainly into `chunk` (a few hundred blocks, so
 * the plain error stays near 256·ε), then `flush()` adds the chunk to the compensated total.
 * That keeps the per-term cost of the inner loop at one addition.
 */
export class CompensatedArraySum {
  readonly chunk: Float64Array;
  private readonly sum: Float64Array;
  private readonly compensation: Float64Array;

  constructor(length: number) {
    this.chunk = new Float64Array(length);
    this.sum = new Float64Array(length);
    this.compensation = new Float64Array(length);
  }

  /** Adds the chunk into the compensated total and clears it. */
  flush(): void {
    const { chunk, sum, compensation } = this;
    for (let i = 0; i < chunk.length; i++) {
      const term = chunk[i];
      if (term === 0) continue;
      const total = sum[i];
      const next = total + term;
      compensation[i] += Math.abs(total) >= Math.abs(term) ? total - next + term : term - next + total;
      sum[i] = next;
      chunk[i] = 0;
    }
  }

  /** The compensated totals (flushes first). */
  result(): Float64Array {
    this.flush();
    const out = new Float64Array(this.sum.length);
    for (let i = 0; i < out.length; i++) out[i] = this.sum[i] + this.compensation[i];
    return out;
  }
}
