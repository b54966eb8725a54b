import type { PlaceContext } from './place-context.ts';

/**
 * The per-instant numbers the reduction kernel reads, packed in one Float64Array so the batch
 * path can refill it per transit without allocating. Offsets (units):
 * 0–2 observer barycentric position (au, ICRS) · 3–5 observer velocity / c · 6–8 Earth's
 * barycentric velocity / c (the part κ scales) · 9–11 unit vector Sun → observer · 12 Sun–observer
 * distance (au) · 13 √(1 − β²) · 14–22 GCRS → hour-angle frame matrix (row-major) · 23 cos φ ·
 * 24 sin φ · 25 refraction A (rad) · 26 refraction B (rad) · 27 1 if refraction applies else 0 ·
 * 28 TT days since J2000.0.
 */
export const FRAME_LENGTH = 29;
export const F_OBSERVER = 0;
export const F_BETA = 3;
export const F_EARTH_BETA = 6;
export const F_SUN_UNIT = 9;
export const F_SUN_DISTANCE = 12;
export const F_INVERSE_GAMMA = 13;
export const F_MATRIX = 14;
export const F_COS_LAT = 23;
export const F_SIN_LAT = 24;
export const F_REFRACTION_A = 25;
export const F_REFRACTION_B = 26;
export const F_HAS_REFRACTION = 27;
export const F_DAYS = 28;

/** Packs a `PlaceContext` into an instant frame (topocentric observer). */
export function frameFromContext(context: PlaceContext, out = new Float64Array(FRAME_LENGTH)): Float64Array {
  out.set(context.observerBarycentricAu, F_OBSERVER);
  out.set(context.observerBeta, F_BETA);
  out.set(context.earthBeta, F_EARTH_BETA);
  out.set(context.sunToObserverUnit, F_SUN_UNIT);
  out[F_SUN_DISTANCE] = context.sunToObserverAu;
  const b = context.observerBeta;
  out[F_INVERSE_GAMMA] = Math.sqrt(1 - (b[0] * b[0] + b[1] * b[1] + b[2] * b[2]));
  out.set(context.gcrsToLocal, F_MATRIX);
  out[F_COS_LAT] = Math.cos(context.latitudeRad);
  out[F_SIN_LAT] = Math.sin(context.latitudeRad);
  out[F_REFRACTION_A] = context.refraction?.aRad ?? 0;
  out[F_REFRACTION_B] = context.refraction?.bRad ?? 0;
  out[F_HAS_REFRACTION] = context.refraction === null ? 0 : 1;
  out[F_DAYS] = context.daysSinceJ2000;
  return out;
}
