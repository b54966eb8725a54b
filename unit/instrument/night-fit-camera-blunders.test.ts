import { describe, expect, it } from 'vitest';
import { ARCSEC, DEG, SECOND_OF_TIME_ANGLE } from '../../core/units.ts';
import { exactTransitCorrectionRad } from '../../core/instrument/exact-crossing.ts';
import { fitNightTransits } from '../../core/instrument/night-transit-fit.ts';
import type { NightTransit } from '../../core/instrument/night-transit-fit.ts';
import { reduceCameraCrossing } from '../../core/instrument/fixed-camera.ts';
import { blunderHints } from '../../core/instrument/blunder-hints.ts';
import type { BlunderContext } from '../../core/instrument/blunder-hints.ts';
import { diurnalAberrationCorrectionRad, DIURNAL_ABERRATION_CONSTANT_RAD } from '../../core/instrument/diurnal-aberration.ts';
import { seededRandom } from './seeded-random.ts';

const PHI = 47.3 * DEG;

/** Simulates one night with the exact crossing geometry and a drifting sidereal clock. */
function simulateNight(seed: number, truth: { a: number; b: number; c: number; offset: number; rate: number }, noiseS: number): NightTransit[] {
  const random = seededRandom(seed);
  const transits: NightTransit[] = [];
  for (let k = 0; k < 24; k++) {
    const lower = k % 6 === 5;
    const dec = lower ? (60 + 28 * random.uniform()) * DEG : (-30 + 115 * random.uniform()) * DEG;
    const clamp = k < 12 ? 'west' : 'east';
    const culmination = lower ? 'lower' : 'upper';
    const raS = 60_000 + k * 900 + random.uniform() * 300;
    const tau = exactTransitCorrectionRad({ azimuthRad: truth.a, levelRad: truth.b, collimationRad: truth.c }, PHI, dec, culmination, clamp) / SECOND_OF_TIME_ANGLE;
    const siderealTime = raS + (lower ? 43_200 : 0) - tau;
    // Clock reading T with T + offset + rate (T − 66000) = θ, solved by iteration (the rate is tiny).
    let clock = siderealTime - truth.offset;
    for (let i = 0; i < 3; i++) clock = siderealTime - truth.offset - truth.rate * (clock - 66_000);
    const noise = (noiseS / Math.abs(Math.cos(dec))) * random.normal();
    transits.push({ rightAscensionS: raS, declinationRad: dec, clockTimeS: clock + noise, culmination, clamp, levelRad: truth.b, weight: Math.cos(dec) ** 2 });
  }
  return transits;
}

describe('fitNightTransits: simulate a night with known a, b, c, clock offset and rate, then recover them', () => {
  it('recovers every parameter within 4 formal errors on one night, and pulls have unit width over 150 nights', () => {
    const pulls: number[][] = [[], [], [], []];
    const random = seededRandom(99);
    for (let night = 0; night < 150; night++) {
      const truth = {
        a: 0.8 * random.normal() * SECOND_OF_TIME_ANGLE,
        b: 0.3 * random.normal() * SECOND_OF_TIME_ANGLE,
        c: 0.4 * random.normal() * SECOND_OF_TIME_ANGLE,
        offset: 3 * random.normal(),
        rate: 2e-6 * random.normal(),
      };
      const fit = fitNightTransits(simulateNight(1000 + night, truth, 0.02), PHI);
      const offsetAtFitRef = truth.offset + truth.rate * (fit.referenceClockS - 66_000);
      const values = [
        (fit.clockOffsetS - offsetAtFitRef) / fit.sigmas.clockOffsetS,
        (fit.clockRateSPerS - truth.rate) / fit.sigmas.clockRateSPerS,
        (fit.azimuthS - truth.a / SECOND_OF_TIME_ANGLE) / fit.sigmas.azimuthS,
        (fit.collimationS - truth.c / SECOND_OF_TIME_ANGLE) / fit.sigmas.collimationS,
      ];
      values.forEach((v, i) => pulls[i].push(v));
      if (night === 0) for (const v of values) expect(Math.abs(v)).toBeLessThan(4);
    }
    for (const p of pulls) {
      const rms = Math.sqrt(p.reduce((s, v) => s + v * v, 0) / p.length);
      expect(rms).toBeGreaterThan(0.8);
      expect(rms).toBeLessThan(1.2);
    }
  });
});

describe('diurnal aberration', () => {
  it('the constant is 0.320″ = 0.0213 s (Smart, Spherical Astronomy: 0.32″, 0.021 s cos φ sec δ)', () => {
    expect(DIURNAL_ABERRATION_CONSTANT_RAD / ARCSEC).toBeCloseTo(0.32, 2);
    expect(DIURNAL_ABERRATION_CONSTANT_RAD / SECOND_OF_TIME_ANGLE).toBeCloseTo(0.0213, 4);
  });
  it('is negative at upper and positive at lower culmination (the star is displaced toward the east point)', () => {
    const upper = diurnalAberrationCorrectionRad(PHI, 20 * DEG, 'upper') / SECOND_OF_TIME_ANGLE;
    expect(upper).toBeCloseTo((-0.02133 * Math.cos(PHI)) / Math.cos(20 * DEG), 4);
    expect(diurnalAberrationCorrectionRad(PHI, 80 * DEG, 'lower')).toBeGreaterThan(0);
  });
});

