import { describe, expect, it } from 'vitest';
import { nightOrientations } from '../../core/astrometry/night-orientation.ts';
import { equinoxComplementaryTerms } from '../../core/earth/equation-of-equinoxes-06.ts';
import { meanObliquity06 } from '../../core/earth/mean-obliquity-06.ts';
import { nutation00b, nutation06a, nutation06aAtSteps } from '../../core/earth/nutation-series.ts';
import { biasPrecessionNutationMatrix06 } from '../../core/earth/precession-06.ts';
import { gmst06 } from '../../core/earth/sidereal-time.ts';
import { ARCSEC, MAS, UAS } from '../../core/units.ts';

// nutation06a is pinned to ERFA nut06a within 0.01 µas (unit/earth/earth-orientation.test.ts); the
// five-instant form used by the night context must follow it across the night.
describe('nutation06aAtSteps(centre, stepDays, out)', () => {
  it('equals nutation06a at the centre and follows it within 0.05 mas at centre + k·step, k = ±1, ±2 (1850–2150, steps to 0.25 day)', () => {
    const out = new Float64Array(10);
    let worst = 0;
    for (let n = 0; n < 400; n++) {
      const centre = { jd1: 2_396_758.5 + n * 274.3, jd2: (n % 10) * 0.0917 };
      const step = [0.25, 0.05, 0.125, 0.2][n % 4];
      nutation06aAtSteps(centre, step, out);
      const atCentre = nutation06a(centre);
      expect(out[4]).toBe(atCentre.dpsiRad);
      expect(out[5]).toBe(atCentre.depsRad);
      for (let k = -2; k <= 2; k++) {
        const direct = nutation06a({ jd1: centre.jd1, jd2: centre.jd2 + k * step });
        const errors = [out[2 * (k + 2)] - direct.dpsiRad, out[2 * (k + 2) + 1] - direct.depsRad].map(Math.abs);
        for (const e of errors) expect(e / MAS, `centre ${centre.jd1 + centre.jd2} k ${k}`).toBeLessThan(0.05);
        worst = Math.max(worst, ...errors);
      }
    }
    console.log(`nutation06aAtSteps vs nutation06a: worst ${(worst / UAS).toFixed(2)} µas`);
  });

  it('does better than holding 2000A − 2000B across the night on the worst night found (day −3314 from J2000: 0.67 mas)', () => {
    const out = new Float64Array(10);
    const centre = { jd1: 2_451_545, jd2: -3314.24 + 0.25 };
    nutation06aAtSteps(centre, 0.25, out);
    const end = { jd1: centre.jd1, jd2: centre.jd2 + 0.5 };
    const held = nutation06a(centre).dpsiRad + nutation00b(end).dpsiRad - nutation00b(centre).dpsiRad;
    const truth = nutation06a(end).dpsiRad;
    expect(Math.abs(held - truth) / MAS).toBeGreaterThan(0.3);
    expect(Math.abs(out[8] - truth) / MAS).toBeLessThan(0.05);
  });
});

// biasPrecessionNutationMatrix06 and gast06 are pinned to ERFA pnm06a / gst06a
// (unit/earth/earth-orientation.test.ts); the night's first-order form must reproduce them.
describe('nightOrientations(samples, offsets, nutations, complementary)', () => {
  it('gives each sample the NPB matrix of biasPrecessionNutationMatrix06 within 1e-12 (0.2 µas) per element and the same GAST within 1e-13 rad', () => {
    let worstMatrix = 0, worstAngle = 0;
    for (let n = 0; n < 60; n++) {
      const centre = { jd1: 2_415_020.5 + n * 1234.5, jd2: 0.3 };
      const offsets = [-0.5, -0.25, 0, 0.25, 0.5];
      const samples = offsets.map((o) => {
        const tt = { jd1: centre.jd1, jd2: centre.jd2 + o };
        return { tt, ut1: { jd1: tt.jd1, jd2: tt.jd2 - 0.0007 }, xpRad: (0.1 + 0.001 * o) * ARCSEC, ypRad: 0.3 * ARCSEC };
      });
      const nutations = samples.map((s) => nutation06a(s.tt));
      const complementary = equinoxComplementaryTerms(centre);
      const night = nightOrientations(samples, offsets, nutations, complementary);
      samples.forEach((s, k) => {
        const npb = biasPrecessionNutationMatrix06(s.tt, nutations[k]);
        for (let e = 0; e < 9; e++) worstMatrix = Math.max(worstMatrix, Math.abs(night[k].npb[e] - npb[e]));
        const gast = gmst06(s.ut1, s.tt) + nutations[k].dpsiRad * Math.cos(meanObliquity06(s.tt)) + complementary;
        worstAngle = Math.max(worstAngle, Math.abs(Math.sin(night[k].gastRad - gast)));
      });
    }
    expect(worstMatrix).toBeLessThan(1e-12);
    expect(worstAngle).toBeLessThan(1e-13);
    console.log(`nightOrientations vs per-sample matrices: worst ${worstMatrix.toExponential(2)} per element, GAST ${worstAngle.toExponential(2)} rad`);
  });
});
