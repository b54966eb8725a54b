import { equinoxComplementaryTerms } from '../earth/equation-of-equinoxes-06.ts';
import { nutation00b, nutation06a, type Nutation } from '../earth/nutation-series.ts';
import { applyTranspose, multiply, rotationZ } from '../math/mat3.ts';
import type { Vec3 } from '../math/vec3.ts';
import { SECONDS_PER_DAY, TAU } from '../units.ts';
import { ASTRONOMICAL_UNIT_M, EARTH_ROTATION_RATE_RAD_PER_S, GM_SUN_AU3_PER_DAY2 } from './constants.ts';
import { earthState, earthStateFast } from './earth-state.ts';
import { iauEarthOrientation } from './iau-earth-orientation.ts';
import type { AstrometricInstant, TwoPartJulianDate } from './instant.ts';
import { moonGeocentricAu } from './moon-low-precision.ts';
import { refractionConstants } from './refraction-constants.ts';
import { checkSite, type Site, siteItrsPositionM } from './site.ts';
import type { Weather } from './weather.ts';

/** What a night context is built from. `instantFromTt` is e.g. `TimeScale.fromTt` (gives UT1, pole). */
export interface NightContextOptions {
  readonly centreTt: TwoPartJulianDate;
  /** The context serves instants within ± this many days of the centre (default 0.5). */
  readonly halfWidthDays?: number;
  readonly site: Site;
  readonly weather: Weather | null;
  readonly instantFromTt: (tt: TwoPartJulianDate) => AstrometricInstant;
  /**
   * 'fast' (default): Earth state once (`earthStateFast`) with analytic acceleration and jerk,
   * full nutation once plus the 2000B change at the five instants.
   * 'exact': Earth state at three instants and full nutation at all five (about 3× the cost).
   */
  readonly mode?: 'fast' | 'exact';
}

/**
 * Per-night quantities computed once (the SOFA "quick" pattern): Earth's state at the centre with
 * its acceleration and jerk (Sun exact, Moon from a low-precision ephemeris), and quartic fits,
 * through five instants (centre, ±half-width, ±half of it), of the NPB matrix, of R3(λ)·polar
 * motion and of GAST. In 'fast' mode full IAU 2000A nutation is evaluated once at the centre and
 * its change across the night taken from IAU 2000B at the five instants (the small terms 2000B
 * omits then drift by up to ~0.1 mas within the night). Layout of `coefficients`: the NC_* offsets.
 * Accuracy against the per-instant model over ±0.5 day, asserted in
 * unit/astrometry/night-context.test.ts: < 0.2 mas in 'fast' mode (also because Earth's velocity
 * from acceleration and jerk differs by up to 0.2 m/s from astronomy-engine's own, whose series
 * derivative is not exactly its physical acceleration), < 0.02 mas in 'exact' mode. Without an
 * EOP table UT1 follows UTC and jumps at a leap
 * second; a context spanning the step smooths it (the per-instant model does not).
 */
export interface NightContext {
  readonly centreDaysSinceJ2000: number;
  readonly halfWidthDays: number;
  readonly coefficients: Float64Array;
  readonly warnings: readonly string[];
}

export const NC_POSITION = 0;
export const NC_VELOCITY = 3;
export const NC_ACCELERATION = 6;
export const NC_JERK = 9;
export const NC_HELIO = 12;
export const NC_NPB = 15; // 45 numbers: quartic coefficients (in u = dt/h) of the 9 elements
export const NC_LOCAL = 60; // 45 numbers: R3(λ)·W, same form
export const NC_ANGLE = 105; // GAST: quartic coefficients in u
export const NC_SITE = 110; // site in TIRS (au)
export const NC_SITE_VELOCITY = 113; // site velocity in TIRS (au/day)
export const NC_COS_LAT = 116;
export const NC_SIN_LAT = 117;
export const NC_REFRACTION = 118; // A, B, has-refraction flag
export const NC_INVERSE_HALF_WIDTH = 121;
export const NC_LENGTH = 122;
/** Coefficients per interpolated quantity: a quartic through five equally spaced instants. */
export const NC_ORDER = 5;

/** GM of the Moon, 4902.800 km³/s² (DE430, Folkner et al. 2014), in au³/day². */
const GM_MOON_AU3_PER_DAY2 = (4.9028e12 * SECONDS_PER_DAY ** 2) / ASTRONOMICAL_UNIT_M ** 3;

