import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { ARCSEC, DEG, MAS, SECOND_OF_TIME_ANGLE, UAS } from '../../core/units.ts';
import { mayerCorrectionRad, mayerFactors } from '../../core/instrument/mayer.ts';
import { exactTransitCorrectionRad } from '../../core/instrument/exact-crossing.ts';
import {
  besselCorrectionRad,
  besselToMayer,
  hansenCorrectionRad,
  hansenToMayer,
  mayerToBessel,
  mayerToHansen,
} from '../../core/instrument/instrument-forms.ts';
import type { Culmination } from '../../core/instrument/culmination.ts';
import { seededRandom } from './seeded-random.ts';

interface TransitCase {
  latitudeRad: number;
  declinationRad: number;
  culmination: Culmination;
  azimuthRad: number;
  levelRad: number;
  collimationRad: number;
  exactCorrectionRad: number;
}

const fixturePath = new URL('../fixtures/erfa_instrument.json', import.meta.url);
function loadFixture(): { header: Record<string, unknown>; transit: TransitCase[] } {
  try {
    return JSON.parse(readFileSync(fixturePath, 'utf8'));
  } catch (error) {
    throw new Error(`missing reference ${fixturePath.pathname}: run npm run fixtures (${String(error)})`);
  }
}

describe('exactTransitCorrectionRad against ERFA geometry (eraAe2hd + eraSeps, bisection)', () => {
  const fixture = loadFixture();
  it('fixture names ERFA and its version', () => {
    expect(fixture.header.source).toBe('ERFA via python3-erfa');
    expect(typeof fixture.header.pyerfaVersion).toBe('string');
    expect(fixture.transit.length).toBeGreaterThanOrEqual(40);
  });
  it('matches the ERFA crossing to 1 µas, upper and lower culmination', () => {
    for (const c of fixture.transit) {
      const got = exactTransitCorrectionRad(c, c.latitudeRad, c.declinationRad, c.culmination, 'west');
      expect(Math.abs(got - c.exactCorrectionRad), `want ${c.exactCorrectionRad} got ${got}`).toBeLessThan(1 * UAS / Math.cos(c.declinationRad));
    }
  });
  it("Mayer's first-order formula agrees with ERFA within its second-order bound", () => {
    for (const c of fixture.transit) {
      const f = mayerFactors(c.latitudeRad, c.declinationRad, c.culmination);
      const got = mayerCorrectionRad(c, f, 'west');
      const size = Math.abs(c.azimuthRad) + Math.abs(c.levelRad) + Math.abs(c.collimationRad);
      const secant = Math.abs(1 / Math.cos(c.declinationRad));
      // Second-order terms are O(size² sec² δ) (derivation in exact-crossing.ts): bound with margin 2.
      expect(Math.abs(got - c.exactCorrectionRad)).toBeLessThan(2 * size * size * secant * secant + 1 * UAS);
    }
  });
});

