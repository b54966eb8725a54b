/**
 * Sines and cosines of many integer combinations Σ_k m_ik·a_k of a few fundamental arguments a_k,
 * without one Math.sin/Math.cos pair per term: cos/sin of n·a_k are built once per call by the
 * angle-addition recurrence (n up to the largest |m_ik|), and each term's value is the product of
 * its non-zero factors as unit complex numbers, e^{iΣ m a} = Π (e^{i a_k})^{m_k}.
 * This is the standard device for long trigonometric series (e.g. Chapront & Francou's lunar
 * series evaluations; common practice). Rounding: the recurrence loses about n ulp at multiple n,
 * i.e. below 1e−14 in relative terms for n ≤ 21 — below 1e−6 µas on a 17″ amplitude.
 * No allocation per call: the results are written into the instance's own arrays.
 */
export class HarmonicArguments {
  /** sin of each term's argument after `evaluate`. */
  readonly sines: Float64Array;
  /** cos of each term's argument after `evaluate`. */
  readonly cosines: Float64Array;
  private readonly argumentCount: number;
  private readonly maxMultiple: number;
  private readonly powerCos: Float64Array;
  private readonly powerSin: Float64Array;
  private readonly termStart: Uint32Array;
  private readonly factorIndex: Uint16Array;

  /** `multipliers` holds `argumentCount` small integers per term, term after term. */
  constructor(multipliers: Int8Array, argumentCount: number) {
    if (multipliers.length % argumentCount !== 0) {
      throw new RangeError(`HarmonicArguments: ${multipliers.length} multipliers are not a whole number of terms of ${argumentCount}`);
    }
    const termCount = multipliers.length / argumentCount;
    let maxMultiple = 0;
    let factorCount = 0;
    for (const m of multipliers) {
      maxMultiple = Math.max(maxMultiple, Math.abs(m));
      if (m !== 0) factorCount++;
    }
    this.argumentCount = argumentCount;
    this.maxMultiple = maxMultiple;
    const width = 2 * maxMultiple + 1;
    this.powerCos = new Float64Array(argumentCount * width);
    this.powerSin = new Float64Array(argumentCount * width);
    this.termStart = new Uint32Array(termCount + 1);
    this.factorIndex = new Uint16Array(factorCount);
    let next = 0;
    for (let i = 0; i < termCount; i++) {
      this.termStart[i] = next;
      for (let k = 0; k < argumentCount; k++) {
        const m = multipliers[i * argumentCount + k];
        if (m !== 0) this.factorIndex[next++] = k * width + maxMultiple + m;
      }
    }
    this.termStart[termCount] = next;
    this.sines = new Float64Array(termCount);
    this.cosines = new Float64Array(termCount);
  }

  /** Fill `sines`/`cosines` for the first `termCount` terms at arguments `argumentsRad` (radians). */
  evaluate(argumentsRad: Float64Array, termCount: number): void {
    this.fillPowers(argumentsRad);
    const { powerCos, powerSin, termStart, factorIndex, sines, cosines } = this;
    for (let i = 0; i < termCount; i++) {
      let re = 1;
      let im = 0;
      for (let f = termStart[i]; f < termStart[i + 1]; f++) {
        const index = factorIndex[f];
        const c = powerCos[index];
        const s = powerSin[index];
        const nextRe = re * c - im * s;
        im = re * s + im * c;
        re = nextRe;
      }
      sines[i] = im;
      cosines[i] = re;
    }
  }

  /** cos and sin of n·a_k for n = −N…N, by the angle-addition recurrence from n = ±1. */
  private fillPowers(argumentsRad: Float64Array): void {
    const width = 2 * this.maxMultiple + 1;
    for (let k = 0; k < this.argumentCount; k++) {
      const zero = k * width + this.maxMultiple;
      const c1 = Math.cos(argumentsRad[k]);
      const s1 = Math.sin(argumentsRad[k]);
      this.powerCos[zero] = 1;
      this.powerSin[zero] = 0;
      let c = 1;
      let s = 0;
      for (let n = 1; n <= this.maxMultiple; n++) {
        const nextC = c * c1 - s * s1;
        s = s * c1 + c * s1;
        c = nextC;
        this.powerCos[zero + n] = c;
        this.powerSin[zero + n] = s;
        this.powerCos[zero - n] = c;
        this.powerSin[zero - n] = -s;
      }
    }
  }
}