export function createNightContext(options: NightContextOptions): NightContext {
  const h = options.halfWidthDays ?? 0.5;
  if (!(h > 0 && h <= 1)) throw new RangeError(`createNightContext: halfWidthDays must lie in (0, 1] (got ${h})`);
  checkSite(options.site);
  const c = new Float64Array(NC_LENGTH);
  const centre = options.centreTt;
  const days = centre.jd1 - 2_451_545 + centre.jd2;
  const offsets = [-h, -h / 2, 0, h / 2, h];
  const samples = instantsAt(options.instantFromTt, centre, offsets);
  const exact = options.mode === 'exact';
  if (exact) fillEarthFromSamples(c, [samples[0].tt, samples[2].tt, samples[4].tt], h);
  else fillEarth(c, centre, days);
  const fullNutation = nutation06a(centre);
  const shortNutation = exact ? [] : samples.map((instant) => nutation00b(instant.tt));
  const complementary = equinoxComplementaryTerms(centre);
  const orientations = samples.map((instant, k) => exact
    ? iauEarthOrientation(instant, k === 2 ? fullNutation : nutation06a(instant.tt))
    : iauEarthOrientation(instant, nutationAt(fullNutation, shortNutation[k], shortNutation[2]), complementary));
  const npb = orientations.map((o) => o.npb);
  const local = orientations.map((o) => multiply(rotationZ(options.site.longitudeRad), o.polarMotion));
  for (let e = 0; e < 9; e++) {
    quartic(c, NC_NPB + NC_ORDER * e, npb.map((m) => m[e]));
    quartic(c, NC_LOCAL + NC_ORDER * e, local.map((m) => m[e]));
  }
  // GAST unwrapped around the nominal rotation, so the quartic sees a smooth function.
  const rate = EARTH_ROTATION_RATE_RAD_PER_S * SECONDS_PER_DAY;
  const wrap = (a: number) => a - TAU * Math.round(a / TAU);
  const centreAngle = orientations[2].gastRad;
  quartic(c, NC_ANGLE, orientations.map((o, k) => centreAngle + rate * offsets[k] + wrap(o.gastRad - centreAngle - rate * offsets[k])));
  c[NC_INVERSE_HALF_WIDTH] = 1 / h;
  fillSite(c, options.site, orientations[1].polarMotion);
  const refraction = options.weather === null ? null : refractionConstants(options.weather);
  c[NC_REFRACTION] = refraction?.aRad ?? 0;
  c[NC_REFRACTION + 1] = refraction?.bRad ?? 0;
  c[NC_REFRACTION + 2] = refraction === null ? 0 : 1;
  const warnings = [...(refraction?.warnings ?? []), ...samples.flatMap((s) => (s as { warnings?: readonly string[] }).warnings ?? [])];
  return { centreDaysSinceJ2000: days, halfWidthDays: h, coefficients: c, warnings: [...new Set(warnings)] };
}

/**
 * The instants at the five offsets: the time scales are asked at the centre and the ends; the two
 * quarter points take the mean UT1 − TT and pole of their neighbours (EOP tables are interpolated
 * linearly within a day, so this is exact away from a table node or leap second).
 */
function instantsAt(
  instantFromTt: (tt: TwoPartJulianDate) => AstrometricInstant,
  centre: TwoPartJulianDate,
  offsets: readonly number[],
): AstrometricInstant[] {
  const at = (offset: number) => instantFromTt({ jd1: centre.jd1, jd2: centre.jd2 + offset });
  const first = at(offsets[0]), middle = at(offsets[2]), last = at(offsets[4]);
  const between = (p: AstrometricInstant, q: AstrometricInstant, offset: number): AstrometricInstant => {
    const tt = { jd1: centre.jd1, jd2: centre.jd2 + offset };
    const ut1MinusTt = (p.ut1.jd1 - p.tt.jd1 + (p.ut1.jd2 - p.tt.jd2) + (q.ut1.jd1 - q.tt.jd1 + (q.ut1.jd2 - q.tt.jd2))) / 2;
    return { tt, ut1: { jd1: tt.jd1, jd2: tt.jd2 + ut1MinusTt }, xpRad: (p.xpRad + q.xpRad) / 2, ypRad: (p.ypRad + q.ypRad) / 2 };
  };
  return [first, between(first, middle, offsets[1]), middle, between(middle, last, offsets[3]), last];
}

/** Full nutation at the centre plus the 2000B change from the centre to this sample. */
function nutationAt(full: Nutation, sample: Nutation, centre: Nutation): Nutation {
  return { dpsiRad: full.dpsiRad + sample.dpsiRad - centre.dpsiRad, depsRad: full.depsRad + sample.depsRad - centre.depsRad };
}

