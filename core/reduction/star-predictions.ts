import { iauEarthOrientation } from '../astrometry/iau-earth-orientation.ts';
import { createNightContext, type NightContext } from '../astrometry/night-context.ts';
import { PlanetaryNutationGrid } from '../earth/planetary-nutation-grid.ts';
import { observedPlace, type ObservedPlace } from '../astrometry/observed-place.ts';
import { placeContext } from '../astrometry/place-context.ts';
import { prepareStars } from '../astrometry/prepared-stars.ts';
import { reduceNight } from '../astrometry/reduce-night.ts';
import { R_HOUR_ANGLE, RESULT_STRIDE } from '../astrometry/reduction-kernel.ts';
import type { Site } from '../astrometry/site.ts';
import { starMotion } from '../astrometry/space-motion.ts';
import type { StarMotion } from '../astrometry/space-motion.ts';
import type { CatalogueStar } from '../astrometry/star.ts';
import { predictTransit } from '../astrometry/transit.ts';
import type { InstantFromUtc } from '../astrometry/transit.ts';
import type { StarListRow } from '../formats/star-list.ts';
import type { Culmination } from '../instrument/culmination.ts';
import { DEG, SECONDS_PER_DAY } from '../units.ts';
import { NightSlowTerms } from './night-slow-terms.ts';

/**
 * The slow planetary nutation terms shared by every night's batch context (< 1 µas from the full
 * series, core/earth/planetary-nutation-grid.ts): their nodes are computed once per process, not per night.
 */
const SHARED_PLANETARY_NUTATION = new PlanetaryNutationGrid();

/** Half a sidereal day in UT1 seconds: the search window on either side of a rough time. */
const HALF_SIDEREAL_DAY_S = 43_082.045;
/** Rate of a fixed star's hour angle per UT1 second (IERS Conventions 2010 eq. 5.15). */
const HOUR_ANGLE_RATE_RAD_PER_S = (2 * Math.PI * 1.00273781191135448) / SECONDS_PER_DAY;
/**
 * The night context's transit is accepted when the full model's hour angle there is within this
 * of the meridian (1e-8 rad = 2 mas = 0.14 ms of time; the context is good to 0.2 mas,
 * night-context.ts); otherwise the full per-instant search (predictTransit) runs instead.
 */
const ACCEPT_HOUR_ANGLE_RAD = 1e-8;

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
 * The transit instant is found on the night's batch context (night-context.ts: Earth state and
 * orientation once per night, centred on local midnight, the reduction kernel per step) and the place evaluated once
 * with the full model there, its nutation and Earth state interpolated over that day
 * (night-slow-terms.ts, < 1 µas) while precession, Earth rotation, UT1 and polar motion are taken
 * at the instant itself: those two slow terms were four fifths of the per-transit cost; when the full model's hour angle there is off the meridian by more than 2 mas the
 * full search runs instead, so the result is predictTransit's to 0.14 ms of time.
 */
