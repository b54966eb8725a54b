import { equinoxComplementaryTerms } from '../earth/equation-of-equinoxes-06.ts';
import { nutation06a, nutation06aAtSteps, type PlanetaryNutationSource } from '../earth/nutation-series.ts';
import { applyTranspose, multiply, rotationZ } from '../math/mat3.ts';
import type { Vec3 } from '../math/vec3.ts';
import { SECONDS_PER_DAY, TAU } from '../units.ts';
import { ASTRONOMICAL_UNIT_M, EARTH_ROTATION_RATE_RAD_PER_S, GM_SUN_AU3_PER_DAY2 } from './constants.ts';
import { earthState, earthStateFast } from './earth-state.ts';
import { iauEarthOrientation } from './iau-earth-orientation.ts';
import type { EarthOrientation } from './earth-orientation.ts';
import type { AstrometricInstant, TwoPartJulianDate } from './instant.ts';
import { moonGeocentricAu } from './moon-low-precision.ts';
import { nightOrientations } from './night-orientation.ts';
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
   * full nutation at the centre and its luni-solar change at the five instants (nutation06aAtSteps),
   * NPB at the five instants to first order from the centre (night-orientation.ts).
   * 'exact': Earth state at three instants and full nutation at all five (about 3× the cost).
   */
  readonly mode?: 'fast' | 'exact';
  /**
   * 'fast' mode only: where the planetary part of the centre's nutation comes from. Absent: all
   * 687 terms at the centre. For batches of nights, one PlanetaryNutationGrid
   * (core/earth/planetary-nutation-grid.ts) shared by all their contexts: within 1 µas of the full
   * series at a third of the nutation's cost.
   */
  readonly planetaryNutation?: PlanetaryNutationSource;
}

/**
 * Per-night quantities computed once (the SOFA "quick" pattern): Earth's state at the centre with
 * its acceleration and jerk (Sun exact, Moon from a low-precision ephemeris), and quartic fits,
 * through five instants (centre, ±half-width, ±half of it), of the NPB matrix, of R3(λ)·polar
 * motion and of GAST. In 'fast' mode full IAU 2000A nutation is evaluated once at the centre and
 * carried to the five instants term by term (within 13 µas of nutation06a there; 2000B's change,
 * used before, erred by up to 0.67 mas in Δψ at the ends of some nights). Layout of
 * `coefficients`: the NC_* offsets.
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
export const NC_CENTRE_DAYS = 122; // the centre, TT days since J2000.0 (as centreDaysSinceJ2000)
export const NC_LENGTH = 123;
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
  const orientations = exact ? exactOrientations(samples) : fastOrientations(samples, centre, offsets, options.planetaryNutation);
  fillRotations(c, orientations, options.site.longitudeRad, offsets);
  c[NC_INVERSE_HALF_WIDTH] = 1 / h;
  c[NC_CENTRE_DAYS] = days;
  fillSite(c, options.site, orientations[1].polarMotion);
  const refraction = options.weather === null ? null : refractionConstants(options.weather);
  c[NC_REFRACTION] = refraction?.aRad ?? 0;
  c[NC_REFRACTION + 1] = refraction?.bRad ?? 0;
  c[NC_REFRACTION + 2] = refraction === null ? 0 : 1;
  const warnings = new Set<string>(refraction?.warnings ?? []);
  for (const sample of samples) for (const warning of (sample as { warnings?: readonly string[] }).warnings ?? []) warnings.add(warning);
  return { centreDaysSinceJ2000: days, halfWidthDays: h, coefficients: c, warnings: [...warnings] };
}

/** 'exact' mode: full nutation at every sample. */
function exactOrientations(samples: readonly AstrometricInstant[]): EarthOrientation[] {
  const orientations: EarthOrientation[] = [];
  for (const instant of samples) orientations.push(iauEarthOrientation(instant, nutation06a(instant.tt)));
  return orientations;
}

/** 'fast' mode: full nutation at the centre, its change across the night from IAU 2000B. */
function fastOrientations(
  samples: readonly AstrometricInstant[],
  centre: TwoPartJulianDate,
  offsets: readonly number[],
  planetary: PlanetaryNutationSource | undefined,
): EarthOrientation[] {
  nutation06aAtSteps(centre, offsets[3], sampleNutation, planetary);
  const nutations = [];
  for (let k = 0; k < samples.length; k++) nutations.push({ dpsiRad: sampleNutation[2 * k], depsRad: sampleNutation[2 * k + 1] });
  return nightOrientations(samples, offsets, nutations, equinoxComplementaryTerms(centre));
}

/** Nutation at the five samples (Δψ, Δε pairs), refilled by each fast context. */
const sampleNutation = new Float64Array(10);