describe('mayerFactors', () => {
  it('lower culmination equals δ → 180° − δ: A = sin(φ+δ) sec δ, B = cos(φ+δ) sec δ, C = −sec δ (Chauvenet vol. II)', () => {
    const phi = 52 * DEG;
    const dec = 75 * DEG;
    const f = mayerFactors(phi, dec, 'lower');
    expect(f.azimuthFactor).toBeCloseTo(Math.sin(phi + dec) / Math.cos(dec), 12);
    expect(f.levelFactor).toBeCloseTo(Math.cos(phi + dec) / Math.cos(dec), 12);
    expect(f.collimationFactor).toBeCloseTo(-1 / Math.cos(dec), 12);
  });
  it('a star at the zenith has A = 0, B = C = sec φ (the level acts fully at the zenith)', () => {
    const phi = 40 * DEG;
    const f = mayerFactors(phi, phi, 'upper');
    expect(f.azimuthFactor).toBe(0);
    expect(f.levelFactor).toBeCloseTo(1 / Math.cos(phi), 14);
  });
  it('hand computation (from memory of the method, not a published table): φ = 52°, δ = +20°, a = +0.50 s, b = −0.20 s, c = +0.10 s', () => {
    // Seven-figure table values: sin 32° = 0.529 919 3, cos 32° = 0.848 048 1, sec 20° = 1.064 177 8, so
    // A = 0.563 928 3, B = 0.902 474 0, C = 1.064 177 8 and
    // τ = 0.50·0.563 928 3 − 0.20·0.902 474 0 + 0.10·1.064 177 8 = 0.207 887 1 s.
    const f = mayerFactors(52 * DEG, 20 * DEG, 'upper');
    const constants = { azimuthRad: 0.5 * SECOND_OF_TIME_ANGLE, levelRad: -0.2 * SECOND_OF_TIME_ANGLE, collimationRad: 0.1 * SECOND_OF_TIME_ANGLE };
    expect(mayerCorrectionRad(constants, f, 'west') / SECOND_OF_TIME_ANGLE).toBeCloseTo(0.2078871, 6);
    expect(mayerCorrectionRad(constants, f, 'east') / SECOND_OF_TIME_ANGLE).toBeCloseTo(0.2078871 - 2 * 0.1064178, 6);
  });
  it('refuses a star at the pole with a message naming the cause', () => {
    expect(() => mayerFactors(0.9, Math.PI / 2, 'upper')).toThrow(/pole/);
  });
});

describe('Mayer ↔ Bessel ↔ Hansen', () => {
  const random = seededRandom(7);
  const cases = Array.from({ length: 500 }, () => ({
    phi: (random.uniform() * 160 - 80) * DEG,
    dec: (random.uniform() * 170 - 85) * DEG,
    culmination: (random.uniform() < 0.3 ? 'lower' : 'upper') as Culmination,
    mayer: { azimuthRad: (random.uniform() - 0.5) * 60 * ARCSEC, levelRad: (random.uniform() - 0.5) * 60 * ARCSEC, collimationRad: (random.uniform() - 0.5) * 60 * ARCSEC },
  }));
  it('round trips agree to 1e-12 (relative to the constants)', () => {
    for (const { phi, mayer } of cases) {
      const viaBessel = besselToMayer(mayerToBessel(mayer, phi), phi);
      const viaHansen = hansenToMayer(mayerToHansen(mayer, phi), phi);
      const scale = 60 * ARCSEC;
      for (const back of [viaBessel, viaHansen]) {
        expect(Math.abs(back.azimuthRad - mayer.azimuthRad) / scale).toBeLessThan(1e-12);
        expect(Math.abs(back.levelRad - mayer.levelRad) / scale).toBeLessThan(1e-12);
        expect(back.collimationRad).toBe(mayer.collimationRad);
      }
    }
  });
  it('all three forms give the same correction for every star (to 1e-12 of sec δ × constants)', () => {
    for (const { phi, dec, culmination, mayer } of cases) {
      const m = mayerCorrectionRad(mayer, mayerFactors(phi, dec, culmination), 'east');
      const b = besselCorrectionRad(mayerToBessel(mayer, phi), dec, culmination, -1);
      const h = hansenCorrectionRad(mayerToHansen(mayer, phi), phi, dec, culmination, -1);
      const scale = (60 * ARCSEC) / Math.abs(Math.cos(dec)) / Math.abs(Math.cos(phi));
      expect(Math.abs(m - b) / scale).toBeLessThan(1e-12);
      expect(Math.abs(m - h) / scale).toBeLessThan(1e-12);
    }
  });
  it('Bessel m, n for a pure level error: m = b cos φ, n = b sin φ (Smart, Spherical Astronomy)', () => {
    const phi = 30 * DEG;
    const bessel = mayerToBessel({ azimuthRad: 0, levelRad: 1 * MAS, collimationRad: 0 }, phi);
    expect(bessel.mRad).toBeCloseTo(Math.cos(phi) * MAS, 20);
    expect(bessel.nRad).toBeCloseTo(Math.sin(phi) * MAS, 20);
  });
});
