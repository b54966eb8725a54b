import { CONSTANT_OF_ABERRATION_RAD, EARTH_ROTATION_RATE_RAD_PER_S } from '../astrometry/constants.ts';
import type { EarthState } from '../astrometry/earth-state.ts';
import { observedPlace, type ObservedPlace } from '../astrometry/observed-place.ts';
import { placeContext } from '../astrometry/place-context.ts';
import type { Site } from '../astrometry/site.ts';
import type { StarMotion } from '../astrometry/space-motion.ts';
import type { Weather } from '../astrometry/weather.ts';
import { polarMotionMatrixTirsToItrs, tioLocatorSPrime } from '../earth/polar-motion.ts';
import { gmst06, normalizeAngle } from '../earth/sidereal-time.ts';
import { mjdToJulianDate } from '../time/julian-date.ts';
import type { TimeScale } from '../time/timescale.ts';
import { SECONDS_PER_DAY } from '../units.ts';
import { SlowSkyNodes } from './slow-sky-nodes.ts';

/** Rate of a fixed star's hour angle: the Earth rotation angle's rate, rad per UT1 day (IERS 2010 eq. 5.15). */
export const HOUR_ANGLE_RATE_RAD_PER_DAY = EARTH_ROTATION_RATE_RAD_PER_S * SECONDS_PER_DAY;

/** A star's true passage of the site's meridian (observed hour angle 0 or 12 h). */
export interface TrueCulmination {
  /** UTC MJD of the passage. */
  readonly utcMjd: number;
  readonly place: ObservedPlace;
}

/**
 * The sky the simulator observes: core/astrometry's full model (space motion, parallax, solar
 * deflection, annual + diurnal aberration, IAU 2006/2000A orientation, refraction) with the time
 * scale's Earth orientation (UT1 − UTC and the pole as it gives them; 0 without an EOP table) and
 * Earth's barycentric velocity scaled by (κ₀ + Δκ)/κ₀ — the injected change of the constant of
 * aberration, exactly the quantity the reduction kernel's aberration factors are the derivative by.
 *
 * The slowly varying parts come from SlowSkyNodes (3-hour grid, < 1 µas); sidereal time
 * (GMST06 + interpolated equation of the equinoxes) at every instant; the UTC → TT/UT1 offsets
 * once per UTC day (a night that spans a leap second is handled by the day's own offset).
 * Newton iteration on the observed hour angle: steps stop below 1e-11 day (1 µs).
 */
export class SimulatedSky {
  private readonly slow = new SlowSkyNodes();
  private readonly velocityScale: number;
  private dayCache = { mjdDay: Number.NaN, ttMinusUtcDays: 0, ut1MinusUtcDays: 0, xpRad: 0, ypRad: 0 };

  constructor(
    private readonly site: Site,
    private readonly timeScale: TimeScale,
    deltaKappaRad: number,
  ) {
    this.velocityScale = (CONSTANT_OF_ABERRATION_RAD + deltaKappaRad) / CONSTANT_OF_ABERRATION_RAD;
  }

  /** The observed place of `motion` at UTC `utcMjd` with `weather` (null: no refraction). */
  placeAt(motion: StarMotion, utcMjd: number, weather: Weather | null): ObservedPlace {
    const day = this.offsetsOfDay(Math.floor(utcMjd));
    const tt = { jd1: 2_400_000.5, jd2: utcMjd + day.ttMinusUtcDays };
    const ut1 = { jd1: 2_400_000.5, jd2: utcMjd + day.ut1MinusUtcDays };
    const ttDays = tt.jd1 - 2_451_545 + tt.jd2;
    const slow = this.slow.at(ttDays);
    const orientation = {
      npb: slow.npb,
      gastRad: normalizeAngle(gmst06(ut1, tt) + slow.equationOfEquinoxesRad),
      polarMotion: polarMotionMatrixTirsToItrs(day.xpRad, day.ypRad, tioLocatorSPrime(tt)),
    };
    const context = placeContext(ttDays, this.scaledEarth(slow.earth), orientation, this.site, weather);
    return observedPlace(context, motion);
  }

  private offsetsOfDay(mjdDay: number): { ttMinusUtcDays: number; ut1MinusUtcDays: number; xpRad: number; ypRad: number } {
    if (this.dayCache.mjdDay !== mjdDay) {
      const instant = this.timeScale.fromUtc(mjdToJulianDate(mjdDay + 0.5));
      this.dayCache = {
        mjdDay,
        ttMinusUtcDays: instant.tt.jd1 - instant.utc.jd1 + (instant.tt.jd2 - instant.utc.jd2),
        ut1MinusUtcDays: instant.dut1Seconds / SECONDS_PER_DAY + 0,
        xpRad: instant.xpRad,
        ypRad: instant.ypRad,
      };
    }
    return this.dayCache;
  }

  /** The culmination nearest `approximateUtcMjd` (within ±6 h). */
  culmination(motion: StarMotion, approximateUtcMjd: number, culmination: 'upper' | 'lower', weather: Weather | null): TrueCulmination {
    const target = culmination === 'upper' ? 0 : Math.PI;
    let utcMjd = approximateUtcMjd;
    for (let iteration = 0; iteration < 10; iteration++) {
      const place = this.placeAt(motion, utcMjd, weather);
      const residual = Math.atan2(Math.sin(place.topocentricHourAngleRad - target), Math.cos(place.topocentricHourAngleRad - target));
      const stepDays = residual / HOUR_ANGLE_RATE_RAD_PER_DAY;
      utcMjd -= stepDays;
      if (Math.abs(stepDays) < 1e-11) return { utcMjd, place };
    }
    throw new RangeError(`SimulatedSky.culmination: no convergence near MJD ${approximateUtcMjd}; the star may be too close to the pole`);
  }

  private scaledEarth(earth: EarthState): EarthState {
    if (this.velocityScale === 1) return earth;
    const v = earth.barycentricVelocityAuPerDay;
    const k = this.velocityScale;
    return { ...earth, barycentricVelocityAuPerDay: [v[0] * k, v[1] * k, v[2] * k] };
  }
}
