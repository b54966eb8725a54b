/**
 * Nutation in longitude Δψ and in obliquity Δε, referred to the mean equator and equinox of date.
 *
 *  - nutation00a: IAU 2000A (MHB2000; IERS Conventions 2010 ch. 5.5.4, tables 5.3a/5.3b), all 678
 *    luni-solar and 687 planetary terms. Matches IAU SOFA nut00a to rounding (≪ 1 µas).
 *  - nutation06a: IAU 2000A with the IAU 2006 adjustments of Wallace & Capitaine (2006, A&A 459,
 *    981, eqs. 5): Δψ·(1 + 0.4697e−6 + f), Δε·(1 + f), f = −2.7774e−6·t. The one to use with the
 *    IAU 2006 precession (biasPrecessionNutationMatrix06, gast06).
 *  - nutation00b: IAU 2000B (McCarthy & Luzum 2003, Celest. Mech. 85, 37): the 77 largest
 *    luni-solar terms with linear Delaunay arguments, plus fixed offsets −0.135 mas in Δψ and
 *    +0.388 mas in Δε in place of the planetary terms. Moves the pole within 1 mas of 2000A
 *    (Δψ sin ε and Δε) over 1995–2050; Δψ itself differs by up to 2.5 mas.
 *
 * Input: TT as a two-part JD. Output: radians. Accuracy of IAU 2000A against VLBI: about 0.2 mas
 * (free core nutation not modelled; it is in the IERS dX, dY).
 * Terms are evaluated through FactoredHarmonics (products of precomputed multiples instead of one
 * sin/cos pair per term, shared sub-combinations evaluated once); the loops read typed arrays and
 * allocate nothing but the returned object.
 */
import { julianCenturiesSinceJ2000, type JulianDate } from '../time/julian-date.ts';
import { ARCSEC, MAS, TAU } from '../units.ts';
import * as arg from './fundamental-arguments.ts';
import { FactoredHarmonics } from './factored-harmonics.ts';
import { HarmonicArguments } from './harmonic-arguments.ts';
import {
  LUNISOLAR_2000B_TERM_COUNT,
  LUNISOLAR_AMPLITUDES,
  LUNISOLAR_MULTIPLIERS,
  LUNISOLAR_TERM_COUNT,
  PLANETARY_AMPLITUDES,
  PLANETARY_MULTIPLIERS,
  PLANETARY_TERM_COUNT,
} from './nutation-2000a-terms.ts';

/** Nutation angles in radians: Δψ in longitude, Δε in obliquity (mean → true equator of date). */
export interface Nutation {
  readonly dpsiRad: number;
  readonly depsRad: number;
}

/** 0.1 µas in radians: the unit of the published amplitudes. */
const TENTH_MICROARCSEC = ARCSEC / 1e7;

// Luni-solar rows split as (l, l′, F) | (D, Ω), planetary rows after Ω (see factored-harmonics.ts);
// 2000B has its own evaluator over its 77 rows so it does not pay for the 2000A sub-rows.
const lunisolarHarmonics = new FactoredHarmonics(LUNISOLAR_MULTIPLIERS, 5, 3);
const lunisolar2000bHarmonics = new FactoredHarmonics(LUNISOLAR_MULTIPLIERS.subarray(0, 5 * LUNISOLAR_2000B_TERM_COUNT), 5, 3);
const planetaryHarmonics = new HarmonicArguments(PLANETARY_MULTIPLIERS, 13);
const delaunay = new Float64Array(5);
const planetaryArguments = new Float64Array(13);
const sums = new Float64Array(2);

