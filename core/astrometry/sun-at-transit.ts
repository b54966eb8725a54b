import { apply } from '../math/mat3.ts';
import type { Vec3 } from '../math/vec3.ts';
import { DEG } from '../units.ts';
import { aberrate } from './aberration.ts';
import { zenithDistance } from './observed-place.ts';
import type { PlaceContext } from './place-context.ts';

/**
 * The Sun seen from the site at one instant, for the daylight caution: its geometric altitude
 * (radians, no refraction; negative below the horizon) and its angular distance from the star
 * (radians). Sun direction from the observer's heliocentric position with aberration; the 8.3 min
 * light-time (20″) and refraction are left out: accurate to about 1′, ample for a caution.
 */
export interface SunAtTransit {
  readonly sunAltitudeRad: number;
  readonly starSunSeparationRad: number;
  /** Words for the user when the Sun is up and closer than the caution distance, else undefined. */
  readonly caution: string | undefined;
}

/** Default caution distance: a star transiting by day within this angle of the Sun is flagged. */
export const SUN_CAUTION_DISTANCE_RAD = 20 * DEG;

/**
 * Sun altitude and star–Sun distance at `context` for a star at topocentric hour angle and
 * declination (radians, the frame of `ObservedPlace.topocentric*`).
 */
export function sunAtTransit(
  context: PlaceContext,
  starHourAngleRad: number,
  starDeclinationRad: number,
  cautionDistanceRad = SUN_CAUTION_DISTANCE_RAD,
): SunAtTransit {
  const e = context.sunToObserverUnit;
  const sunLocal = apply(context.gcrsToLocal, aberrate([-e[0], -e[1], -e[2]], context.observerBeta));
  const cosDec = Math.cos(starDeclinationRad);
  const star: Vec3 = [cosDec * Math.cos(starHourAngleRad), -cosDec * Math.sin(starHourAngleRad), Math.sin(starDeclinationRad)];
  const cross = Math.hypot(
    star[1] * sunLocal[2] - star[2] * sunLocal[1],
    star[2] * sunLocal[0] - star[0] * sunLocal[2],
    star[0] * sunLocal[1] - star[1] * sunLocal[0],
  );
  const separation = Math.atan2(cross, star[0] * sunLocal[0] + star[1] * sunLocal[1] + star[2] * sunLocal[2]);
  const altitude = Math.PI / 2 - zenithDistance(sunLocal, context.latitudeRad);
  const caution = altitude > 0 && separation < cautionDistanceRad
    ? `this transit is in daylight ${(separation / DEG).toFixed(1)}° from the Sun (Sun altitude ${(altitude / DEG).toFixed(1)}°): ` +
      'never let sunlight into an unfiltered instrument or finder; keep the instrument capped or the shutter closed unless ' +
      'a proper solar filter is fitted, and follow your observatory\'s safety rules'
    : undefined;
  return { sunAltitudeRad: altitude, starSunSeparationRad: separation, caution };
}
