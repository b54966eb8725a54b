// A forward model of one night at an invented fixed zenith camera for the reduction's tests: the
// star's place from core/astrometry's predicted passage (full model, geometric), refraction by its
// inverse, the instrument's meridian displaced by the EXACT line-of-sight correction
// (exact-crossing.ts), then the star's position on the sphere at each hour angle projected
// gnomonically about the optical axis (the exact central projection of a camera, not the
// reduction's first-order tangent-plane form) and mapped to pixels through orientation and parity.
// The crossing of the reference column is found by Newton's method. Everything is invented.
import { iauEarthOrientation } from '../../core/astrometry/iau-earth-orientation.ts';
import { observedFromTrueZenith } from '../../core/astrometry/refraction.ts';
import { refractionConstants } from '../../core/astrometry/refraction-constants.ts';
import { starMotion } from '../../core/astrometry/space-motion.ts';
import { predictTransit } from '../../core/astrometry/transit.ts';
import type { TransitPrediction } from '../../core/astrometry/transit.ts';
import { exactTransitCorrectionRad } from '../../core/instrument/exact-crossing.ts';
import { catalogueStarOf } from '../../core/reduction/star-predictions.ts';
import type { StarListRow } from '../../core/formats/star-list.ts';
import { ARCSEC, DEG, SECOND_OF_TIME_ANGLE } from '../../core/units.ts';
import { seededRandom } from '../instrument/seeded-random.ts';
import { instantFromUtc, NIGHT, NIGHT_MJD, nightSeconds, SITE } from './forward-night.ts';

export interface CameraSetup {
  readonly orientationDeg: number;
  readonly parity: 1 | -1;
  readonly opticalCentrePx: readonly [number, number];
  readonly referenceColumnPx: number;
  readonly arcsecPerPx: number;
}

export interface CameraTruth {
  readonly azimuthArcsec: number;
  readonly levelArcsec: number;
  readonly collimationArcsec: number;
  /** UTC = clock + offset (the rate is 0 in these nights). */
  readonly clockOffsetS: number;
  /** Observed zenith distance of the optical axis on the meridian, arcsec (the reduction's zenithZeroArcsec). */
  readonly zenithZeroArcsec: number;
}

/** Invented zenith stars 0.12°–0.49° south of the zenith (south also after precession to the night) of the site, passing 18 h – 5 h UTC. */
export const CAMERA_STARS: readonly StarListRow[] = Array.from({ length: 18 }, (_, k) => ({
  row: k + 1, line: k + 2, id: `ZC-${String(k + 1).padStart(2, '0')}`, label: '', raDeg: (344 + 7.1 * k) % 360, decDeg: SITE.latitudeDeg - 0.12 - ((k * 7) % 18) * 0.0216,
  epochJyear: 2016, pmRaCosDecMasYr: 0, pmDecMasYr: 0, parallaxMas: 0, parallaxSigmaMas: null, radialVelocityKmS: null, magnitude: null, source: 'invented for tests', programmes: [],
}));

export const CAMERA_STAR_CSV = ['id,label,raDeg,decDeg,epochJyear,pmRaCosDecMasYr,pmDecMasYr,parallaxMas,parallaxSigmaMas,radialVelocityKmS,magnitude,source,programme',
  ...CAMERA_STARS.map((s) => `${s.id},invented ${s.id},${s.raDeg},${s.decDeg},2016.0,0,0,0,,,7.0,invented for tests,zenith`)].join('\n') + '\n';

export function cameraSiteJson(camera: CameraSetup): string {
  return JSON.stringify({
    formatVersion: 1, site: SITE,
    instruments: [{
      id: 'zc-1', label: 'Zenith camera (invented)', kind: 'fixed-camera', zenithScale: { unit: 'pixel', arcsecPerUnit: camera.arcsecPerPx, sense: 1 },
      wireIntervalsS: [], effectiveWavelengthUm: 0.64, clockId: 'clock-z', clockTimeScale: 'mean-solar', events: [],
      camera: { orientationDeg: camera.orientationDeg, parity: camera.parity, opticalCentrePx: camera.opticalCentrePx, referenceColumnPx: camera.referenceColumnPx },
    }],
  });
}

const ONE_UTC_SECOND_RAD = 1.002737811911354 * SECOND_OF_TIME_ANGLE;
const passages = new Map<string, TransitPrediction>();

