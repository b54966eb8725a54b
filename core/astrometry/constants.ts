/**
 * Physical constants of the astrometric model. Sources: IAU 2012 Resolution B2 (astronomical
 * unit), IERS Conventions 2010 Table 1.1 (speed of light, heliocentric gravitational constant),
 * IERS Conventions 2010 §1.2 and NIMA TR8350.2 (WGS84 ellipsoid), IAU 1976 System of Astronomical
 * Constants (constant of aberration).
 */
import { ARCSEC, SECONDS_PER_DAY } from '../units.ts';

/** The astronomical unit in metres (IAU 2012 Resolution B2, exact). */
export const ASTRONOMICAL_UNIT_M = 149_597_870_700;
/** Speed of light in metres per second (exact, SI). */
export const SPEED_OF_LIGHT_M_S = 299_792_458;
/** Speed of light in au per day. */
export const SPEED_OF_LIGHT_AU_PER_DAY = (SPEED_OF_LIGHT_M_S * SECONDS_PER_DAY) / ASTRONOMICAL_UNIT_M;
/** Light time for one au, in days. */
export const LIGHT_TIME_AU_DAYS = 1 / SPEED_OF_LIGHT_AU_PER_DAY;
/** One km/s in au per day. */
export const KM_S_IN_AU_PER_DAY = (1000 * SECONDS_PER_DAY) / ASTRONOMICAL_UNIT_M;
/**
 * Schwarzschild radius of the Sun, 2GM☉/c², in au (GM☉ = 1.32712440041e20 m³/s², IERS
 * Conventions 2010 Table 1.1); gives 1.75″ of light deflection at the solar limb.
 */
export const SCHWARZSCHILD_RADIUS_SUN_AU = (2 * 1.32712440041e20) / SPEED_OF_LIGHT_M_S ** 2 / ASTRONOMICAL_UNIT_M;
/** Heliocentric gravitational constant in au³/day² (same source). */
export const GM_SUN_AU3_PER_DAY2 = (1.32712440041e20 * SECONDS_PER_DAY ** 2) / ASTRONOMICAL_UNIT_M ** 3;
/**
 * Earth's rotation rate in radians per second of UT1: 2π × 1.00273781191135448 / 86400, the rate of
 * the Earth rotation angle (IERS Conventions 2010 eq. 5.15).
 */
export const EARTH_ROTATION_RATE_RAD_PER_S = (2 * Math.PI * 1.00273781191135448) / SECONDS_PER_DAY;
/** WGS84 equatorial radius in metres (NIMA TR8350.2). */
export const WGS84_EQUATORIAL_RADIUS_M = 6_378_137;
/** WGS84 flattening (NIMA TR8350.2). */
export const WGS84_FLATTENING = 1 / 298.257223563;
/**
 * The constant of aberration κ = 20.49552″ (IAU 1976 System of Astronomical Constants), in radians.
 * The model itself uses Earth's actual velocity; κ only scales the aberration factors.
 */
export const CONSTANT_OF_ABERRATION_RAD = 20.49552 * ARCSEC;
