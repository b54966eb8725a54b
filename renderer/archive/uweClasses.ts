import type { NightQuality } from './nightQuality.ts';

/**
 * Upper limits of the unit-weight-error classes of the nights overview: below 1.2 (as precise as
 * stated, allowing for the scatter of a night's few dozen residuals), 1.2–2, 2–5, 5 and above.
 * The limits are a choice of this view (common practice: a UWE near 1 means the stated precision
 * holds), not from a published source.
 */
export const UWE_CLASS_LIMITS = [1.2, 2, 5] as const;

/** Class index 0…3 by UWE, or 'not-reduced' (refused, or no redundancy to estimate a UWE). */
export type UweClass = 0 | 1 | 2 | 3 | 'not-reduced';

/** The legend's words for each class, with the limits stated. */
export const UWE_CLASS_LABELS: Readonly<Record<string, string>> = {
  0: `below ${UWE_CLASS_LIMITS[0]}`,
  1: `${UWE_CLASS_LIMITS[0]} to ${UWE_CLASS_LIMITS[1]}`,
  2: `${UWE_CLASS_LIMITS[1]} to ${UWE_CLASS_LIMITS[2]}`,
  3: `${UWE_CLASS_LIMITS[2]} and above`,
  'not-reduced': 'not reduced',
};

/**
 * The class of a unit-weight error: a value equal to a limit goes to the class above (1.2 → class
 * 1). Throws for a negative or NaN value, which no least-squares fit can give: painting it as
 * "good" would hide a broken reduction.
 */
export function uweClass(unitWeightError: number | null): UweClass {
  if (unitWeightError === null) return 'not-reduced';
  if (!(unitWeightError >= 0)) throw new RangeError(`uweClass: unit-weight error ${unitWeightError} is negative or not a number; the nightly reduction is broken for this night — reduce it from the CLI (meridian-ledger night) to see why.`);
  const index = UWE_CLASS_LIMITS.findIndex((limit) => unitWeightError < limit);
  return (index < 0 ? 3 : index) as UweClass;
}

/** The class of a night's quality; a night with no quality yet (still computing) is 'not-reduced'. */
export function nightUweClass(quality: NightQuality | undefined): UweClass {
  if (quality === undefined || !quality.reduced) return 'not-reduced';
  return uweClass(quality.unitWeightError);
}

/** "UWE 1.34" / "not reduced: reason" for labels. */
export function describeQuality(quality: NightQuality | undefined): string {
  if (quality === undefined) return 'unit-weight error not computed yet';
  if (!quality.reduced) return `not reduced: ${quality.failure ?? 'no reason given'}`;
  if (quality.unitWeightError === null) return 'not reduced: too few transits for a unit-weight error';
  return `unit-weight error ${quality.unitWeightError.toFixed(2)}`;
}
