import { apply } from '../math/mat3.ts';
import { toSpherical, type Vec3 } from '../math/vec3.ts';
import type { PlaceContext } from './place-context.ts';
import { observedFromTrueZenith, REFRACTION_HORIZON_RAD, refractionWarning } from './refraction.ts';
import { DEG } from '../units.ts';
import type { StarMotion } from './space-motion.ts';
import { starDirection } from './star-direction.ts';

/**
 * A star's place at one instant and site. Hour angles are positive west in (−π, π]; declinations
 * on the true equator of date with the site's own pole (polar motion applied). `observed*` include
 * refraction when the context has weather, else equal the `topocentric*` (geometric) values.
 * `apparentRaRad`/`apparentDecRad`: geocentric apparent place, true equator and equinox of date.
 */
export interface ObservedPlace {
  readonly observedHourAngleRad: number;
  readonly observedDeclinationRad: number;
  readonly observedZenithRad: number;
  readonly topocentricHourAngleRad: number;
  readonly topocentricDeclinationRad: number;
  readonly topocentricZenithRad: number;
  readonly apparentRaRad: number;
  readonly apparentDecRad: number;
  readonly warnings: readonly string[];
}

/**
 * The full model for one star: space motion, parallax, light deflection, aberration (annual +
 * diurnal), bias-precession-nutation, Earth rotation with polar motion, refraction. Accuracy
 * against ERFA's atco13/atci13 over 1900–2100: see unit/astrometry/observed-place.test.ts (the
 * test asserts < 3 mas; the Earth ephemeris limits it to ~1.3 mas).
 */
export function observedPlace(context: PlaceContext, motion: StarMotion): ObservedPlace {
  const topocentric = starDirection(
    motion, context.daysSinceJ2000, context.observerBarycentricAu,
    context.sunToObserverUnit, context.sunToObserverAu, context.observerBeta,
  ).apparent;
  const geocentric = starDirection(
    motion, context.daysSinceJ2000, context.geocentreBarycentricAu,
    context.sunToGeocentreUnit, context.sunToGeocentreAu, context.earthBeta,
  ).apparent;
  const apparent = toSpherical(apply(context.npb, geocentric));
  const local = apply(context.gcrsToLocal, topocentric);
  const warnings = [...context.warnings];
  const zenith = zenithDistance(local, context.latitudeRad);
  let observed = local;
  if (context.refraction !== null && zenith > REFRACTION_HORIZON_RAD) {
    warnings.push(`the star is at zenith distance ${(zenith / DEG).toFixed(2)}°, at or below the horizon: no refraction applied`);
  } else if (context.refraction !== null) {
    observed = refractInLocalFrame(local, context);
    const warning = refractionWarning(zenith);
    if (warning !== undefined) warnings.push(warning);
  }
  return {
    observedHourAngleRad: Math.atan2(-observed[1], observed[0]),
    observedDeclinationRad: Math.atan2(observed[2], Math.hypot(observed[0], observed[1])),
    observedZenithRad: zenithDistance(observed, context.latitudeRad),
    topocentricHourAngleRad: Math.atan2(-local[1], local[0]),
    topocentricDeclinationRad: Math.atan2(local[2], Math.hypot(local[0], local[1])),
    topocentricZenithRad: zenith,
    apparentRaRad: apparent.alphaRad,
    apparentDecRad: apparent.deltaRad,
    warnings,
  };
}

/** Zenith distance of a unit vector in the hour-angle frame; zenith = (cos φ, 0, sin φ). */
export function zenithDistance(local: Vec3, latitudeRad: number): number {
  const cosZ = local[0] * Math.cos(latitudeRad) + local[2] * Math.sin(latitudeRad);
  const sinZ = Math.hypot(local[0] * Math.sin(latitudeRad) - local[2] * Math.cos(latitudeRad), local[1]);
  return Math.atan2(sinZ, cosZ);
}

/**
 * Moves a unit vector in the hour-angle frame toward the zenith by the refraction at its zenith
 * distance (vertical plane kept): p_obs = ẑ cos Z + (p − ẑ cos Z₀)·sin Z / sin Z₀.
 */
export function refractInLocalFrame(local: Vec3, context: PlaceContext): Vec3 {
  if (context.refraction === null) return local;
  const cosLat = Math.cos(context.latitudeRad), sinLat = Math.sin(context.latitudeRad);
  const trueZenith = zenithDistance(local, context.latitudeRad);
  const observedZenith = observedFromTrueZenith(trueZenith, context.refraction);
  const sinTrue = Math.sin(trueZenith);
  const ratio = sinTrue < 1e-12 ? 1 / (1 + context.refraction.aRad) : Math.sin(observedZenith) / sinTrue;
  const cosTrue = Math.cos(trueZenith), cosObserved = Math.cos(observedZenith);
  return [
    cosLat * cosObserved + (local[0] - cosLat * cosTrue) * ratio,
    local[1] * ratio,
    sinLat * cosObserved + (local[2] - sinLat * cosTrue) * ratio,
  ];
}