describe('reduceCameraCrossing', () => {
  const camera = { scaleArcsecPerPx: 1.5, orientationDeg: 0, parity: 1 as const, opticalCentrePx: [1024, 1024] as const, referenceColumnPx: 1124 };
  it('a reference line 100 px = 150″ = 10 s ahead of the meridian at δ = 0 is crossed 10 s after transit (sidereal clock)', () => {
    const r = reduceCameraCrossing(5000, 1024, 0, camera, 'sidereal');
    expect(r.meridianTimeS).toBeCloseTo(4990, 9);
    expect(r.zenithOffsetRad).toBeCloseTo(0, 15);
  });
  it('a rotated detector mixes the row offset into the along-track offset (orientation 90°)', () => {
    const r = reduceCameraCrossing(5000, 1124, 0, { ...camera, orientationDeg: 90, referenceColumnPx: 1024 }, 'sidereal');
    expect(r.alongTrackRad / ARCSEC).toBeCloseTo(150, 9);
    expect(r.zenithOffsetRad).toBeCloseTo(0, 15);
  });
});

describe('blunderHints: planted blunders are named with the right cause', () => {
  const base: BlunderContext = {
    timeResidualS: null,
    timeSigmaS: 0.03,
    zenithResidualRad: null,
    zenithSigmaRad: 0.3 * ARCSEC,
    declinationRad: 40 * DEG,
    adjacentWireSpacingsS: [8.5],
    observedWireCount: 5,
    micrometerRadPerTurn: 50 * ARCSEC,
    otherCulminationResidualS: null,
    otherStarResidualsS: [],
  };
  it('a wire entered against its neighbour', () => {
    const hints = blunderHints({ ...base, timeResidualS: (8.5 / Math.cos(40 * DEG)) / 5 + 0.01 });
    expect(hints[0].cause).toBe('wire-miscounted');
  });
  it('a micrometer turn miscounted', () => {
    const hints = blunderHints({ ...base, zenithResidualRad: -50 * ARCSEC + 0.2 * ARCSEC });
    expect(hints[0].cause).toBe('micrometer-turn-miscounted');
    expect(hints[0].expected).toBeCloseTo(-50 * ARCSEC, 15);
  });
  it('a clock a whole minute or second off', () => {
    expect(blunderHints({ ...base, timeResidualS: 60.02 })[0].cause).toBe('clock-whole-minute');
    expect(blunderHints({ ...base, timeResidualS: -0.98 })[0].cause).toBe('clock-whole-second');
  });
  it('wrong culmination and wrong star when their predictions fit', () => {
    expect(blunderHints({ ...base, timeResidualS: 431.7, otherCulminationResidualS: 0.02 })[0].cause).toBe('wrong-culmination');
    const star = blunderHints({ ...base, timeResidualS: 127.3, otherStarResidualsS: [{ starId: 'V-17', residualS: 5 }, { starId: 'V-22', residualS: -0.01 }] });
    expect(star[0].cause).toBe('wrong-star');
    expect(star[0].detail).toMatch(/V-22/);
    expect(star.some((h) => h.detail.includes('V-17'))).toBe(false);
  });
  it('a small residual gets no hint at all', () => {
    expect(blunderHints({ ...base, timeResidualS: 0.05, zenithResidualRad: 0.4 * ARCSEC })).toEqual([]);
  });
});

describe('reduceCameraCrossing against the exact sphere', () => {
  it('δ = 60°, mean-solar clock: the star at the crossing lies ξ from the meridian plane, and meridian time follows', () => {
    const camera = { scaleArcsecPerPx: 2, orientationDeg: 30, parity: -1 as const, opticalCentrePx: [500, 400] as const, referenceColumnPx: 380 };
    const dec = 60 * DEG;
    const r = reduceCameraCrossing(1000, 450, dec, camera, 'mean-solar');
    // Hand evaluation of the mapping: dx = −1·(380 − 500) = 120 px, dy = 50 px, θ = 30°:
    // ξ = 2″(120 cos 30° + 50 sin 30°) = 257.846″, η = 2″(−120 sin 30° + 50 cos 30°) = −33.397″.
    expect(r.alongTrackRad / ARCSEC).toBeCloseTo(257.8461, 3);
    expect(r.zenithOffsetRad / ARCSEC).toBeCloseTo(-33.3975, 3);
    const hourAngle = ((1000 - r.meridianTimeS) * 1.002737811911354) * SECOND_OF_TIME_ANGLE;
    // Distance of the star at that hour angle from the meridian plane: asin(cos δ sin h) must equal ξ.
    expect(Math.abs(Math.asin(Math.cos(dec) * Math.sin(hourAngle)) - r.alongTrackRad)).toBeLessThan(1e-12);
  });
});
