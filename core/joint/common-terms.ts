import type { JointObservation } from './joint-observations.ts';

/** Earth's rotation rate (rad/s; IERS Conventions 2010, Table 1.1), equatorial radius and flattening (WGS84), speed of light (m/s). */
const EARTH_ROTATION_RAD_S = 7.292115e-5;
const WGS84_A_M = 6378137;
const WGS84_F = 1 / 298.257223563;
const LIGHT_M_S = 299792458;
const MAS_PER_RAD = 180 / Math.PI * 3_600_000;

/**
 * Diurnal aberration on the sky at the meridian (mas): v/c of the observer's rotation velocity,
 * ω·ρ cos φ′·a / c, ≈ 320 mas × cos φ (0.3200″ at the equator; e.g. Explanatory Supplement to the
 * Astronomical Almanac, 1992, §3.26, from memory). It displaces every star toward the east point:
 * at upper culmination +Δα·cos δ, at lower culmination −Δα·cos δ; nothing in δ on the meridian.
 * latitudeRad geodetic, heightM above the ellipsoid; accuracy 0.01 mas (geocentric ρ cos φ′ from WGS84).
 */
export function diurnalAberrationMas(latitudeRad: number, heightM: number): number {
  const c = 1 / Math.sqrt(Math.cos(latitudeRad) ** 2 + (1 - WGS84_F) ** 2 * Math.sin(latitudeRad) ** 2);
  const rhoCosPhi = (c + heightM / WGS84_A_M) * Math.cos(latitudeRad);
  return (EARTH_ROTATION_RAD_S * WGS84_A_M * rhoCosPhi / LIGHT_M_S) * MAS_PER_RAD;
}

/** ∂(α cos δ)/∂(diurnal-aberration scale) of one transit, mas per unit of scale (sign as diurnalAberrationMas says). */
export function diurnalPartialMas(o: JointObservation, diurnalMas: number): number {
  return o.culmination === 'upper' ? diurnalMas : -diurnalMas;
}

/**
 * ∂z/∂φ of one transit: z = φ − δ (upper, south of the zenith), δ − φ (upper, north), 180° − φ − δ
 * (lower), so +1, −1, −1; with ∂z/∂δ (zenithPerDec) −1, +1, −1 that is −∂z/∂δ at upper culmination
 * and +∂z/∂δ at lower (spherical geometry on the meridian, common practice).
 */
export function zenithPerLatitude(o: JointObservation): number {
  return o.culmination === 'upper' ? -o.zenithPerDec : o.zenithPerDec;
}

/** Phase 2π·t/P of TT days since J2000.0 for each period (days): the latitude-variation columns are cos and sin of it. */
export function latitudePhases(ttDaysSinceJ2000: number, periodsDays: readonly number[]): number[] {
  return periodsDays.map((p) => (2 * Math.PI * ttDaysSinceJ2000) / p);
}

/**
 * Whether the diurnal-aberration scale can be told from collimation, and why not in words. In right
 * ascension both are a constant shift on the sky that changes sign at lower culmination (Mayer's
 * C = sec δ becomes sec(180° − δ)), so upper and lower culminations do not separate them; the
 * collimation changes sign with the clamp and the aberration does not, so only a collimation
 * group (night or segment) observed in both clamp positions does. Held at the nightly reduction's
 * values (fixed or absent), collimation has already absorbed the scale's signal night by night.
 */
export function diurnalSeparability(observations: readonly JointObservation[], collimationFree: boolean, groupOf: (o: JointObservation) => number): { separable: boolean; reason: string } {
  const lower = observations.some((o) => o.culmination === 'lower');
  const culminations = lower ? 'lower culminations do not help, as both terms change sign there' : 'no lower culminations (and they would not help, as both terms change sign there)';
  if (!collimationFree) return { separable: false, reason: `diurnal-aberration scale: collimation is held at the nightly values, which already absorb it, so it cannot be told from collimation; ${culminations}` };
  const clampSign = new Map<number, number>();
  for (const o of observations) {
    const sign = Math.sign(o.mayerC) * (o.culmination === 'upper' ? 1 : -1);
    const group = groupOf(o), seen = clampSign.get(group);
    if (seen !== undefined && seen !== sign) return { separable: true, reason: '' };
    clampSign.set(group, sign);
  }
  return { separable: false, reason: `diurnal-aberration scale: ${culminations}, and no night or collimation segment is observed in both clamp positions, so it cannot be told from collimation` };
}