/** Quartics of the NPB matrix, of R3(λ)·W and of GAST through the five samples. */
function fillRotations(c: Float64Array, orientations: readonly EarthOrientation[], longitudeRad: number, offsets: readonly number[]): void {
  const longitude = rotationZ(longitudeRad);
  const local = orientations.map((o) => multiply(longitude, o.polarMotion));
  const values = [0, 0, 0, 0, 0];
  for (let e = 0; e < 9; e++) {
    for (let k = 0; k < 5; k++) values[k] = orientations[k].npb[e];
    quartic(c, NC_NPB + NC_ORDER * e, values);
    for (let k = 0; k < 5; k++) values[k] = local[k][e];
    quartic(c, NC_LOCAL + NC_ORDER * e, values);
  }
  // GAST unwrapped around the nominal rotation, so the quartic sees a smooth function.
  const rate = EARTH_ROTATION_RATE_RAD_PER_S * SECONDS_PER_DAY;
  const centreAngle = orientations[2].gastRad;
  for (let k = 0; k < 5; k++) {
    const nominal = centreAngle + rate * offsets[k];
    const step = orientations[k].gastRad - nominal;
    values[k] = nominal + step - TAU * Math.round(step / TAU);
  }
  quartic(c, NC_ANGLE, values);
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
  const first = instantFromTt({ jd1: centre.jd1, jd2: centre.jd2 + offsets[0] });
  const middle = instantFromTt({ jd1: centre.jd1, jd2: centre.jd2 + offsets[2] });
  const last = instantFromTt({ jd1: centre.jd1, jd2: centre.jd2 + offsets[4] });
  return [first, between(first, middle, centre, offsets[1]), middle, between(middle, last, centre, offsets[3]), last];
}

/** The instant at `offset` from `centre` with UT1 − TT and the pole the means of `p` and `q`. */
function between(p: AstrometricInstant, q: AstrometricInstant, centre: TwoPartJulianDate, offset: number): AstrometricInstant {
  const tt = { jd1: centre.jd1, jd2: centre.jd2 + offset };
  const ut1MinusTt = (p.ut1.jd1 - p.tt.jd1 + (p.ut1.jd2 - p.tt.jd2) + (q.ut1.jd1 - q.tt.jd1 + (q.ut1.jd2 - q.tt.jd2))) / 2;
  return { tt, ut1: { jd1: tt.jd1, jd2: tt.jd2 + ut1MinusTt }, xpRad: (p.xpRad + q.xpRad) / 2, ypRad: (p.ypRad + q.ypRad) / 2 };
}

/**
 * Quartic p(u) = Σ cₖ uᵏ through the values at u = −1, −½, 0, ½, 1 (u = dt/h), written at
 * `offset`: exact for polynomials to degree 4; for the 13.7-day nutation term over ±0.5 day the
 * error is ~2 µas (a quadratic would leave 0.2 mas).
 */
function quartic(out: Float64Array, offset: number, y: readonly number[]): void {
  // Indexed rather than destructured: destructuring runs the array iterator, an allocation a call.
  const m1 = y[0], mh = y[1], zero = y[2], ph = y[3], p1 = y[4];
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
 * (Sun: time derivative of the former with Earth's velocity; Moon: forward difference over 0.05 day).
 */
function fillEarth(c: Float64Array, centre: TwoPartJulianDate, days: number): void {
  const earth = earthStateFast(centre);
  const r = earth.heliocentricPositionAu, v = earth.barycentricVelocityAuPerDay;
  const moon = moonPull(days), moonAfter = moonPull(days + MOON_STEP_DAYS);
  const distance = Math.hypot(r[0], r[1], r[2]);
  const k = -GM_SUN_AU3_PER_DAY2 / distance ** 3;
  const rDotV = r[0] * v[0] + r[1] * v[1] + r[2] * v[2];
  for (let i = 0; i < 3; i++) {
    c[NC_POSITION + i] = earth.barycentricPositionAu[i];
    c[NC_VELOCITY + i] = v[i];
    c[NC_HELIO + i] = r[i];
    c[NC_ACCELERATION + i] = k * r[i] + moon[i];
    c[NC_JERK + i] = k * (v[i] - (3 * rDotV * r[i]) / (distance * distance)) + (moonAfter[i] - moon[i]) / MOON_STEP_DAYS;
  }
}

/**
 * Step of the Moon's forward difference (days). The Moon's pull turns with its 27.3-day orbit, so
 * the forward difference errs by about ½·step·ω ≈ 0.6% of the Moon's jerk, whose whole effect over
 * half a day is 0.08 m/s of Earth's velocity (0.06 mas of aberration): below 0.5 µas.
 */
const MOON_STEP_DAYS = 0.05;

/** The Moon's pull on Earth (au/day²) at TT `daysSinceJ2000`: GM_m r_m / r_m³. */
function moonPull(daysSinceJ2000: number): Vec3 {
  const m = moonGeocentricAu(daysSinceJ2000);
  const k = GM_MOON_AU3_PER_DAY2 / Math.hypot(m[0], m[1], m[2]) ** 3;
  return [m[0] * k, m[1] * k, m[2] * k];
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
