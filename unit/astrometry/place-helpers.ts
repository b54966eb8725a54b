// Converts fixture records (degrees, catalogue units) into the core/astrometry types.
import type { Mat3 } from '../../core/math/mat3.ts';
import type { EarthOrientation } from '../../core/astrometry/earth-orientation.ts';
import type { Site } from '../../core/astrometry/site.ts';
import type { CatalogueStar } from '../../core/astrometry/star.ts';
import { DEG } from '../../core/units.ts';
import type { FixtureSite, FixtureStar } from './erfa-place-fixture.ts';

export function toStar(s: FixtureStar): CatalogueStar {
  return {
    raRad: s.raDeg * DEG, decRad: s.decDeg * DEG, pmRaCosDecMasYr: s.pmRaMasYr, pmDecMasYr: s.pmDecMasYr,
    parallaxMas: s.parallaxMas, radialVelocityKmS: s.rvKmS, epochJulianYear: s.epochJyear,
  };
}

export function toSite(s: FixtureSite): Site {
  return { latitudeRad: s.latDeg * DEG, longitudeRad: s.lonDeg * DEG, heightM: s.heightM };
}

export function toOrientation(o: { npb: number[]; gastRad: number; polarMotion: number[] }): EarthOrientation {
  return { npb: o.npb as unknown as Mat3, gastRad: o.gastRad, polarMotion: o.polarMotion as unknown as Mat3 };
}

/** Difference of two angles wrapped to (−π, π]. */
export function angleDifference(a: number, b: number): number {
  return Math.atan2(Math.sin(a - b), Math.cos(a - b));
}