/**
 * Quartic p(u) = Σ cₖ uᵏ through the values at u = −1, −½, 0, ½, 1 (u = dt/h), written at
 * `offset`: exact for polynomials to degree 4; for the 13.7-day nutation term over ±0.5 day the
 * error is ~2 µas (a quadratic would leave 0.2 mas).
 */
function quartic(out: Float64Array, offset: number, y: readonly number[]): void {
  const [m1, mh, zero, ph, p1] = y;
  const evenHalf = (ph + mh) / 2 - zero, evenOne = (p1 + m1) / 2 - zero;
  const oddHalf = (ph - mh) / 2, oddOne = (p1 - m1) / 2;
  const c2 = (16 * evenHalf - evenOne) / 3;
  const c1 = (8 * oddHalf - oddOne) / 3;
  out[offset] = zero;
  out[offset + 1] = c1;
  out[offset + 2] = c2;
  out[offset + 3] = oddOne - c1;
  out[offset + 4] = evenOne - c2;
}

/**
 * Earth's state at the centre, its acceleration (Sun: −GM r/r³; Moon: GM_m r_m/r_m³) and jerk
 * (Sun: time derivative of the former with Earth's velocity; Moon: numerical, over ±0.05 day).
 */
function fillEarth(c: Float64Array, centre: TwoPartJulianDate, days: number): void {
  const earth = earthStateFast(centre);
  const r = earth.heliocentricPositionAu, v = earth.barycentricVelocityAuPerDay;
  const moonPull = (d: number): Vec3 => {
    const m = moonGeocentricAu(d);
    const k = GM_MOON_AU3_PER_DAY2 / Math.hypot(...m) ** 3;
    return [m[0] * k, m[1] * k, m[2] * k];
  };
  const distance = Math.hypot(...r);
  const k = -GM_SUN_AU3_PER_DAY2 / distance ** 3;
  const rDotV = r[0] * v[0] + r[1] * v[1] + r[2] * v[2];
  const moon = moonPull(days), moonBefore = moonPull(days - 0.05), moonAfter = moonPull(days + 0.05);
  for (let i = 0; i < 3; i++) {
    c[NC_POSITION + i] = earth.barycentricPositionAu[i];
    c[NC_VELOCITY + i] = v[i];
    c[NC_HELIO + i] = r[i];
    c[NC_ACCELERATION + i] = k * r[i] + moon[i];
    c[NC_JERK + i] = k * (v[i] - (3 * rDotV * r[i]) / (distance * distance)) + (moonAfter[i] - moonBefore[i]) / 0.1;
  }
}

/**
 * Earth's state from three ephemeris samples: position and velocity as quadratics through them
 * (stored as value, first derivative, second derivative ×… in the same Taylor slots), so the
 * frame's Taylor series reproduces the ephemeris at the three instants.
 */
function fillEarthFromSamples(c: Float64Array, tts: readonly TwoPartJulianDate[], h: number): void {
  const states = tts.map((tt) => earthState(tt));
  for (let i = 0; i < 3; i++) {
    const p = states.map((s) => s.barycentricPositionAu[i]);
    const v = states.map((s) => s.barycentricVelocityAuPerDay[i]);
    const helio = states.map((s) => s.heliocentricPositionAu[i]);
    c[NC_POSITION + i] = p[1];
    c[NC_VELOCITY + i] = v[1];
    c[NC_HELIO + i] = helio[1];
    // Velocity v(t) = v0 + a t + ½ j t²: a and j from the velocity samples; position uses a too.
    c[NC_ACCELERATION + i] = (v[2] - v[0]) / (2 * h);
    c[NC_JERK + i] = (v[2] - 2 * v[1] + v[0]) / (h * h);
  }
}

/** Site position and velocity in TIRS (au, au/day), cos φ, sin φ. */
function fillSite(c: Float64Array, site: Site, polarMotion: Parameters<typeof applyTranspose>[0]): void {
  const itrs = siteItrsPositionM(site);
  const tirs = applyTranspose(polarMotion, itrs);
  const omega = EARTH_ROTATION_RATE_RAD_PER_S * SECONDS_PER_DAY;
  for (let i = 0; i < 3; i++) c[NC_SITE + i] = tirs[i] / ASTRONOMICAL_UNIT_M;
  c[NC_SITE_VELOCITY] = (-omega * tirs[1]) / ASTRONOMICAL_UNIT_M;
  c[NC_SITE_VELOCITY + 1] = (omega * tirs[0]) / ASTRONOMICAL_UNIT_M;
  c[NC_SITE_VELOCITY + 2] = 0;
  c[NC_COS_LAT] = Math.cos(site.latitudeRad);
  c[NC_SIN_LAT] = Math.sin(site.latitudeRad);
}
