import type { Culmination } from './culmination.ts';

/** Which side of the zenith the star passes the meridian. */
export type MeridianSide = 'north' | 'south';

/**
 * Zenith-distance scale of an instrument: a micrometer (turns) or a detector (pixels).
 * z_observed = zeroPointRad + sense·scaleRadPerUnit·reading; `sense` is +1 when readings increase
 * with zenith distance. The zero point is the zenith distance of reading 0 for the current
 * setting (it drifts; the solver fits it per night or segment).
 */
export interface ZenithScale {
  readonly zeroPointRad: number;
  readonly scaleRadPerUnit: number;
  readonly sense: 1 | -1;
}

/** Observed zenith distance (rad) from a micrometer or pixel reading; see ZenithScale. */
export function zenithDistanceFromReading(reading: number, scale: ZenithScale): number {
  if (!Number.isFinite(reading)) throw new RangeError(`zenithDistanceFromReading: reading ${reading} is not a finite number of turns or pixels`);
  return scale.zeroPointRad + scale.sense * scale.scaleRadPerUnit * reading;
}

/** Observed zenith distance (rad) from a circle reading and the circle's zenith-point reading. */
export function zenithDistanceFromCircle(circleReadingRad: number, zenithPointRad: number, sense: 1 | -1): number {
  return sense * (circleReadingRad - zenithPointRad);
}

/**
 * Zenith distance in vacuo (rad): z = z_observed + f·sin z_observed + R, with `flexureRad` f the
 * horizontal flexure (positive when the tube's sag makes observed zenith distances too small) and
 * `refractionRad` R ≥ 0 the refraction for this star from core/astrometry (refraction lifts a
 * star, so the true zenith distance is larger). Source: the classical reduction of meridian
 * zenith distances (Smart, Text-Book on Spherical Astronomy, meridian circle); sign of f ours.
 */
export function trueZenithDistanceRad(observedRad: number, flexureRad: number, refractionRad: number): number {
  if (!(refractionRad >= 0)) throw new RangeError(`trueZenithDistanceRad: refraction ${refractionRad} rad must be ≥ 0 (it always lifts the star)`);
  return observedRad + flexureRad * Math.sin(observedRad) + refractionRad;
}

/**
 * Declination (rad) from a meridian zenith distance z ≥ 0 (rad) at latitude φ (rad):
 * upper culmination south of the zenith δ = φ − z; north of the zenith δ = φ + z;
 * lower culmination (below the pole) δ = 180° − φ − z on the north side (φ > 0) and
 * δ = −180° − φ + z on the south side (φ < 0). Exact. Throws when the combination gives |δ| > 90°,
 * which means the side or culmination is wrong.
 */
export function declinationFromZenithDistance(zenithDistanceRad: number, latitudeRad: number, culmination: Culmination, side: MeridianSide): number {
  if (!(zenithDistanceRad >= 0 && zenithDistanceRad <= Math.PI)) {
    throw new RangeError(`declinationFromZenithDistance: zenith distance ${zenithDistanceRad} rad must lie in [0, π]`);
  }
  let declination: number;
  if (culmination === 'upper') declination = side === 'south' ? latitudeRad - zenithDistanceRad : latitudeRad + zenithDistanceRad;
  else declination = side === 'north' ? Math.PI - latitudeRad - zenithDistanceRad : -Math.PI - latitudeRad + zenithDistanceRad;
  if (Math.abs(declination) > Math.PI / 2 + 1e-12) {
    throw new RangeError(
      `declinationFromZenithDistance: z = ${zenithDistanceRad} rad, φ = ${latitudeRad} rad, ${culmination} culmination on the ${side} side gives |δ| > 90°; check the side of the zenith and the culmination`,
    );
  }
  return declination;
}

/** Inverse of declinationFromZenithDistance: meridian zenith distance (rad) and side of a star. */
export function meridianZenithDistance(declinationRad: number, latitudeRad: number, culmination: Culmination): { zenithDistanceRad: number; side: MeridianSide } {
  if (culmination === 'upper') {
    const z = latitudeRad - declinationRad;
    return z >= 0 ? { zenithDistanceRad: z, side: 'south' } : { zenithDistanceRad: -z, side: 'north' };
  }
  return latitudeRad >= 0
    ? { zenithDistanceRad: Math.PI - latitudeRad - declinationRad, side: 'north' }
    : { zenithDistanceRad: Math.PI + latitudeRad + declinationRad, side: 'south' };
}
