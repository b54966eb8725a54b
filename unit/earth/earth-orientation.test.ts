// Earth orientation against ERFA (IAU SOFA algorithms) through unit/fixtures/erfa_time.json,
// written by unit/fixtures/erfa_time.py; the ERFA version is in the fixture header.
import { describe, expect, it } from 'vitest';
import { transpose, type Mat3 } from '../../core/math/mat3.ts';
import { meanObliquity06 } from '../../core/earth/mean-obliquity-06.ts';
import { nutation00a, nutation00b, nutation06a } from '../../core/earth/nutation-series.ts';
import { polarMotionMatrix, polarMotionMatrixTirsToItrs, tioLocatorSPrime } from '../../core/earth/polar-motion.ts';
import { biasPrecessionMatrix06, biasPrecessionNutationMatrix06 } from '../../core/earth/precession-06.ts';
import { earthRotationAngle, gast06, gmst06 } from '../../core/earth/sidereal-time.ts';
import { equationOfEquinoxes06 } from '../../core/earth/equation-of-equinoxes-06.ts';
import { MAS, UAS } from '../../core/units.ts';
import { loadErfaTimeFixture } from '../time/erfa-fixture.ts';

const fixture = loadErfaTimeFixture();
const cases = fixture.earth.map((c) => ({ ...c, ttJd: { jd1: c.tt[0], jd2: c.tt[1] }, ut1Jd: { jd1: c.ut1[0], jd2: c.ut1[1] } }));
/** Difference of two angles folded into (−π, π]. */
const angleDiff = (a: number, b: number) => Math.atan2(Math.sin(a - b), Math.cos(a - b));
const worstOf = (values: number[]) => Math.max(...values.map(Math.abs));
const matrixWorst = (m: Mat3, reference: number[]) => worstOf(m.map((v, k) => v - reference[k]));

describe(`Earth orientation against ERFA ${fixture.header.erfaVersion}, ${cases.length} TT dates 1900–2100`, () => {
  it('earthRotationAngle(ut1) = era00 within 0.1 µas', () => {
    expect(worstOf(cases.map((c) => angleDiff(earthRotationAngle(c.ut1Jd), c.era00)))).toBeLessThan(0.1 * UAS);
  });

  it('gmst06(ut1, tt) = ERFA gmst06 within 0.1 µas', () => {
    expect(worstOf(cases.map((c) => angleDiff(gmst06(c.ut1Jd, c.ttJd), c.gmst06)))).toBeLessThan(0.1 * UAS);
  });

  it('nutation00a = ERFA nut00a within 0.01 µas (full 1365-term series)', () => {
    expect(worstOf(cases.map((c) => nutation00a(c.ttJd).dpsiRad - c.nut00a[0]))).toBeLessThan(0.01 * UAS);
    expect(worstOf(cases.map((c) => nutation00a(c.ttJd).depsRad - c.nut00a[1]))).toBeLessThan(0.01 * UAS);
  });

  it('nutation06a = ERFA nut06a within 0.01 µas', () => {
    expect(worstOf(cases.map((c) => nutation06a(c.ttJd).dpsiRad - c.nut06a[0]))).toBeLessThan(0.01 * UAS);
    expect(worstOf(cases.map((c) => nutation06a(c.ttJd).depsRad - c.nut06a[1]))).toBeLessThan(0.01 * UAS);
  });

  it('nutation00b = ERFA nut00b within 0.01 µas', () => {
    expect(worstOf(cases.map((c) => nutation00b(c.ttJd).dpsiRad - c.nut00b[0]))).toBeLessThan(0.01 * UAS);
    expect(worstOf(cases.map((c) => nutation00b(c.ttJd).depsRad - c.nut00b[1]))).toBeLessThan(0.01 * UAS);
  });

  it('nutation00b moves the pole within 1 mas of 2000A in 1995–2050 (McCarthy & Luzum 2003: Δψ sin ε and Δε)', () => {
    const recent = cases.filter((c) => c.tt[1] > -1826 && c.tt[1] < 18262);
    expect(recent.length).toBeGreaterThan(10);
    const sinObliquity = Math.sin(84381.406 * (MAS * 1000)); // ε0 = 84381.406″ (IAU 2006)
    expect(worstOf(recent.map((c) => (nutation00b(c.ttJd).dpsiRad - c.nut00a[0]) * sinObliquity))).toBeLessThan(1 * MAS);
    expect(worstOf(recent.map((c) => nutation00b(c.ttJd).depsRad - c.nut00a[1]))).toBeLessThan(1 * MAS);
  });

  it('meanObliquity06 = ERFA obl06 within 0.001 µas', () => {
    expect(worstOf(cases.map((c) => meanObliquity06(c.ttJd) - c.obl06))).toBeLessThan(0.001 * UAS);
  });

  it('biasPrecessionMatrix06 = ERFA pmat06 and the nutation matrix = pnm06a, per element within 1e-14', () => {
    expect(worstOf(cases.map((c) => matrixWorst(biasPrecessionMatrix06(c.ttJd), c.pmat06)))).toBeLessThan(1e-14);
    expect(worstOf(cases.map((c) => matrixWorst(biasPrecessionNutationMatrix06(c.ttJd, nutation06a(c.ttJd)), c.pnm06a)))).toBeLessThan(1e-14);
  });

  it('gast06 with nutation06a is within 5 µas of ERFA gst06a (CIO-based); brief allows 0.2 ms of time = 3 mas', () => {
    const gastError = worstOf(cases.map((c) => angleDiff(gast06(c.ut1Jd, c.ttJd, nutation06a(c.ttJd)), c.gst06a)));
    const eeError = worstOf(cases.map((c) => equationOfEquinoxes06(c.ttJd, nutation06a(c.ttJd)) - c.ee06a));
    expect(gastError).toBeLessThan(5 * UAS);
    expect(eeError).toBeLessThan(5 * UAS);
  });

  it("tioLocatorSPrime = ERFA sp00 and polarMotionMatrixTirsToItrs = ERFA pom00 within 1e-15", () => {
    expect(worstOf(cases.map((c) => tioLocatorSPrime(c.ttJd) - c.sp00))).toBeLessThan(1e-18);
    expect(worstOf(cases.map((c) => matrixWorst(polarMotionMatrixTirsToItrs(c.xpRad, c.ypRad, c.sp00), c.pom00)))).toBeLessThan(1e-15);
    // IERS Conventions 2010 eq. 5.3: W (ITRS → TIRS) is the transpose of pom00.
    const c = cases[0];
    expect(matrixWorst(transpose(polarMotionMatrix(c.xpRad, c.ypRad, c.sp00)), c.pom00)).toBeLessThan(1e-15);
  });
});
