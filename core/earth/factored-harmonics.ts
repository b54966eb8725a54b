import { HarmonicArguments } from './harmonic-arguments.ts';

/**
 * The sines and cosines of HarmonicArguments for long series whose rows repeat the same
 * sub-combinations: each term's multipliers are split into a leading group (arguments
 * 0…split−1) and a trailing group (split…), each distinct group row is evaluated once by
 * HarmonicArguments, and a term is one complex product of its two group values,
 * e^{i(m_A·a_A + m_B·a_B)} = e^{i m_A·a_A} · e^{i m_B·a_B}.
 * For the IAU 2000A luni-solar table (678 terms) the groups (l, l′, F) and (D, Ω) have 111 and 35
 * distinct rows, and every term costs one fixed complex product instead of a loop over its 1–5
 * factors (about half the time, measured). The planetary table has too many distinct sub-rows
 * (60 and 469 split after Ω) to gain and keeps HarmonicArguments. Same values as
 * HarmonicArguments to a few ulp (the factors are multiplied in another order).
 */
export class FactoredHarmonics {
  /** sin of each term's argument after `evaluate`. */
  readonly sines: Float64Array;
  /** cos of each term's argument after `evaluate`. */
  readonly cosines: Float64Array;
  private readonly leading: HarmonicArguments;
  private readonly trailing: HarmonicArguments;
  private readonly leadingRow: Uint16Array;
  private readonly trailingRow: Uint16Array;
  private readonly leadingArguments: Float64Array;
  private readonly trailingArguments: Float64Array;
  private readonly split: number;

  /** `multipliers`: `argumentCount` small integers per term, term after term; 0 < split < argumentCount. */
  constructor(multipliers: Int8Array, argumentCount: number, split: number) {
    if (!(split > 0 && split < argumentCount) || multipliers.length % argumentCount !== 0) {
      throw new RangeError(`FactoredHarmonics: split ${split} must lie in 1…${argumentCount - 1} and ${multipliers.length} multipliers must be whole terms of ${argumentCount}`);
    }
    const termCount = multipliers.length / argumentCount;
    const leading = distinctRows(multipliers, argumentCount, 0, split);
    const trailing = distinctRows(multipliers, argumentCount, split, argumentCount);
    this.leading = new HarmonicArguments(leading.rows, split);
    this.trailing = new HarmonicArguments(trailing.rows, argumentCount - split);
    this.leadingRow = leading.index;
    this.trailingRow = trailing.index;
    this.leadingArguments = new Float64Array(split);
    this.trailingArguments = new Float64Array(argumentCount - split);
    this.split = split;
    this.sines = new Float64Array(termCount);
    this.cosines = new Float64Array(termCount);
  }

  /** Fill `sines`/`cosines` for the first `termCount` terms at arguments `argumentsRad` (radians). */
  evaluate(argumentsRad: Float64Array, termCount: number): void {
    const { leadingArguments, trailingArguments, split } = this;
    for (let k = 0; k < split; k++) leadingArguments[k] = argumentsRad[k];
    for (let k = 0; k < trailingArguments.length; k++) trailingArguments[k] = argumentsRad[split + k];
    this.leading.evaluate(leadingArguments, this.leading.sines.length);
    this.trailing.evaluate(trailingArguments, this.trailing.sines.length);
    const { sines: leadingSin, cosines: leadingCos } = this.leading;
    const { sines: trailingSin, cosines: trailingCos } = this.trailing;
    const { leadingRow, trailingRow, sines, cosines } = this;
    for (let i = 0; i < termCount; i++) {
      const a = leadingRow[i], b = trailingRow[i];
      const ca = leadingCos[a], sa = leadingSin[a], cb = trailingCos[b], sb = trailingSin[b];
      cosines[i] = ca * cb - sa * sb;
      sines[i] = sa * cb + ca * sb;
    }
  }
}

/** The distinct sub-rows (columns from…to−1) of a multiplier table and each term's row index. */
function distinctRows(multipliers: Int8Array, argumentCount: number, from: number, to: number): { rows: Int8Array; index: Uint16Array } {
  const termCount = multipliers.length / argumentCount;
  const width = to - from;
  const seen = new Map<string, number>();
  const rows: number[] = [];
  const index = new Uint16Array(termCount);
  for (let i = 0; i < termCount; i++) {
    const row = Array.from(multipliers.subarray(i * argumentCount + from, i * argumentCount + to));
    const key = row.join(',');
    let found = seen.get(key);
    if (found === undefined) {
      found = rows.length / width;
      seen.set(key, found);
      rows.push(...row);
    }
    index[i] = found;
  }
  return { rows: Int8Array.from(rows), index };
}
