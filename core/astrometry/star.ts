import { DEG, MAS } from '../units.ts';

/**
 * A star as a catalogue gives it: ICRS right ascension and declination (radians) at the catalogue
 * epoch `epochJulianYear` (Julian year, TDB: 2000.0 = JD 2451545.0 TDB); proper motion in right
 * ascension as μα·cos δ and in declination (mas per Julian year, on the sky); parallax (mas;
 * zero or negative means "too distant to measure" and is treated as zero); radial velocity (km/s,
 * positive receding). Proper motions and radial velocity are the apparent rates a barycentric
 * observer sees, the usual catalogue convention.
 */
export interface CatalogueStar {
  readonly raRad: number;
  readonly decRad: number;
  readonly pmRaCosDecMasYr: number;
  readonly pmDecMasYr: number;
  readonly parallaxMas: number;
  readonly radialVelocityKmS: number;
  readonly epochJulianYear: number;
}

/** Throws a RangeError naming the first field that is not a usable number. */
export function checkCatalogueStar(star: CatalogueStar, where = 'star'): void {
  const fields: [keyof CatalogueStar, number][] = [
    ['raRad', star.raRad], ['decRad', star.decRad], ['pmRaCosDecMasYr', star.pmRaCosDecMasYr],
    ['pmDecMasYr', star.pmDecMasYr], ['parallaxMas', star.parallaxMas],
    ['radialVelocityKmS', star.radialVelocityKmS], ['epochJulianYear', star.epochJulianYear],
  ];
  for (const [name, value] of fields) {
    if (!Number.isFinite(value)) throw new RangeError(`${where}.${name} must be a finite number (got ${value})`);
  }
  if (Math.abs(star.decRad) > 90 * DEG) {
    throw new RangeError(`${where}.decRad ${star.decRad / DEG}° is beyond ±90°; give the declination in radians`);
  }
  if (Math.abs(star.pmRaCosDecMasYr) + Math.abs(star.pmDecMasYr) > 20 / (MAS / DEG)) {
    throw new RangeError(`${where}: proper motion above 20°/yr is not a star; give it in mas/yr`);
  }
}
