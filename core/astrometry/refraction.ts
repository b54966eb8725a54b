import type { RefractionConstants } from './refraction-constants.ts';
import { DEG } from '../units.ts';

/** Beyond this zenith distance the A tan Z + B tan³ Z form loses accuracy quickly (0.6″ at 80°). */
export const REFRACTION_MODEL_LIMIT_RAD = 75 * DEG;
/** The model is not defined at or below the horizon (tan Z diverges): refraction stops here. */
export const REFRACTION_HORIZON_RAD = 89.5 * DEG;

/**
 * Refraction ΔZ (radians, positive: the star appears higher) at observed zenith distance
 * `observedZenithRad`: ΔZ = A tan Z + B tan³ Z (Green 1987, eq. 4.31). The vacuum zenith distance
 * is Z + ΔZ. Throws beyond 89.5°, where the form is meaningless; `refractionWarning` tells the
 * caller when Z exceeds the 75° limit of validity.
 */
export function refractionAtObserved(observedZenithRad: number, constants: RefractionConstants): number {
  checkZenith(observedZenithRad, 'observedZenithRad');
  const tanZ = Math.tan(observedZenithRad);
  return (constants.aRad + constants.bRad * tanZ * tanZ) * tanZ;
}

/**
 * Observed → vacuum ("true", topocentric) zenith distance: Z + A tan Z + B tan³ Z, exact for the model.
 */
export function trueFromObservedZenith(observedZenithRad: number, constants: RefractionConstants): number {
  return observedZenithRad + refractionAtObserved(observedZenithRad, constants);
}

/**
 * Vacuum ("true", topocentric) → observed zenith distance: solves Z + A tan Z + B tan³ Z = Z₀ for Z
 * by Newton iteration until the step is below 1e-14 rad, so the round trip with
 * `trueFromObservedZenith` closes to ≪ 1 µas. Throws if Z₀ is beyond 89.5°.
 */
export function observedFromTrueZenith(trueZenithRad: number, constants: RefractionConstants): number {
  checkZenith(trueZenithRad, 'trueZenithRad');
  let z = trueZenithRad;
  for (let iteration = 0; iteration < 20; iteration++) {
    const tanZ = Math.tan(z);
    const tan2 = tanZ * tanZ;
    const residual = z + (constants.aRad + constants.bRad * tan2) * tanZ - trueZenithRad;
    const derivative = 1 + (constants.aRad + 3 * constants.bRad * tan2) * (1 + tan2);
    const step = residual / derivative;
    z -= step;
    if (Math.abs(step) < 1e-14) return z;
  }
  throw new RangeError(`observedFromTrueZenith: no convergence at trueZenithRad ${trueZenithRad}; check the refraction constants`);
}

/** A warning text when `zenithRad` is past the model's 75° limit of validity, else undefined. */
export function refractionWarning(zenithRad: number): string | undefined {
  if (zenithRad <= REFRACTION_MODEL_LIMIT_RAD) return undefined;
  return `zenith distance ${(zenithRad / DEG).toFixed(2)}° exceeds 75°, beyond which the A tan Z + B tan³ Z refraction model errs by more than 0.1″`;
}

function checkZenith(zenithRad: number, name: string): void {
  if (!Number.isFinite(zenithRad) || zenithRad < 0 || zenithRad > REFRACTION_HORIZON_RAD) {
    throw new RangeError(`refraction: ${name} must lie in 0–89.5° (got ${zenithRad / DEG}°); the A tan Z + B tan³ Z model has no meaning at the horizon`);
  }
}