/** Luni-solar sums (in 0.1 µas) of the first `termCount` terms at Delaunay arguments l, l′, F, D, Ω. */
function lunisolarSum(harmonics: FactoredHarmonics, t: number, termCount: number, out: Float64Array): void {
  harmonics.evaluate(delaunay, termCount);
  const { sines, cosines } = harmonics;
  const amplitudes = LUNISOLAR_AMPLITUDES; // a local: an imported binding is re-read at every use
  let dpsi = 0;
  let deps = 0;
  // Smallest terms first, as the published tables are summed, to limit rounding.
  for (let i = termCount - 1; i >= 0; i--) {
    const s = sines[i];
    const c = cosines[i];
    const a = 6 * i;
    dpsi += (amplitudes[a] + amplitudes[a + 1] * t) * s + amplitudes[a + 2] * c;
    deps += (amplitudes[a + 3] + amplitudes[a + 4] * t) * c + amplitudes[a + 5] * s;
  }
  out[0] = dpsi;
  out[1] = deps;
}

/**
 * The 13 planetary-term arguments of IAU 2000A at `t` (Julian centuries TT since J2000.0) into
 * `p`: l, F, D, Ω as in MHB2000, the mean longitudes of Mercury … Neptune (Neptune MHB2000) and the
 * general precession in longitude (see the IAU SOFA nut00a notes).
 */
export function fillPlanetaryArguments(t: number, p: Float64Array): void {
  p[0] = (2.35555598 + 8328.6914269554 * t) % TAU; // l, MHB2000
  p[1] = (1.627905234 + 8433.466158131 * t) % TAU; // F, MHB2000
  p[2] = (5.198466741 + 7771.3771468121 * t) % TAU; // D, MHB2000
  p[3] = (2.1824392 - 33.757045 * t) % TAU; // Ω, MHB2000
  p[4] = arg.meanLongitudeMercury(t);
  p[5] = arg.meanLongitudeVenus(t);
  p[6] = arg.meanLongitudeEarth(t);
  p[7] = arg.meanLongitudeMars(t);
  p[8] = arg.meanLongitudeJupiter(t);
  p[9] = arg.meanLongitudeSaturn(t);
  p[10] = arg.meanLongitudeUranus(t);
  p[11] = (5.321159 + 3.8127774 * t) % TAU; // Neptune, MHB2000
  p[12] = arg.generalPrecessionInLongitude(t);
}

/**
 * Sums (in 0.1 µas) of `termCount` planetary terms whose phases `harmonics` has just evaluated,
 * with their amplitudes (4 per term, the published table's layout) in `amplitudes`.
 */
export function sumPlanetaryTerms(harmonics: HarmonicArguments, amplitudes: Float64Array, termCount: number, out: Float64Array): void {
  const { sines, cosines } = harmonics;
  let dpsi = 0;
  let deps = 0;
  for (let i = termCount - 1; i >= 0; i--) {
    const s = sines[i];
    const c = cosines[i];
    const a = 4 * i;
    dpsi += amplitudes[a] * s + amplitudes[a + 1] * c;
    deps += amplitudes[a + 2] * s + amplitudes[a + 3] * c;
  }
  out[0] = dpsi;
  out[1] = deps;
}

/** Planetary sums (in 0.1 µas) of all 687 terms at `t`. */
function planetarySum(t: number, out: Float64Array): void {
  fillPlanetaryArguments(t, planetaryArguments);
  planetaryHarmonics.evaluate(planetaryArguments, PLANETARY_TERM_COUNT);
  sumPlanetaryTerms(planetaryHarmonics, PLANETARY_AMPLITUDES, PLANETARY_TERM_COUNT, out);
}

/**
 * Source of the planetary part for `nutation06aAtSteps`: writes its Δψ, Δε sums (in 0.1 µas) at
 * TT `tt` (`t` the same in Julian centuries) into out[0], out[1]. PlanetaryNutationGrid
 * (planetary-nutation-grid.ts) is one.
 */
export interface PlanetaryNutationSource {
  planetarySums(tt: JulianDate, t: number, out: Float64Array): void;
}

