import type { Vec3 } from '../math/vec3.ts';
import { TAU } from '../units.ts';
import { earthState } from './earth-state.ts';
import type { AstrometricInstant, TwoPartJulianDate } from './instant.ts';
import { observedPlace, type ObservedPlace } from './observed-place.ts';
import type { EarthOrientationModel } from './orientation-model.ts';
import { placeContext, type PlaceContext } from './place-context.ts';
import type { Site } from './site.ts';
import type { StarMotion } from './space-motion.ts';
import type { Weather } from './weather.ts';

export type Culmination = 'upper' | 'lower';

/** Maps a UTC two-part Julian date to the instant in every scale (e.g. `TimeScale.fromUtc`). */
export type InstantFromUtc = (utc: TwoPartJulianDate) => AstrometricInstant & { readonly warnings?: readonly string[] };

/**
 * A predicted meridian transit. `utc` is when the observed hour angle is 0 (upper) or 12h (lower)
 * on the site's meridian (polar motion applied). `side`: whether the star then lies north or south
 * of the zenith. `place` is the full observed place at that instant (refraction when weather was
 * given; `place.topocentricZenithRad` is the geometric zenith distance).
 */
export interface TransitPrediction {
  readonly utc: TwoPartJulianDate;
  readonly culmination: Culmination;
  readonly side: 'north' | 'south';
  readonly place: ObservedPlace;
  readonly context: PlaceContext;
  readonly warnings: readonly string[];
}

/** Rate of the hour angle of a fixed star: the Earth rotation angle's rate per UT1 day (rad/day). */
const HOUR_ANGLE_RATE_RAD_PER_DAY = TAU * 1.00273781191135448;
/** Newton steps stop below this (days): 1e-11 day = 0.9 µs, 6e-11 rad of hour angle. */
const STEP_LIMIT_DAYS = 1e-11;

/**
 * The first transit of the star after `afterUtc` (UTC two-part JD), by Newton iteration on the
 * observed hour angle of the full model; converges to 1e-10 rad in 3–4 steps. Refraction acts in
 * the vertical plane, so the observed and geometric hour angles agree on the meridian.
 */
export function predictTransit(
  motion: StarMotion,
  site: Site,
  weather: Weather | null,
  afterUtc: TwoPartJulianDate,
  culmination: Culmination,
  instantFromUtc: InstantFromUtc,
  orientationModel: EarthOrientationModel,
): TransitPrediction {
  const target = culmination === 'upper' ? 0 : Math.PI;
  // The search runs on the geometric hour angle (the star may be below the horizon on the way);
  // the last evaluation adds refraction, which keeps the hour angle on the meridian.
  const evaluate = (utc: TwoPartJulianDate, withWeather = false) => {
    const instant = instantFromUtc(utc);
    const days = instant.tt.jd1 - 2_451_545 + instant.tt.jd2;
    const context = placeContext(days, earthState(instant.tt), orientationModel(instant), site, withWeather ? weather : null);
    return { context, place: observedPlace(context, motion), warnings: instant.warnings ?? [] };
  };
  let utc = afterUtc;
  let state = evaluate(utc);
  const ahead = positiveModulo(target - state.place.topocentricHourAngleRad, TAU);
  utc = { jd1: utc.jd1, jd2: utc.jd2 + ahead / HOUR_ANGLE_RATE_RAD_PER_DAY };
  for (let iteration = 0; iteration < 12; iteration++) {
    state = evaluate(utc);
    const residual = wrapToPi(state.place.topocentricHourAngleRad - target);
    const stepDays = residual / HOUR_ANGLE_RATE_RAD_PER_DAY;
    utc = { jd1: utc.jd1, jd2: utc.jd2 - stepDays };
    if (Math.abs(stepDays) < STEP_LIMIT_DAYS) {
      state = evaluate(utc, true);
      return {
        utc, culmination, side: sideOfZenith(state.context, state.place), place: state.place,
        context: state.context, warnings: [...state.warnings, ...state.place.warnings],
      };
    }
  }
  throw new RangeError('predictTransit: the hour angle did not converge in 12 steps; check the star and site');
}

/** North or south of the zenith, from the observed declination against the latitude. */
function sideOfZenith(context: PlaceContext, place: ObservedPlace): 'north' | 'south' {
  const lat = context.latitudeRad;
  const local: Vec3 = [
    Math.cos(place.observedDeclinationRad) * Math.cos(place.observedHourAngleRad),
    0,
    Math.sin(place.observedDeclinationRad),
  ];
  // The north point of the horizon in the hour-angle frame is (−sin φ, 0, cos φ).
  return -local[0] * Math.sin(lat) + local[2] * Math.cos(lat) >= 0 ? 'north' : 'south';
}

function positiveModulo(value: number, modulus: number): number {
  const r = value % modulus;
  return r < 0 ? r + modulus : r;
}

function wrapToPi(angle: number): number {
  return Math.atan2(Math.sin(angle), Math.cos(angle));
}

