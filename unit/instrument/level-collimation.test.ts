import { describe, expect, it } from 'vitest';
import { ARCSEC, DEG, SECOND_OF_TIME_ANGLE } from '../../core/units.ts';
import { levelFromStridingReadings } from '../../core/instrument/striding-level.ts';
import {
  collimationFromCollimator,
  collimationFromNadir,
  collimationFromReversal,
  levelFromNadir,
  nadirLevelMinusCollimationRad,
} from '../../core/instrument/collimation.ts';
import { mayerCorrectionRad, mayerFactors } from '../../core/instrument/mayer.ts';

describe('levelFromStridingReadings', () => {
  it('Burton (1903) p. 32: direct 15 E, 13 W; reversed 14.5 E, 13.5 W → 3/4 division, east end high', () => {
    const b = levelFromStridingReadings({
      direct: [{ westDiv: 13, eastDiv: 15 }],
      reversed: [{ westDiv: 13.5, eastDiv: 14.5 }],
      divisionArcsec: 1,
    });
    expect(b / ARCSEC).toBeCloseTo(-0.75, 12);
  });
  it('scales with the division value and averages several settings', () => {
    const b = levelFromStridingReadings({
      direct: [{ westDiv: 10, eastDiv: 8 }, { westDiv: 10.4, eastDiv: 7.6 }],
      reversed: [{ westDiv: 9, eastDiv: 9 }, { westDiv: 9.2, eastDiv: 8.8 }],
      divisionArcsec: 1.8,
    });
    // Σw − Σe = 38.6 − 33.4 = 5.2 over 8 end readings → 0.65 div → 1.17″ (hand computation).
    expect(b / ARCSEC).toBeCloseTo(1.17, 12);
  });
  it('refuses unmatched direct and reversed counts', () => {
    expect(() => levelFromStridingReadings({ direct: [{ westDiv: 1, eastDiv: 1 }], reversed: [], divisionArcsec: 1 })).toThrow(/same non-zero number/);
  });
});

describe('collimation', () => {
  it('from reversal recovers the c used to simulate both clamp positions (Mayer’s formula)', () => {
    const phi = 48 * DEG;
    const dec = 86 * DEG;
    const truth = { azimuthRad: 0.3 * SECOND_OF_TIME_ANGLE, levelRad: 0, collimationRad: 0.17 * SECOND_OF_TIME_ANGLE };
    const f = mayerFactors(phi, dec, 'upper');
    const alpha = 1.0;
    const bWest = 0.05 * SECOND_OF_TIME_ANGLE;
    const bEast = -0.08 * SECOND_OF_TIME_ANGLE;
    const thetaWest = alpha - mayerCorrectionRad({ ...truth, levelRad: bWest }, f, 'west');
    const thetaEast = alpha - mayerCorrectionRad({ ...truth, levelRad: bEast }, f, 'east');
    const c = collimationFromReversal(thetaWest, thetaEast, bWest, bEast, f.levelFactor, f.collimationFactor);
    expect(Math.abs(c - truth.collimationRad)).toBeLessThan(1e-15);
  });

  it('from a collimator: the collimator direction cancels, c from the mean of the two settings', () => {
    // Micrometer value 2″/turn, sense +1, mean-wire reading 10 turns; true c = +1.5″.
    // Clamp west: c + (M_W − 10)·2″ = γ; clamp east: −c − (M_E − 10)·2″ = γ, for any collimator direction γ.
    const scale = 2 * ARCSEC;
    const c = 1.5 * ARCSEC;
    for (const gamma of [0, 3 * ARCSEC, -7 * ARCSEC]) {
      const mWest = 10 + (gamma - c) / scale;
      const mEast = 10 + (-gamma - c) / scale;
      expect(collimationFromCollimator(mWest, mEast, 10, scale, 1)).toBeCloseTo(c, 18);
    }
  });

  it('mercury nadir: the reflected image geometry gives b − c (vector check with a mirror)', () => {
    // Frame (S, E, Z). West end of axis W′ = −E cos b + Z sin b; line of sight L ⟂ to it up to c, near the nadir.
    const b = 2.3 * ARCSEC;
    const c = -0.9 * ARCSEC;
    const w: [number, number, number] = [0, -Math.cos(b), Math.sin(b)];
    // L at the nadir side: L·W′ = −sin c, in the E–Z plane: L = (0, sin ε, −cos ε) with −sin ε cos b − cos ε sin b = −sin c.
    const epsilon = Math.asin(Math.sin(c)) - b; // solves sin(ε + b) = sin c  →  ε = c − b (exact)
    const line: [number, number, number] = [0, Math.sin(epsilon), -Math.cos(epsilon)];
    expect(line[0] * w[0] + line[1] * w[1] + line[2] * w[2]).toBeCloseTo(-Math.sin(c), 15);
    // The mercury mirror (horizontal) sends the returning ray to (Lx, Ly, −Lz): seen in the telescope the image of
    // the wire lies at the reflection of L about the nadir; displacement image − wire toward west (−E) is:
    const imageMinusWireWest = -(-line[1] - line[1]); // image E-component −Ly, wire Ly; westward = −(ΔE)
    const nadir = nadirLevelMinusCollimationRad(Math.asin(imageMinusWireWest / 1));
    expect(nadir / ARCSEC).toBeCloseTo((b - c) / ARCSEC, 9);
    expect(levelFromNadir(nadir, c, 'west') / ARCSEC).toBeCloseTo(b / ARCSEC, 9);
    expect(collimationFromNadir(nadir, b, 'west') / ARCSEC).toBeCloseTo(c / ARCSEC, 9);
    expect(collimationFromNadir(b + c, b, 'east') / ARCSEC).toBeCloseTo(c / ARCSEC, 9);
  });
});