/** IAU 2000A nutation at TT `tt` (full series; see the file header). */
export function nutation00a(tt: JulianDate, planetary?: PlanetaryNutationSource): Nutation {
  const t = julianCenturiesSinceJ2000(tt);
  delaunay[0] = arg.meanAnomalyMoon(t);
  delaunay[1] = arg.meanAnomalySunMhb2000(t);
  delaunay[2] = arg.meanArgumentOfLatitudeMoon(t);
  delaunay[3] = arg.meanElongationMoonMhb2000(t);
  delaunay[4] = arg.meanLongitudeMoonNode(t);
  lunisolarSum(lunisolarHarmonics, t, LUNISOLAR_TERM_COUNT, sums);
  const dpsiLunisolar = sums[0];
  const depsLunisolar = sums[1];
  if (planetary === undefined) planetarySum(t, sums);
  else planetary.planetarySums(tt, t, sums);
  return {
    dpsiRad: dpsiLunisolar * TENTH_MICROARCSEC + sums[0] * TENTH_MICROARCSEC,
    depsRad: depsLunisolar * TENTH_MICROARCSEC + sums[1] * TENTH_MICROARCSEC,
  };
}

/**
 * IAU 2000A nutation with the IAU 2006 (P03) adjustments, at TT `tt` (see the file header).
 * `planetary`, when given, supplies the planetary part (e.g. interpolated from a grid).
 */
export function nutation06a(tt: JulianDate, planetary?: PlanetaryNutationSource): Nutation {
  const t = julianCenturiesSinceJ2000(tt);
  const secularJ2 = -2.7774e-6 * t;
  const n = nutation00a(tt, planetary);
  return { dpsiRad: n.dpsiRad + n.dpsiRad * (0.4697e-6 + secularJ2), depsRad: n.depsRad + n.depsRad * secularJ2 };
}

/** IAU 2000B nutation at TT `tt` (77 terms plus fixed offsets; see the file header). */
export function nutation00b(tt: JulianDate): Nutation {
  const t = julianCenturiesSinceJ2000(tt);
  // Linear Delaunay arguments of Simon et al. (1994), as IAU 2000B prescribes.
  delaunay[0] = ((485868.249036 + 1717915923.2178 * t) % 1296000) * ARCSEC;
  delaunay[1] = ((1287104.79305 + 129596581.0481 * t) % 1296000) * ARCSEC;
  delaunay[2] = ((335779.526232 + 1739527262.8478 * t) % 1296000) * ARCSEC;
  delaunay[3] = ((1072260.70369 + 1602961601.209 * t) % 1296000) * ARCSEC;
  delaunay[4] = ((450160.398036 - 6962890.5431 * t) % 1296000) * ARCSEC;
  lunisolarSum(lunisolar2000bHarmonics, t, LUNISOLAR_2000B_TERM_COUNT, sums);
  return {
    dpsiRad: sums[0] * TENTH_MICROARCSEC - 0.135 * MAS,
    depsRad: sums[1] * TENTH_MICROARCSEC + 0.388 * MAS,
  };
}

/** Rates of the Delaunay arguments l, l′, F, D, Ω at J2000 (IERS 2010 eq. 5.43), radians per day. */
const DELAUNAY_RATES_RAD_PER_DAY = [1717915923.2178, 129596581.0481, 1739527262.8478, 1602961601.209, -6962890.5431]
  .map((arcsecPerCentury) => (arcsecPerCentury * ARCSEC) / 36525);
/** Each luni-solar term's angular rate (rad/day) and the step rotations of the last step (cos − 1, sin). */
const termRates = new Float64Array(LUNISOLAR_TERM_COUNT);
for (let i = 0; i < LUNISOLAR_TERM_COUNT; i++) {
  for (let j = 0; j < 5; j++) termRates[i] += LUNISOLAR_MULTIPLIERS[5 * i + j] * DELAUNAY_RATES_RAD_PER_DAY[j];
}
const stepTurns = new Float64Array(4 * LUNISOLAR_TERM_COUNT);
let cachedStepDays = NaN;