function passage(star: StarListRow): TransitPrediction {
  let p = passages.get(star.id);
  if (p === undefined) {
    const site = { latitudeRad: SITE.latitudeDeg * DEG, longitudeRad: SITE.longitudeDeg * DEG, heightM: SITE.heightM };
    p = predictTransit(starMotion(catalogueStarOf(star)), site, null, { jd1: 2_400_000.5 + NIGHT_MJD, jd2: 0.5 }, 'upper', instantFromUtc, iauEarthOrientation);
    passages.set(star.id, p);
  }
  return p;
}

/** Pixel column and row of a star at instrument hour angle `hourAngleRad` (west +), observed declination `decRad`. */
function pixelAt(hourAngleRad: number, decRad: number, axisDecRad: number, camera: CameraSetup): { x: number; y: number } {
  // Hour-angle frame: x to the meridian on the equator, y to the east point, z to the pole.
  const s = [Math.cos(decRad) * Math.cos(hourAngleRad), -Math.cos(decRad) * Math.sin(hourAngleRad), Math.sin(decRad)];
  const axis = [Math.cos(axisDecRad), 0, Math.sin(axisDecRad)];
  const south = [Math.sin(axisDecRad), 0, -Math.cos(axisDecRad)];
  const along = s[0] * axis[0] + s[2] * axis[2];
  const xi = -s[1] / along; // west
  const eta = (s[0] * south[0] + s[2] * south[2]) / along; // toward larger zenith distance (south)
  const k = camera.arcsecPerPx * ARCSEC, th = camera.orientationDeg * DEG;
  const X = (Math.cos(th) * xi - Math.sin(th) * eta) / k;
  const Y = (Math.sin(th) * xi + Math.cos(th) * eta) / k;
  return { x: camera.opticalCentrePx[0] + camera.parity * X, y: camera.opticalCentrePx[1] + Y };
}

/** The night's transit log CSV: one reference-column crossing (clock s) and row offset per star, with noise. */
export function cameraNightCsv(camera: CameraSetup, truth: CameraTruth, seed: number, timeNoiseS: number, rowNoiseArcsec: number): string {
  const random = seededRandom(seed);
  const latitudeRad = SITE.latitudeDeg * DEG;
  const constants = { azimuthRad: truth.azimuthArcsec * ARCSEC, levelRad: truth.levelArcsec * ARCSEC, collimationRad: truth.collimationArcsec * ARCSEC };
  const axisDecRad = latitudeRad - truth.zenithZeroArcsec * ARCSEC;
  const lines = CAMERA_STARS.map((star, index) => {
    const p = passage(star);
    const dec = p.place.topocentricDeclinationRad;
    const weather = { temperatureC: 4 - index * 0.2, pressureHpa: 921, relativeHumidity: 0.6, wavelengthUm: 0.64 };
    const observedZenith = observedFromTrueZenith(p.place.topocentricZenithRad, refractionConstants(weather));
    const observedDec = latitudeRad - observedZenith;
    const meridianUtcS = nightSeconds(p.utc) - exactTransitCorrectionRad(constants, latitudeRad, dec, 'upper', 'west') / ONE_UTC_SECOND_RAD;
    let hourAngle = 0;
    for (let i = 0; i < 30; i++) {
      const f = pixelAt(hourAngle, observedDec, axisDecRad, camera).x - camera.referenceColumnPx;
      const slope = (pixelAt(hourAngle + 1e-6, observedDec, axisDecRad, camera).x - pixelAt(hourAngle - 1e-6, observedDec, axisDecRad, camera).x) / 2e-6;
      hourAngle -= f / slope;
      if (Math.abs(f) < 1e-9) break;
    }
    const rowPx = pixelAt(hourAngle, observedDec, axisDecRad, camera).y + (rowNoiseArcsec * random.normal()) / camera.arcsecPerPx;
    const clockS = meridianUtcS + hourAngle / ONE_UTC_SECOND_RAD - truth.clockOffsetS + timeNoiseS * random.normal();
    return [star.id, 'upper', '', NIGHT, 'zc-1', 'QX', clockS.toFixed(5), (rowPx - camera.opticalCentrePx[1]).toFixed(4), weather.temperatureC.toFixed(1), weather.pressureHpa, 60, '', ''].join(',');
  });
  return `starId,culmination,clamp,nightDate,instrumentId,observer,wire1ClockS,offsetPx,temperatureC,pressureHpa,humidityPercent,flags,note\n${lines.join('\n')}\n`;
}
