import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { ARCSEC, DEG, MAS, UAS } from '../../core/units.ts';
import {
  declinationFromZenithDistance,
  meridianZenithDistance,
  trueZenithDistanceRad,
  zenithDistanceFromReading,
} from '../../core/instrument/zenith-distance.ts';
import { horrebowTalcottLatitude } from '../../core/instrument/horrebow-talcott.ts';
import { seededRandom } from './seeded-random.ts';

interface TalcottCase {
  latitudeRad: number;
  southDeclinationRad: number;
  northDeclinationRad: number;
  southZenithDistanceRad: number;
  northZenithDistanceRad: number;
}
const fixturePath = new URL('../fixtures/erfa_instrument.json', import.meta.url);
function talcottCases(): TalcottCase[] {
  try {
    return JSON.parse(readFileSync(fixturePath, 'utf8')).talcott;
  } catch (error) {
    throw new Error(`missing reference ${fixturePath.pathname}: run npm run fixtures (${String(error)})`);
  }
}

describe('declinationFromZenithDistance (meridian geometry: δ = φ − z south, φ + z north, 180° − φ − z below the pole)', () => {
  it('textbook cases (Smart, Spherical Astronomy, meridian altitudes): φ = 52°', () => {
    const phi = 52 * DEG;
    expect(declinationFromZenithDistance(30 * DEG, phi, 'upper', 'south') / DEG).toBeCloseTo(22, 12);
    expect(declinationFromZenithDistance(10 * DEG, phi, 'upper', 'north') / DEG).toBeCloseTo(62, 12);
    // Polaris-like star δ = 89° below the pole: altitude φ − 1° = 51°, z = 39°.
    expect(declinationFromZenithDistance(39 * DEG, phi, 'lower', 'north') / DEG).toBeCloseTo(89, 12);
    // Southern observer φ = −34°, star δ = −80° below the south pole: altitude 24°, z = 66°.
    expect(declinationFromZenithDistance(66 * DEG, -34 * DEG, 'lower', 'south') / DEG).toBeCloseTo(-80, 12);
  });
  it('inverts meridianZenithDistance for random stars in both culminations (exact)', () => {
    const random = seededRandom(3);
    for (let k = 0; k < 2000; k++) {
      const phi = (random.uniform() * 170 - 85) * DEG;
      const lower = random.uniform() < 0.5;
      const dec = lower ? Math.sign(phi || 1) * (90 - random.uniform() * Math.abs(phi / DEG) * 0.99) * DEG : (random.uniform() * 180 - 90) * DEG;
      const culmination = lower ? 'lower' : 'upper';
      const { zenithDistanceRad, side } = meridianZenithDistance(dec, phi, culmination);
      expect(Math.abs(declinationFromZenithDistance(zenithDistanceRad, phi, culmination, side) - dec)).toBeLessThan(1e-14);
    }
  });
  it('refuses the wrong side with a message', () => {
    expect(() => declinationFromZenithDistance(80 * DEG, 52 * DEG, 'upper', 'north')).toThrow(/check the side/);
  });
});

describe('zenith-distance readings', () => {
  it('turns → z through zero point, scale and sense; flexure f sin z and refraction added', () => {
    const scale = { zeroPointRad: 30 * DEG, scaleRadPerUnit: 50 * ARCSEC, sense: -1 as const };
    expect(zenithDistanceFromReading(2, scale)).toBeCloseTo(30 * DEG - 100 * ARCSEC, 15);
    const z = trueZenithDistanceRad(30 * DEG, 0.4 * ARCSEC, 33.6 * ARCSEC);
    expect((z - 30 * DEG) / ARCSEC).toBeCloseTo(0.2 + 33.6, 9);
    expect(() => trueZenithDistanceRad(0.5, 0, -1e-6)).toThrow(/≥ 0/);
  });
});

describe('horrebowTalcottLatitude', () => {
  it('recovers the latitude from ERFA zenith distances (eraHd2ae) with a simulated micrometer, level and refraction', () => {
    const cases = talcottCases();
    expect(cases.length).toBeGreaterThanOrEqual(20);
    const turn = 40 * ARCSEC;
    for (const c of cases) {
      // The tube is set midway; the micrometer reads the offset of each star from the tube axis, the tube tilted by
      // level τ (objective end high) differently at the two pointings; refraction lifts each star by r.
      const rS = 60 * ARCSEC * Math.tan(c.southZenithDistanceRad);
      const rN = 60 * ARCSEC * Math.tan(c.northZenithDistanceRad);
      const setting = (c.southZenithDistanceRad + c.northZenithDistanceRad) / 2;
      const tauS = 0.8 * ARCSEC;
      const tauN = -1.1 * ARCSEC;
      const mS = (c.southZenithDistanceRad - rS - (setting - tauS)) / turn + 25; // sense +1, 25 turns at the axis
      const mN = (c.northZenithDistanceRad - rN - (setting - tauN)) / turn + 25;
      const d = 1.9; // arcsec per division; objective end high by τ: south pointing s − n = 2τ/d, north n − s = 2τ/d
      const result = horrebowTalcottLatitude({
        southDeclinationRad: c.southDeclinationRad,
        northDeclinationRad: c.northDeclinationRad,
        southMicrometerTurns: mS,
        northMicrometerTurns: mN,
        micrometerRadPerTurn: turn,
        micrometerSense: 1,
        southLevel: { northDiv: 10 - tauS / ARCSEC / d, southDiv: 10 + tauS / ARCSEC / d },
        northLevel: { northDiv: 10 + tauN / ARCSEC / d, southDiv: 10 - tauN / ARCSEC / d },
        levelDivisionArcsec: d,
        southRefractionRad: rS,
        northRefractionRad: rN,
      });
      expect(Math.abs(result.latitudeRad - c.latitudeRad), `want ${c.latitudeRad} got ${result.latitudeRad}`).toBeLessThan(1 * UAS);
      // Objective end high lowers the zenith distance of the pointing: the level term is ½(τ_N − τ_S).
      expect(Math.abs(result.levelTermRad - (tauN - tauS) / 2)).toBeLessThan(1e-3 * MAS);
    }
  });
  it('hand example (from memory of the USC&GS form; values invented): terms add as published', () => {
    const r = horrebowTalcottLatitude({
      southDeclinationRad: 38 * DEG,
      northDeclinationRad: 40 * DEG,
      southMicrometerTurns: 20,
      northMicrometerTurns: 10,
      micrometerRadPerTurn: 40 * ARCSEC,
      micrometerSense: 1,
      southLevel: { northDiv: 12, southDiv: 10 },
      northLevel: { northDiv: 11, southDiv: 11 },
      levelDivisionArcsec: 2,
      southRefractionRad: 20 * ARCSEC,
      northRefractionRad: 19 * ARCSEC,
    });
    // ½(38° + 40°) = 39°; ½·40″·10 = 200″; (2/4)(12 + 11 − 10 − 11) = 1″; ½(20 − 19) = 0.5″.
    expect((r.latitudeRad - 39 * DEG) / ARCSEC).toBeCloseTo(201.5, 9);
  });
});
