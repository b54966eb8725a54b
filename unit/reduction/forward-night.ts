// A small forward model of one night at a transit instrument, for the reduction's tests. It uses
// core/astrometry's predicted passage (full model, geometric), the EXACT line-of-sight geometry of
// core/instrument/exact-crossing.ts (not Mayer's first-order formula the reduction uses), the exact
// small-circle wire intervals, a linear clock and Gaussian noise. Everything is an invented scenario.
import { iauEarthOrientation } from '../../core/astrometry/iau-earth-orientation.ts';
import { observedFromTrueZenith } from '../../core/astrometry/refraction.ts';
import { refractionConstants } from '../../core/astrometry/refraction-constants.ts';
import { starMotion } from '../../core/astrometry/space-motion.ts';
import { predictTransit } from '../../core/astrometry/transit.ts';
import type { TransitPrediction } from '../../core/astrometry/transit.ts';
import { mjdFromCalendar } from '../../core/formats/cells.ts';
import { clampSign } from '../../core/instrument/culmination.ts';
import { exactTransitCorrectionRad } from '../../core/instrument/exact-crossing.ts';
import { wireHourAngleIntervalRad } from '../../core/instrument/wire-reduction.ts';
import { catalogueStarOf } from '../../core/reduction/star-predictions.ts';
import type { StarListRow } from '../../core/formats/star-list.ts';
import { bundledEarthOrientationTable } from '../../core/time/bundled-earth-orientation.ts';
import { BUNDLED_LEAP_SECONDS } from '../../core/time/bundled-leap-seconds.ts';
import { TimeScale } from '../../core/time/timescale.ts';
import { ARCSEC, DEG, SECOND_OF_TIME_ANGLE } from '../../core/units.ts';
import { seededRandom } from '../instrument/seeded-random.ts';

export const TIME_SCALE = new TimeScale(BUNDLED_LEAP_SECONDS, bundledEarthOrientationTable());
export const instantFromUtc = (utc: { jd1: number; jd2: number }) => TIME_SCALE.fromUtc(utc);

/** Invented site and instrument. */
export const SITE = { id: 'larkspur-knoll', label: 'Larkspur Knoll (invented)', latitudeDeg: 46.2173, longitudeDeg: 7.4391, heightM: 820 };
export const WIRES_S = [30.2, 15.1, 0, -15.05, -30.1];
export const MICROMETER_ARCSEC_PER_TURN = 48.7;
export const SITE_JSON = JSON.stringify({
  formatVersion: 1,
  site: SITE,
  instruments: [{
    id: 'tr-2', label: 'Transit No. 2 (invented)', kind: 'transit', zenithScale: { unit: 'turn', arcsecPerUnit: MICROMETER_ARCSEC_PER_TURN, sense: 1 },
    wireIntervalsS: WIRES_S, effectiveWavelengthUm: 0.55, clockId: 'clock-k', clockTimeScale: 'mean-solar', events: [],
  }],
});
export const NIGHT = '2021-11-20';
export const NIGHT_MJD = mjdFromCalendar(2021, 11, 20);

/** Invented programme: [id, raDeg, decDeg, culmination, clamp]. Passages 18 h – 5 h UTC on the night. */
export const PROGRAMME: readonly [string, number, number, 'upper' | 'lower', 'west' | 'east'][] = [
  ['LK-01', 344.0, 12.5, 'upper', 'west'], ['LK-02', 352.5, 38.2, 'upper', 'east'], ['LK-03', 3.1, -14.8, 'upper', 'west'],
  ['LK-04', 12.7, 61.4, 'upper', 'east'], ['LK-05', 24.9, 22.0, 'upper', 'west'], ['LK-06', 36.2, -8.3, 'upper', 'east'],
  ['LK-07', 47.8, 49.6, 'upper', 'west'], ['LK-08', 58.3, 5.9, 'upper', 'east'], ['LK-09', 69.0, 74.2, 'upper', 'west'],
  ['LK-10', 81.4, -19.5, 'upper', 'east'], ['LK-11', 92.6, 31.7, 'upper', 'west'], ['LK-12', 104.1, 55.0, 'upper', 'east'],
  ['LK-13', 250.2, 78.1, 'lower', 'west'], ['LK-14', 268.9, 72.4, 'lower', 'east'],
];