export class NightPredictions {
  private readonly cache = new Map<string, StarPrediction>();
  private readonly motions = new Map<string, StarMotion>();
  private readonly packed = new Map<string, Float64Array>();
  /** Batch contexts and slow terms by day, centred on local mean midnight (±0.5 day served). */
  private readonly contexts = new Map<number, { context: NightContext; slow: NightSlowTerms }>();
  private readonly starIndex = new Int32Array(1);
  private readonly tt = new Float64Array(1);
  private readonly out = new Float64Array(RESULT_STRIDE);
  /** How many predictions needed the full per-instant search (the batch context's transit was refused). */
  fullSearchCount = 0;

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
    const quick = this.quickTransit(star, motion, culmination, roughUtcS);
    let prediction: StarPrediction;
    if (quick !== null) {
      prediction = { ...placeFields(quick.place), utcS: quick.utcS, side: sideOfZenith(this.site.latitudeRad, quick.place), warnings: quick.warnings };
    } else {
      this.fullSearchCount++;
      const after = { jd1: 2_400_000.5 + this.nightDateMjd, jd2: (roughUtcS - HALF_SIDEREAL_DAY_S) / SECONDS_PER_DAY };
      const p = predictTransit(motion, this.site, null, after, culmination, this.instantFromUtc, iauEarthOrientation);
      const utcS = (p.utc.jd1 - 2_400_000.5 - this.nightDateMjd + p.utc.jd2) * SECONDS_PER_DAY;
      prediction = { ...placeFields(p.place), utcS, side: p.side, warnings: p.warnings };
    }
    this.cache.set(key, prediction);
    return prediction;
  }

  private ttDays(utcS: number): { days: number; instant: ReturnType<InstantFromUtc> } {
    const instant = this.instantFromUtc({ jd1: 2_400_000.5 + this.nightDateMjd, jd2: utcS / SECONDS_PER_DAY });
    return { days: instant.tt.jd1 - 2_451_545 + instant.tt.jd2, instant };
  }

  /**
   * The context serving `utcS`: one per day centred on the site's local mean midnight (UTC seconds
   * 86400 − longitude·240 of the night's date), so that the whole night (local noon to noon) shares
   * one context and one set of slow terms instead of two half-day ones.
   */
  private contextFor(utcS: number): { context: NightContext; slow: NightSlowTerms } {
    const midnightS = SECONDS_PER_DAY - (this.site.longitudeRad / (2 * Math.PI)) * SECONDS_PER_DAY;
    const bucket = Math.round((utcS - midnightS) / SECONDS_PER_DAY);
    let entry = this.contexts.get(bucket);
    if (entry === undefined) {
      const centreUtc = { jd1: 2_400_000.5 + this.nightDateMjd, jd2: (midnightS + bucket * SECONDS_PER_DAY) / SECONDS_PER_DAY };
      const centre = this.instantFromUtc(centreUtc);
      // UTC − TT is constant within the context's day but across a leap second, where the full-model check below catches any error.
      const utcOf = (tt: { jd1: number; jd2: number }) => ({ jd1: centreUtc.jd1, jd2: centreUtc.jd2 + (tt.jd1 - centre.tt.jd1) + (tt.jd2 - centre.tt.jd2) });
      const context = createNightContext({ centreTt: centre.tt, halfWidthDays: 0.5, site: this.site, weather: null, instantFromTt: (tt) => this.instantFromUtc(utcOf(tt)), planetaryNutation: SHARED_PLANETARY_NUTATION });
      entry = { context, slow: new NightSlowTerms(centre.tt, 0.5) };
      this.contexts.set(bucket, entry);
    }
    return entry;
  }

  /** Newton on the batch context's hour angle, then one full-model place; null when that place is off the meridian by more than ACCEPT_HOUR_ANGLE_RAD. */
  private quickTransit(star: StarListRow, motion: StarMotion, culmination: Culmination, roughUtcS: number): { utcS: number; place: ObservedPlace; warnings: string[] } | null {
    let packed = this.packed.get(star.id);
    if (packed === undefined) { packed = prepareStars([catalogueStarOf(star)]); this.packed.set(star.id, packed); }
    const target = culmination === 'upper' ? 0 : Math.PI;
    const { context, slow } = this.contextFor(roughUtcS);
    let utcS = roughUtcS;
    // TT − UTC from one time-scale lookup serves the Newton steps (constant but across a leap
    // second, where the full-model check below refuses the result).
    const ttMinusUtcDays = this.ttDays(roughUtcS).days - (this.nightDateMjd + 2_400_000.5 - 2_451_545 + roughUtcS / SECONDS_PER_DAY);
    for (let i = 0; i < 6; i++) {
      this.tt[0] = this.nightDateMjd + 2_400_000.5 - 2_451_545 + utcS / SECONDS_PER_DAY + ttMinusUtcDays;
      if (Math.abs(this.tt[0] - context.centreDaysSinceJ2000) > context.halfWidthDays) return null;
      reduceNight(context, packed, this.starIndex, this.tt, this.out);
      const stepS = wrapToPi(this.out[R_HOUR_ANGLE] - target) / HOUR_ANGLE_RATE_RAD_PER_S;
      utcS -= stepS;
      if (Math.abs(stepS) < 1e-5) break;
    }
    const { days, instant } = this.ttDays(utcS);
    if (!slow.covers(instant.tt)) return null;
    const { nutation, earth } = slow.at(instant.tt);
    const place = observedPlace(placeContext(days, earth, iauEarthOrientation(instant, nutation, slow.complementaryTermsRad), this.site, null), motion);
    if (Math.abs(wrapToPi(place.topocentricHourAngleRad - target)) > ACCEPT_HOUR_ANGLE_RAD) return null;
    return { utcS, place, warnings: [...(instant.warnings ?? []), ...place.warnings] };
  }
}

function placeFields(place: ObservedPlace): Pick<StarPrediction, 'apparentRaRad' | 'apparentDecRad' | 'topocentricDecRad' | 'zenithDistanceRad'> {
  return { apparentRaRad: place.apparentRaRad, apparentDecRad: place.apparentDecRad, topocentricDecRad: place.topocentricDeclinationRad, zenithDistanceRad: place.topocentricZenithRad };
}

/** North or south of the zenith from the observed declination against the latitude (as predictTransit decides it, transit.ts). */
function sideOfZenith(latitudeRad: number, place: ObservedPlace): 'north' | 'south' {
  const x = Math.cos(place.observedDeclinationRad) * Math.cos(place.observedHourAngleRad), z = Math.sin(place.observedDeclinationRad);
  return -x * Math.sin(latitudeRad) + z * Math.cos(latitudeRad) >= 0 ? 'north' : 'south';
}

function wrapToPi(angle: number): number {
  return Math.atan2(Math.sin(angle), Math.cos(angle));
}
