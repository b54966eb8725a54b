import { refractionAtObserved } from '../astrometry/refraction.ts';
import { refractionConstants } from '../astrometry/refraction-constants.ts';
import { trueZenithDistanceRad } from '../instrument/zenith-distance.ts';
import { ARCSEC } from '../units.ts';
import type { PreparedTransit } from './prepare-transits.ts';

/** One transit's zenith distance from reading to residual (rad). */
export interface ZenithSteps {
  /** z_obs = zero point + sense·scale·reading. */
  readonly observedRad: number;
  /** R from this transit's weather (its own, else the night's), 0 without weather. */
  readonly refractionRad: number;
  /** f·sin z_obs. */
  readonly flexureTermRad: number;
  /** z = z_obs + f sin z_obs + R (zenith-distance.ts trueZenithDistanceRad). */
  readonly trueRad: number;
  /** O − C in zenith distance: z − z_predicted (geometric). */
  readonly residualRad: number;
  /** O − C in declination (rad), from the side and culmination (sign below). */
  readonly declinationResidualRad: number;
}

/**
 * ∂δ/∂z on the meridian: δ = φ − z (upper, south), φ + z (upper, north), 180° − φ − z (lower,
 * north side), −180° − φ + z (lower, south side) — core/instrument/zenith-distance.ts.
 */
function declinationPerZenith(t: PreparedTransit): 1 | -1 {
  if (t.row.culmination === 'upper') return t.prediction.side === 'south' ? -1 : 1;
  return t.prediction.side === 'north' ? -1 : 1;
}

const constantsCache = new WeakMap<object, ReturnType<typeof refractionConstants>>();

/** Every step from the reading to the residual for zero point `zeroRad` and flexure `flexureRad`. */
export function zenithSteps(t: PreparedTransit, zeroRad: number, flexureRad: number): ZenithSteps | null {
  if (t.zenithFromReadingRad === null) return null;
  const observedRad = zeroRad + t.zenithFromReadingRad;
  // A star within a few arcsec of the zenith may read slightly negative before the zero point is fitted.
  if (!(Math.abs(observedRad) < Math.PI / 2)) {
    throw new RangeError(`row ${t.row.row}: the reading gives zenith distance ${(observedRad / ARCSEC / 3600).toFixed(3)}°, outside 0–90°; check the zero point (zenithZeroArcsec) and the scale`);
  }
  let refractionRad = 0;
  if (t.weather !== null) {
    let constants = constantsCache.get(t.weather);
    if (constants === undefined) {
      constants = refractionConstants(t.weather);
      constantsCache.set(t.weather, constants);
    }
    refractionRad = Math.sign(observedRad) * refractionAtObserved(Math.abs(observedRad), constants);
  }
  const trueRad = observedRad >= 0 ? trueZenithDistanceRad(observedRad, flexureRad, refractionRad) : observedRad + flexureRad * Math.sin(observedRad) + refractionRad;
  const residualRad = trueRad - t.prediction.zenithDistanceRad;
  return { observedRad, refractionRad, flexureTermRad: flexureRad * Math.sin(observedRad), trueRad, residualRad, declinationResidualRad: declinationPerZenith(t) * residualRad };
}

export interface ZenithSolution {
  readonly zeroRad: number;
  readonly zeroSigmaRad: number | null;
  readonly unitWeightErrorRad: number | null;
}

/**
 * The night's zenith zero point (free) or its held value, over `included` (transits with a
 * reading). With the zero free it is the weighted mean that makes Σ w·(O−C) = 0, found by three
 * fixed-point steps (refraction depends on z_obs, so ∂(O−C)/∂zero = 1 + O(A sec² z) ≈ 1 + 3e-4;
 * three steps leave < 1e-12 rad). Formal error √(Σw r²/(n−1)) / √Σw.
 */
export function fitZenithZero(transits: readonly PreparedTransit[], included: readonly number[], heldZeroRad: number | null, flexureRad: number): { fit: ZenithSolution; residuals: number[] } {
  let zero = heldZeroRad ?? 0;
  const totalWeight = included.reduce((s, k) => s + transits[k].weight, 0);
  if (heldZeroRad === null && included.length > 0) {
    for (let step = 0; step < 3; step++) {
      const mean = included.reduce((s, k) => s + transits[k].weight * zenithSteps(transits[k], zero, flexureRad)!.residualRad, 0) / totalWeight;
      zero -= mean;
    }
  }
  const residuals = transits.map((t) => zenithSteps(t, zero, flexureRad)?.residualRad ?? Number.NaN);
  const sum = included.reduce((s, k) => s + transits[k].weight * residuals[k] ** 2, 0);
  const redundancy = included.length - (heldZeroRad === null ? 1 : 0);
  const unitWeightErrorRad = redundancy > 0 ? Math.sqrt(sum / redundancy) : null;
  const zeroSigmaRad = heldZeroRad !== null || unitWeightErrorRad === null ? null : unitWeightErrorRad / Math.sqrt(totalWeight);
  return { fit: { zeroRad: zero, zeroSigmaRad, unitWeightErrorRad }, residuals };
}