export const STAR_CSV = ['id,label,raDeg,decDeg,epochJyear,pmRaCosDecMasYr,pmDecMasYr,parallaxMas,parallaxSigmaMas,radialVelocityKmS,magnitude,source,programme',
  ...PROGRAMME.map(([id, ra, dec], k) => `${id},invented ${id},${ra},${dec},2016.0,${(k * 7.3) % 40 - 20},${(k * 11.1) % 30 - 15},${2 + k * 0.7},0.05,,6.0,invented for tests,clock`)].join('\n') + '\n';

export interface NightTruth {
  readonly azimuthArcsec: number;
  readonly levelArcsec: number;
  readonly collimationArcsec: number;
  readonly clockOffsetS: number;
  readonly clockRateSPerDay: number;
  /** Clock reference epoch: clock seconds from 0 h of the night's date. */
  readonly clockReferenceS: number;
  readonly zenithZeroArcsec: number;
}

export const TRUTH: NightTruth = { azimuthArcsec: 11.6, levelArcsec: 2.4, collimationArcsec: -1.9, clockOffsetS: 0.412, clockRateSPerDay: 0.83, clockReferenceS: 86_400, zenithZeroArcsec: 25.3 };

const ONE_UTC_SECOND_RAD = 1.002737811911354 * SECOND_OF_TIME_ANGLE;
const predictionCache = new Map<string, TransitPrediction>();

function starRow(id: string, ra: number, dec: number): StarListRow {
  return { row: 0, line: 0, id, label: '', raDeg: ra, decDeg: dec, epochJyear: 2016, pmRaCosDecMasYr: 0, pmDecMasYr: 0, parallaxMas: 0, parallaxSigmaMas: null, radialVelocityKmS: null, magnitude: null, source: '', programmes: [] };
}

/** The predicted (geometric) passage of a programme star on the night, cached across seeds. */
export function passage(index: number): TransitPrediction {
  const [id, ra, dec, culmination] = PROGRAMME[index];
  const key = `${id}${culmination}`;
  let p = predictionCache.get(key);
  if (p === undefined) {
    const k = index;
    const star = { ...starRow(id, ra, dec), pmRaCosDecMasYr: (k * 7.3) % 40 - 20, pmDecMasYr: (k * 11.1) % 30 - 15, parallaxMas: 2 + k * 0.7 };
    const site = { latitudeRad: SITE.latitudeDeg * DEG, longitudeRad: SITE.longitudeDeg * DEG, heightM: SITE.heightM };
    p = predictTransit(starMotion(catalogueStarOf(star)), site, null, { jd1: 2_400_000.5 + NIGHT_MJD, jd2: 0.5 }, culmination, instantFromUtc, iauEarthOrientation);
    predictionCache.set(key, p);
  }
  return p;
}

/** UTC seconds from 0 h of the night's date of a two-part UTC JD. */
export function nightSeconds(utc: { jd1: number; jd2: number }): number {
  return (utc.jd1 - 2_400_000.5 - NIGHT_MJD + utc.jd2) * 86_400;
}

export function clockReadingAt(utcS: number, t: NightTruth): number {
  const rate = t.clockRateSPerDay / 86_400;
  return (utcS - t.clockOffsetS + rate * t.clockReferenceS) / (1 + rate);
}

export interface SimulatedRow {
  readonly id: string;
  readonly culmination: 'upper' | 'lower';
  clamp: 'west' | 'east';
  wireClockS: (number | null)[];
  turns: number;
  readonly temperatureC: number;
  readonly pressureHpa: number;
  readonly humidityPercent: number;
  readonly declinationRad: number;
}

