import { ARCSEC } from '../units.ts';

/** Talcott-level readings at one pointing: bubble ends counted from the middle outward (div). */
export interface TalcottLevelReading {
  readonly northDiv: number;
  readonly southDiv: number;
}

/** One Horrebow–Talcott pair, both stars at upper culmination, one south and one north of the zenith. */
export interface TalcottPair {
  /** Apparent declinations of date (rad). */
  readonly southDeclinationRad: number;
  readonly northDeclinationRad: number;
  /** Micrometer readings (turns) on the south and the north star. */
  readonly southMicrometerTurns: number;
  readonly northMicrometerTurns: number;
  /** Micrometer value (rad per turn) and sense: +1 when readings increase with zenith distance. */
  readonly micrometerRadPerTurn: number;
  readonly micrometerSense: 1 | -1;
  readonly southLevel: TalcottLevelReading;
  readonly northLevel: TalcottLevelReading;
  /** Value of one division of the Talcott level (arcsec). */
  readonly levelDivisionArcsec: number;
  /** Refraction (rad, ≥ 0) at each star's zenith distance, from core/astrometry. */
  readonly southRefractionRad: number;
  readonly northRefractionRad: number;
}

/** The latitude and its terms (all rad), so a notebook's columns can be compared one by one. */
export interface TalcottLatitude {
  readonly latitudeRad: number;
  readonly halfSumDeclinationsRad: number;
  readonly micrometerTermRad: number;
  readonly levelTermRad: number;
  readonly refractionTermRad: number;
}

/**
 * Latitude from a Horrebow–Talcott pair (upper culmination; the small off-meridian reduction
 * and curvature are not included):
 * φ = ½(δ_S + δ_N) + ½·sense·R·(M_S − M_N) + (d/4)[(n_S + n_N) − (s_S + s_N)] + ½(r_S − r_N).
 * It follows from δ_S = φ − z_S and δ_N = φ + z_N, with the micrometer measuring the difference of
 * zenith distances relative to the tube and the level measuring the tube's tilt between the two
 * pointings (n, s: north and south end readings). Source: the standard zenith-telescope reduction
 * (US Coast and Geodetic Survey special publications on latitude determination; Chauvenet,
 * vol. II, Talcott's method) — the arrangement of terms here is from memory and re-derived.
 */
export function horrebowTalcottLatitude(pair: TalcottPair): TalcottLatitude {
  const numbers = Object.entries(pair).flatMap(([key, value]) => (typeof value === 'number' ? [[key, value] as const] : []));
  for (const [key, value] of numbers) {
    if (!Number.isFinite(value)) throw new RangeError(`horrebowTalcottLatitude: ${key} = ${value} is not a finite number`);
  }
  if (pair.southRefractionRad < 0 || pair.northRefractionRad < 0) throw new RangeError('horrebowTalcottLatitude: refraction must be ≥ 0 for both stars');
  const halfSumDeclinationsRad = (pair.southDeclinationRad + pair.northDeclinationRad) / 2;
  const micrometerTermRad = (pair.micrometerSense * pair.micrometerRadPerTurn * (pair.southMicrometerTurns - pair.northMicrometerTurns)) / 2;
  const levelDiv = pair.southLevel.northDiv + pair.northLevel.northDiv - (pair.southLevel.southDiv + pair.northLevel.southDiv);
  const levelTermRad = ((pair.levelDivisionArcsec * levelDiv) / 4) * ARCSEC;
  const refractionTermRad = (pair.southRefractionRad - pair.northRefractionRad) / 2;
  return {
    latitudeRad: halfSumDeclinationsRad + micrometerTermRad + levelTermRad + refractionTermRad,
    halfSumDeclinationsRad,
    micrometerTermRad,
    levelTermRad,
    refractionTermRad,
  };
}
