import { applyTranspose, type Mat3, multiply, rotationZ } from '../math/mat3.ts';
import type { Vec3 } from '../math/vec3.ts';
import { SECONDS_PER_DAY } from '../units.ts';
import { ASTRONOMICAL_UNIT_M, EARTH_ROTATION_RATE_RAD_PER_S, SPEED_OF_LIGHT_AU_PER_DAY } from './constants.ts';
import type { EarthOrientation } from './earth-orientation.ts';
import type { EarthState } from './earth-state.ts';
import { refractionConstants, type RefractionConstants } from './refraction-constants.ts';
import { checkSite, type Site, siteItrsPositionM } from './site.ts';
import type { Weather } from './weather.ts';

/**
 * Everything about one instant and one site that every star shares (the "astrometry context" of
 * the IAU SOFA quick routines): observer's barycentric position (au) and velocity (in units of c),
 * the Sun–observer geometry, the rotation from GCRS to the local hour-angle frame, and the
 * refraction constants. Build it with `placeContext`, then apply it to any number of stars.
 */
export interface PlaceContext {
  readonly daysSinceJ2000: number;
  readonly observerBarycentricAu: Vec3;
  /** Observer's barycentric velocity / c (annual + diurnal). */
  readonly observerBeta: Vec3;
  /** Earth's barycentric velocity / c alone (annual): the part the constant of aberration scales. */
  readonly earthBeta: Vec3;
  readonly geocentreBarycentricAu: Vec3;
  readonly sunToObserverUnit: Vec3;
  readonly sunToObserverAu: number;
  readonly sunToGeocentreUnit: Vec3;
  readonly sunToGeocentreAu: number;
  /** GCRS → true equator and equinox of date. */
  readonly npb: Mat3;
  /**
   * GCRS → the site's hour-angle frame: x to the meridian on the equator (hour angle 0), y to the
   * east point (hour angle −6h), z to the celestial pole of the ITRS-fixed site. Hour angle =
   * atan2(−y, x), positive west; declination = asin z.
   */
  readonly gcrsToLocal: Mat3;
  readonly latitudeRad: number;
  readonly refraction: RefractionConstants | null;
  readonly warnings: readonly string[];
}

/**
 * Builds the context of one instant (`ttDaysSinceJ2000`, TT days from J2000.0) at one site.
 * `earth` comes from `earthState`, `orientation` from the Earth-orientation model; `weather`
 * null means no refraction. The site's velocity is ω × r in the terrestrial frame (ω the rate of
 * the Earth rotation angle), which gives diurnal aberration 0.32″ cos φ.
 */
export function placeContext(
  ttDaysSinceJ2000: number,
  earth: EarthState,
  orientation: EarthOrientation,
  site: Site,
  weather: Weather | null,
): PlaceContext {
  checkSite(site);
  const trueToTerrestrialIntermediate = multiply(rotationZ(orientation.gastRad), orientation.npb);
  const gcrsToItrs = multiply(orientation.polarMotion, trueToTerrestrialIntermediate);
  const itrsM = siteItrsPositionM(site);
  const tirsM = applyTranspose(orientation.polarMotion, itrsM);
  const auPerM = 1 / ASTRONOMICAL_UNIT_M;
  const siteGcrsAu = applyTranspose(gcrsToItrs, [itrsM[0] * auPerM, itrsM[1] * auPerM, itrsM[2] * auPerM]);
  const omegaPerDay = EARTH_ROTATION_RATE_RAD_PER_S * SECONDS_PER_DAY;
  const tirsVelocityAuPerDay: Vec3 = [-omegaPerDay * tirsM[1] * auPerM, omegaPerDay * tirsM[0] * auPerM, 0];
  const siteVelocityAuPerDay = applyTranspose(trueToTerrestrialIntermediate, tirsVelocityAuPerDay);
  const inverseC = 1 / SPEED_OF_LIGHT_AU_PER_DAY;
  const ev = earth.barycentricVelocityAuPerDay;
  const eb = earth.barycentricPositionAu;
  const eh = earth.heliocentricPositionAu;
  const observerHelio: Vec3 = [eh[0] + siteGcrsAu[0], eh[1] + siteGcrsAu[1], eh[2] + siteGcrsAu[2]];
  const observerHelioAu = Math.hypot(...observerHelio);
  const geocentreHelioAu = Math.hypot(...eh);
  const refraction = weather === null ? null : refractionConstants(weather);
  return {
    daysSinceJ2000: ttDaysSinceJ2000,
    observerBarycentricAu: [eb[0] + siteGcrsAu[0], eb[1] + siteGcrsAu[1], eb[2] + siteGcrsAu[2]],
    observerBeta: [
      (ev[0] + siteVelocityAuPerDay[0]) * inverseC,
      (ev[1] + siteVelocityAuPerDay[1]) * inverseC,
      (ev[2] + siteVelocityAuPerDay[2]) * inverseC,
    ],
    earthBeta: [ev[0] * inverseC, ev[1] * inverseC, ev[2] * inverseC],
    geocentreBarycentricAu: eb,
    sunToObserverUnit: [observerHelio[0] / observerHelioAu, observerHelio[1] / observerHelioAu, observerHelio[2] / observerHelioAu],
    sunToObserverAu: observerHelioAu,
    sunToGeocentreUnit: [eh[0] / geocentreHelioAu, eh[1] / geocentreHelioAu, eh[2] / geocentreHelioAu],
    sunToGeocentreAu: geocentreHelioAu,
    npb: orientation.npb,
    gcrsToLocal: multiply(rotationZ(site.longitudeRad), gcrsToItrs),
    latitudeRad: site.latitudeRad,
    refraction,
    warnings: refraction?.warnings ?? [],
  };
}