/** One simulated night: wire clock readings (noise `wireNoiseS` per wire) and micrometer turns (noise `zenithNoiseArcsec`). */
export function simulateNight(seed: number, truth: NightTruth, wireNoiseS: number, zenithNoiseArcsec: number): SimulatedRow[] {
  const random = seededRandom(seed);
  const latitudeRad = SITE.latitudeDeg * DEG;
  const constants = { azimuthRad: truth.azimuthArcsec * ARCSEC, levelRad: truth.levelArcsec * ARCSEC, collimationRad: truth.collimationArcsec * ARCSEC };
  return PROGRAMME.map(([id, , , culmination, clamp], index) => {
    const p = passage(index);
    const dec = p.place.topocentricDeclinationRad;
    const tau = exactTransitCorrectionRad(constants, latitudeRad, dec, culmination, clamp);
    const crossingS = nightSeconds(p.utc) - tau / ONE_UTC_SECOND_RAD;
    const direction = (culmination === 'upper' ? 1 : -1) * clampSign(clamp);
    const wireClockS = WIRES_S.map((i) => {
      const wireUtcS = crossingS - (direction * wireHourAngleIntervalRad(i * SECOND_OF_TIME_ANGLE, dec)) / ONE_UTC_SECOND_RAD;
      return clockReadingAt(wireUtcS, truth) + wireNoiseS * random.normal();
    });
    const temperatureC = 3 - index * 0.3, pressureHpa = 921.5 - index * 0.1, humidityPercent = 70;
    const weather = { temperatureC, pressureHpa, relativeHumidity: humidityPercent / 100, wavelengthUm: 0.55 };
    const observed = observedFromTrueZenith(p.place.topocentricZenithRad, refractionConstants(weather));
    const turns = (observed - truth.zenithZeroArcsec * ARCSEC + zenithNoiseArcsec * ARCSEC * random.normal()) / (MICROMETER_ARCSEC_PER_TURN * ARCSEC);
    return { id, culmination, clamp, wireClockS, turns, temperatureC, pressureHpa, humidityPercent, declinationRad: dec };
  });
}

/** The transit log CSV (clock times) of simulated rows. */
export function transitLogCsv(rows: readonly SimulatedRow[]): string {
  const header = `starId,culmination,clamp,nightDate,instrumentId,observer,${WIRES_S.map((_, k) => `wire${k + 1}ClockS`).join(',')},micrometerTurns,temperatureC,pressureHpa,humidityPercent,flags,note`;
  const lines = rows.map((r) => [r.id, r.culmination, r.clamp, NIGHT, 'tr-2', 'QX', ...r.wireClockS.map((t) => (t === null ? '' : t.toFixed(4))), r.turns.toFixed(5), r.temperatureC.toFixed(1), r.pressureHpa.toFixed(1), r.humidityPercent, '', ''].join(','));
  return `${header}\n${lines.join('\n')}\n`;
}

/** Clock comparisons CSV at the given UTC seconds of the night, noise `noiseS`. */
export function clockCsv(utcSeconds: readonly number[], truth: NightTruth, noiseS: number, seed: number): string {
  const random = seededRandom(seed + 1_000_003);
  const lines = utcSeconds.map((s) => {
    const day = NIGHT_MJD + Math.floor(s / 86_400);
    const sod = s - Math.floor(s / 86_400) * 86_400;
    const { year, month, dayOfMonth } = calendar(day);
    const hh = Math.floor(sod / 3600), mm = Math.floor((sod % 3600) / 60), ss = sod % 60;
    const iso = `${year}-${pad(month)}-${pad(dayOfMonth)}T${pad(hh)}:${pad(mm)}:${ss.toFixed(3).padStart(6, '0')}Z`;
    return `${NIGHT},tr-2,${iso},${(clockReadingAt(s, truth) + noiseS * random.normal()).toFixed(4)},invented radio signal`;
  });
  return `nightDate,instrumentId,utc,clockS,signal\n${lines.join('\n')}\n`;
}

function pad(n: number): string {
  return String(n).padStart(2, '0');
}

function calendar(mjd: number): { year: number; month: number; dayOfMonth: number } {
  // Only the night's date and the next are needed here.
  return mjd === NIGHT_MJD ? { year: 2021, month: 11, dayOfMonth: 20 } : { year: 2021, month: 11, dayOfMonth: 21 };
}
