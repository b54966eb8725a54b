import type { Vec3 } from '../math/vec3.ts';
import { DEG } from '../units.ts';
import { WGS84_EQUATORIAL_RADIUS_M, WGS84_FLATTENING } from './constants.ts';

/**
 * An observing site: geodetic latitude and longitude on the WGS84 ellipsoid (radians, east
 * positive) and height above the ellipsoid (metres). The model takes the geodetic vertical as the
 * instrument's vertical (no deflection of the vertical), like the IAU SOFA observed-place routines.
 */
export interface Site {
  readonly latitudeRad: number;
  readonly longitudeRad: number;
  readonly heightM: number;
}

/** Throws a RangeError naming the field when a site is unusable. */
export function checkSite(site: Site, where = 'site'): void {
  if (!Number.isFinite(site.latitudeRad) || Math.abs(site.latitudeRad) > 90 * DEG) {
    throw new RangeError(`${where}.latitude must lie in ±90° (got ${site.latitudeRad / DEG}°)`);
  }
  if (!Number.isFinite(site.longitudeRad) || Math.abs(site.longitudeRad) > 360 * DEG) {
    throw new RangeError(`${where}.longitude must lie in ±360°, east positive (got ${site.longitudeRad / DEG}°)`);
  }
  if (!Number.isFinite(site.heightM) || site.heightM < -1000 || site.heightM > 20_000) {
    throw new RangeError(`${where}.heightM must lie in −1000…20000 m above the WGS84 ellipsoid (got ${site.heightM})`);
  }
}

/**
 * Geocentric ITRS position of the site (metres) from geodetic coordinates on WGS84:
 * x = (N + h) cos φ cos λ, y = (N + h) cos φ sin λ, z = (N(1 − e²) + h) sin φ, N = a/√(1 − e² sin² φ)
 * (standard geodesy, e.g. IERS Conventions 2010 §4.2.6). Exact for the ellipsoid.
 */
export function siteItrsPositionM(site: Site): Vec3 {
  const eccentricitySquared = WGS84_FLATTENING * (2 - WGS84_FLATTENING);
  const sinLat = Math.sin(site.latitudeRad), cosLat = Math.cos(site.latitudeRad);
  const primeVertical = WGS84_EQUATORIAL_RADIUS_M / Math.sqrt(1 - eccentricitySquared * sinLat * sinLat);
  const horizontal = (primeVertical + site.heightM) * cosLat;
  return [
    horizontal * Math.cos(site.longitudeRad),
    horizontal * Math.sin(site.longitudeRad),
    (primeVertical * (1 - eccentricitySquared) + site.heightM) * sinLat,
  ];
}
