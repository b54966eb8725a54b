import { iauEarthOrientation } from '../astrometry/iau-earth-orientation.ts';
import type { Site } from '../astrometry/site.ts';
import { starMotion } from '../astrometry/space-motion.ts';
import type { StarMotion } from '../astrometry/space-motion.ts';
import type { CatalogueStar } from '../astrometry/star.ts';
import { predictTransit } from '../astrometry/transit.ts';
import type { InstantFromUtc } from '../astrometry/transit.ts';
import type { StarListRow } from '../formats/star-list.ts';
import type { Culmination } from '../instrument/culmination.ts';
import { DEG, SECONDS_PER_DAY } from '../units.ts';

/** Half a sidereal day in UT1 seconds: the search window on either side of a rough time. */
const HALF_SIDEREAL_DAY_S = 43_082.045;

/** A predicted meridian passage of one star, in the night's own time count. */
export interface StarPrediction {
  /** UTC of the passage, seconds from 0 h UTC of the night's date. */
  readonly utcS: number;
  /** Apparent (geocentric, true equator and equinox of date) right ascension and declination, rad. */
  readonly apparentRaRad: number;
  readonly apparentDecRad: number;
  /** Declination on the site's equator of date as seen from the site (diurnal aberration included), rad. */
  readonly topocentricDecRad: number;
  /** Geometric (unrefracted) meridian zenith distance, rad, ≥ 0, and the side of the zenith. */
  readonly zenithDistanceRad: number;
  readonly side: 'north' | 'south';
  readonly warnings: readonly string[];
}

/** The catalogue star of a star-list row (unknown proper motion and parallax enter as 0, as the list means "unknown"). */
export function catalogueStarOf(row: StarListRow): CatalogueStar {
  return {
    raRad: row.raDeg * DEG, decRad: row.decDeg * DEG, pmRaCosDecMasYr: row.pmRaCosDecMasYr ?? 0, pmDecMasYr: row.pmDecMasYr ?? 0,
    parallaxMas: row.parallaxMas ?? 0, radialVelocityKmS: row.radialVelocityKmS ?? 0, epochJulianYear: row.epochJyear,
  };
}

/**
 * Predicts meridian passages for one night with core/astrometry's full model (predictTransit:
 * space motion, parallax, deflection, annual AND diurnal aberration, IAU 2006/2000A, polar motion;
 * 3 mas against ERFA), geometric, caching one per star, culmination and rough time so a star is
 * computed once per night. Refraction is applied by the reduction per observation, not here.
 */
export class NightPredictions {
  private readonly cache = new Map<string, StarPrediction>();
  private readonly motions = new Map<string, StarMotion>();

  constructor(
    private readonly site: Site,
    private readonly nightDateMjd: number,
    private readonly instantFromUtc: InstantFromUtc,
  ) {}

  /** The passage of `star` nearest `roughUtcS` (s from 0 h UTC of the night's date). */
  nearest(star: StarListRow, culmination: Culmination, roughUtcS: number): StarPrediction {
    const key = `${star.id}\u0000${culmination}\u0000${Math.round(roughUtcS / 3600)}`;
    const cached = this.cache.get(key);
    if (cached !== undefined) return cached;
    let motion = this.motions.get(star.id);
    if (motion === undefined) {
      motion = starMotion(catalogueStarOf(star));
      this.motions.set(star.id, motion);
    }
    const after = { jd1: 2_400_000.5 + this.nightDateMjd, jd2: (roughUtcS - HALF_SIDEREAL_DAY_S) / SECONDS_PER_DAY };
    const p = predictTransit(motion, this.site, null, after, culmination, this.instantFromUtc, iauEarthOrientation);
    const utcS = (p.utc.jd1 - 2_400_000.5 - this.nightDateMjd + p.utc.jd2) * SECONDS_PER_DAY;
    const prediction: StarPrediction = {
      utcS, apparentRaRad: p.place.apparentRaRad, apparentDecRad: p.place.apparentDecRad, topocentricDecRad: p.place.topocentricDeclinationRad,
      zenithDistanceRad: p.place.topocentricZenithRad, side: p.side, warnings: p.warnings,
    };
    this.cache.set(key, prediction);
    return prediction;
  }
}
