import type { JulianDate } from '../time/julian-date.ts';
import { HarmonicArguments } from './harmonic-arguments.ts';
import { PLANETARY_AMPLITUDES, PLANETARY_MULTIPLIERS, PLANETARY_TERM_COUNT } from './nutation-2000a-terms.ts';
import { fillPlanetaryArguments, type PlanetaryNutationSource, sumPlanetaryTerms } from './nutation-series.ts';

/**
 * Rates of the 13 planetary-term arguments (rad per Julian century): the linear coefficients of
 * fillPlanetaryArguments (MHB2000 l, F, D, Ω; IERS Conventions 2010 eq. 5.44 for the planets; pA).
 */
const ARGUMENT_RATES = [
  8328.6914269554, 8433.466158131, 7771.3771468121, -33.757045, 2608.7903141574, 1021.3285546211,
  628.3075849991, 334.06124267, 52.9690962641, 21.329910496, 7.4781598567, 3.8127774, 0.02438175,
];
/** Terms of shorter period than this are evaluated at each instant; the rest come from the grid. */
const SHORT_PERIOD_DAYS = 30;

/** The planetary terms split by period: multipliers and amplitudes of each part, in table order. */
function splitTerms(): { short: [Int8Array, Float64Array]; long: [Int8Array, Float64Array] } {
  const short: number[] = [], long: number[] = [];
  for (let i = 0; i < PLANETARY_TERM_COUNT; i++) {
    let rate = 0;
    for (let j = 0; j < 13; j++) rate += PLANETARY_MULTIPLIERS[13 * i + j] * ARGUMENT_RATES[j];
    const periodDays = (2 * Math.PI * 36525) / Math.abs(rate);
    (periodDays < SHORT_PERIOD_DAYS ? short : long).push(i);
  }
  const pick = (rows: number[]): [Int8Array, Float64Array] => [
    Int8Array.from(rows.flatMap((i) => Array.from(PLANETARY_MULTIPLIERS.subarray(13 * i, 13 * i + 13)))),
    Float64Array.from(rows.flatMap((i) => Array.from(PLANETARY_AMPLITUDES.subarray(4 * i, 4 * i + 4)))),
  ];
  return { short: pick(short), long: pick(long) };
}

const parts = splitTerms();
const shortHarmonics = new HarmonicArguments(parts.short[0], 13);
const longHarmonics = new HarmonicArguments(parts.long[0], 13);
const SHORT_COUNT = parts.short[1].length / 4;
const LONG_COUNT = parts.long[1].length / 4;
const planetaryArguments = new Float64Array(13);
const partSums = new Float64Array(2);
/** Nodes kept before the cache is emptied (a 200-year archive at 8-day steps needs 9,131). */
const MAX_NODES = 20_000;

/**
 * The planetary part of IAU 2000A nutation for batch work over many nights: the 56 terms with
 * periods under 30 days (shortest 6.6 days) evaluated at each instant, the other 631 (all of
 * 30 days or longer, carrying 98% of the summed planetary amplitudes) interpolated by a cubic through the
 * four nearest nodes of a grid `stepDays` apart (default 8 days) whose values are computed once,
 * when first needed, and cached. Cost per instant: the 56 short terms plus, on average, the 631
 * long ones once per `stepDays` of instants visited in order.
 * Error against the full planetary series (nutation06a's): < 1 µas in Δψ and Δε at 8-day steps
 * over 1900–2100 (0.52 µas the largest over 4000 random instants; asserted in unit/earth/planetary-nutation-grid.test.ts);
 * 0.03 µas at 4-day steps. Not for use beyond ±1000 years of J2000.0 (the node cache grows).
 */
export class PlanetaryNutationGrid implements PlanetaryNutationSource {
  readonly stepDays: number;
  private readonly nodes = new Map<number, Float64Array>();

  constructor(stepDays = 8) {
    if (!(stepDays > 0 && stepDays <= 16)) throw new RangeError(`PlanetaryNutationGrid: stepDays must lie in (0, 16] (got ${stepDays})`);
    this.stepDays = stepDays;
  }

  /** Δψ, Δε sums of all 687 planetary terms (0.1 µas) at TT `tt` (`t` in Julian centuries) into out. */
  planetarySums(tt: JulianDate, t: number, out: Float64Array): void {
    const days = tt.jd1 - 2_451_545 + tt.jd2;
    const s = days / this.stepDays;
    const k = Math.floor(s), f = s - k;
    // Cubic Lagrange weights at nodes k − 1 … k + 2 for the fraction f ∈ [0, 1).
    const wm = (-f * (f - 1) * (f - 2)) / 6, w0 = ((f + 1) * (f - 1) * (f - 2)) / 2;
    const w1 = (-(f + 1) * f * (f - 2)) / 2, w2 = ((f + 1) * f * (f - 1)) / 6;
    const a = this.node(k - 1), b = this.node(k), c = this.node(k + 1), d = this.node(k + 2);
    fillPlanetaryArguments(t, planetaryArguments);
    shortHarmonics.evaluate(planetaryArguments, SHORT_COUNT);
    sumPlanetaryTerms(shortHarmonics, parts.short[1], SHORT_COUNT, partSums);
    out[0] = partSums[0] + wm * a[0] + w0 * b[0] + w1 * c[0] + w2 * d[0];
    out[1] = partSums[1] + wm * a[1] + w0 * b[1] + w1 * c[1] + w2 * d[1];
  }

  /** The long-period sums at node `k` (TT J2000.0 + k·stepDays), computed once. */
  private node(k: number): Float64Array {
    let value = this.nodes.get(k);
    if (value === undefined) {
      if (this.nodes.size >= MAX_NODES) this.nodes.clear();
      fillPlanetaryArguments((k * this.stepDays) / 36525, planetaryArguments);
      longHarmonics.evaluate(planetaryArguments, LONG_COUNT);
      value = new Float64Array(2);
      sumPlanetaryTerms(longHarmonics, parts.long[1], LONG_COUNT, value);
      this.nodes.set(k, value);
    }
    return value;
  }
}
