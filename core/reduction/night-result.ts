import type { BlunderCandidate } from '../instrument/blunder-hints.ts';
import type { NightConstantName, NightConstants } from './night-inputs.ts';

/** Every intermediate value of one transit, from raw reading to residual. Times: s from 0 h UTC (or clock) of the night's date. */
export interface TransitResult {
  readonly row: number;
  readonly line: number;
  readonly starId: string;
  readonly culmination: 'upper' | 'lower';
  readonly clamp: 'east' | 'west' | 'none';
  readonly timeKind: 'utc' | 'clock';
  readonly wireCount: number;
  /** Mean wire as read (clock seconds, or UTC seconds for a UTC log) and its standard error from the wires (null: one wire). */
  readonly meanWireReadingS: number;
  readonly meanWireSigmaS: number | null;
  /** Clock correction applied (s; 0 … for a UTC log unless an offset was fitted) and the resulting UTC. */
  readonly clockCorrectionS: number;
  readonly observedUtcS: number;
  readonly mayer: { readonly azimuthFactor: number; readonly levelFactor: number; readonly collimationFactor: number; readonly correctionS: number };
  readonly predictedUtcS: number;
  readonly apparentRaDeg: number;
  readonly apparentDecDeg: number;
  /** O − C in right ascension: seconds of time, and arcsec on the sky (×15 cos δ). */
  readonly ocTimeS: number;
  readonly ocRaArcsecCosDec: number;
  /** Zenith distance steps (null without a reading): degrees, arcsec. */
  readonly zenith: {
    readonly reading: number;
    readonly readingUnit: 'turns' | 'px' | 'deg';
    readonly observedDeg: number;
    readonly refractionArcsec: number;
    readonly flexureTermArcsec: number;
    readonly trueDeg: number;
    readonly predictedDeg: number;
    readonly side: 'north' | 'south';
    readonly weatherSource: 'transit' | 'night' | 'partly night' | 'none';
    readonly ocZenithArcsec: number;
    readonly ocDeclinationArcsec: number;
  } | null;
  readonly weight: number;
  readonly userRejected: boolean;
  readonly outlierTime: boolean;
  readonly outlierZenith: boolean;
  /**
   * The outlier was a gross blunder, screened out before the fit (fit-night.ts GROSS_… limits),
   * not a statistical rejection: a joint solve drops these and leaves the others to its own
   * robust weights.
   */
  readonly grossBlunderTime: boolean;
  readonly grossBlunderZenith: boolean;
  /** Probable causes of a large residual, best first (blunder-hints.ts); empty when none fits. */
  readonly hints: readonly BlunderCandidate[];
}

/** One night constant as used: its value, formal error (null when held or not estimable) and where it came from. */
export interface ConstantResult {
  readonly value: number;
  readonly sigma: number | null;
  readonly source: 'fitted' | 'readings' | 'fixed' | 'carried';
}

export interface NightReductionResult {
  readonly instrumentId: string;
  readonly nightDateMjd: number;
  readonly constants: { readonly [K in NightConstantName]: ConstantResult };
  /** Clock model reference epoch (nominal clock seconds from 0 h of the night's date). */
  readonly clockReferenceS: number;
  /** From the comparisons (null when the night has none): unit-weight error (s) and count. */
  readonly clockComparisons: { readonly count: number; readonly unitWeightErrorS: number | null; readonly notes: readonly string[] } | null;
  readonly transits: readonly TransitResult[];
  /** Unit-weight errors: right ascension (s of time, weight 1) and zenith distance (arcsec); null without redundancy. */
  readonly unitWeightErrorTimeS: number | null;
  readonly unitWeightErrorZenithArcsec: number | null;
  readonly robustSigmaTimeS: number;
  readonly robustSigmaZenithArcsec: number;
  /** Correlation matrix of the free right-ascension constants, in `freeTimeConstants` order. */
  readonly freeTimeConstants: readonly string[];
  readonly timeCorrelation: readonly (readonly number[])[];
  /** The outlier rule in words and what the reduction assumed or could not do. */
  readonly outlierRule: string;
  readonly notes: readonly string[];
  /** The constants in the form the next night's `carried` settings take. */
  readonly carry: NightConstants;
}