/**
 * IAU 2000A nutation with the IAU 2006 adjustments (nutation06a) at the five instants TT
 * `centre` + k·`stepDays`, k = −2…2, written as Δψ, Δε pairs (radians) into out[0…9]. The centre
 * is nutation06a itself; the change to the other instants is that of all 678 luni-solar terms,
 * each turned by its own rate (sin(φ + ωτ) − sin φ = sin φ (cos ωτ − 1) + cos φ sin ωτ; the
 * curvature of the arguments over a day moves a phase by < 1e-8 rad), with the first-order
 * change of the t-dependent amplitudes. The planetary terms are held at their centre value: over
 * ±0.5 day they move by less than 38 µas (Σ amplitude × rate × 0.5 d over all 687 terms).
 * Against nutation06a at each instant: < 0.05 mas for steps up to 0.25 day (asserted in
 * unit/astrometry/night-nutation.test.ts); 2000B for the change, as before, erred by up to 0.7 mas.
 * `planetary`: as for nutation06a.
 */
export function nutation06aAtSteps(centre: JulianDate, stepDays: number, out: Float64Array, planetary?: PlanetaryNutationSource): void {
  if (stepDays !== cachedStepDays) {
    for (let i = 0; i < LUNISOLAR_TERM_COUNT; i++) {
      const turn = termRates[i] * stepDays;
      stepTurns[4 * i] = Math.cos(turn) - 1;
      stepTurns[4 * i + 1] = Math.sin(turn);
      stepTurns[4 * i + 2] = Math.cos(2 * turn) - 1;
      stepTurns[4 * i + 3] = Math.sin(2 * turn);
    }
    cachedStepDays = stepDays;
  }
  const value = nutation06a(centre, planetary);
  // nutation06a has just evaluated the luni-solar phases at the centre.
  const { sines, cosines } = lunisolarHarmonics;
  const amplitudes = LUNISOLAR_AMPLITUDES, turns = stepTurns;
  const t = julianCenturiesSinceJ2000(centre);
  let psiEven1 = 0, psiOdd1 = 0, psiEven2 = 0, psiOdd2 = 0, epsEven1 = 0, epsOdd1 = 0, epsEven2 = 0, epsOdd2 = 0;
  let psiRate = 0, epsRate = 0;
  for (let i = LUNISOLAR_TERM_COUNT - 1; i >= 0; i--) {
    const sn = sines[i], cs = cosines[i], a = 6 * i, r = 4 * i;
    const psiSin = amplitudes[a] + amplitudes[a + 1] * t, psiCos = amplitudes[a + 2];
    const epsCos = amplitudes[a + 3] + amplitudes[a + 4] * t, epsSin = amplitudes[a + 5];
    // Term = X (value) and Y (quadrature, its derivative over ω): X(τ) − X(0) = X (cos ωτ − 1) + Y sin ωτ.
    const psiX = psiSin * sn + psiCos * cs, psiY = psiSin * cs - psiCos * sn;
    const epsX = epsCos * cs + epsSin * sn, epsY = epsSin * cs - epsCos * sn;
    psiEven1 += psiX * turns[r]; psiOdd1 += psiY * turns[r + 1]; psiEven2 += psiX * turns[r + 2]; psiOdd2 += psiY * turns[r + 3];
    epsEven1 += epsX * turns[r]; epsOdd1 += epsY * turns[r + 1]; epsEven2 += epsX * turns[r + 2]; epsOdd2 += epsY * turns[r + 3];
    psiRate += amplitudes[a + 1] * sn;
    epsRate += amplitudes[a + 4] * cs;
  }
  const scale = TENTH_MICROARCSEC * (1 + 0.4697e-6 - 2.7774e-6 * t);
  const stepCenturies = stepDays / 36525;
  const psiEven = [psiEven2, psiEven1, 0, psiEven1, psiEven2], psiOdd = [-psiOdd2, -psiOdd1, 0, psiOdd1, psiOdd2];
  const epsEven = [epsEven2, epsEven1, 0, epsEven1, epsEven2], epsOdd = [-epsOdd2, -epsOdd1, 0, epsOdd1, epsOdd2];
  for (let k = 0; k < 5; k++) {
    const dt = (k - 2) * stepCenturies;
    out[2 * k] = value.dpsiRad + (psiEven[k] + psiOdd[k] + psiRate * dt) * scale;
    out[2 * k + 1] = value.depsRad + (epsEven[k] + epsOdd[k] + epsRate * dt) * TENTH_MICROARCSEC * (1 - 2.7774e-6 * t);
  }
}
