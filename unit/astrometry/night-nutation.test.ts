import { describe, expect, it } from 'vitest';
import { nightOrientations } from '../../core/astrometry/night-orientation.ts';
import { equinoxComplementaryTerms } from '../../core/earth/equation-of-equinoxes-06.ts';
import { meanObliquity06 } from '../../core/earth/mean-obliquity-06.ts';
import { nutation00b, nutation00bAtSteps, nutation06a } from '../../core/earth/nutation-series.ts';
import { biasPrecessionNutationMatrix06 } from '../../core/earth/precession-06.ts';
import { gmst06 } from '../../core/earth/sidereal-time.ts';
import { ARCSEC, UAS } from '../../core/units.ts';

// nutation00b is pinned to ERFA nut00b within 0.01 µas (unit/earth/earth-orientation.test.ts); the
// five-instant form used by the night context must reproduce it at each instant.
describe('nutation00bAtSteps(centre, stepDays, out)', () => {
  it('equals nutation00b at centre + k·step, k = −2…2, within 1e-4 µas, the rounding of the arguments themselves (1850–2150, steps 0.05–0.5 day)', () => {
    const out = new Float64Array(10);
    let worst = 0;
    for (let n = 0; n < 400; n++) {
      const centre = { jd1: 2_396_758.5 + n * 274.3, jd2: (n % 10) * 0.0917 };
      const step = [0.25, 0.05, 0.5, 0.125][n % 4];
      nutation00bAtSteps(centre, step, out);
      for (let k = -2; k <= 2; k++) {
        const direct = nutation00b({ jd1: centre.jd1, jd2: centre.jd2 + k * step });
        const errors = [out[2 * (k + 2)] - direct.dpsiRad, out[2 * (k + 2) + 1] - direct.depsRad].map(Math.abs);
        for (const e of errors) expect(e / UAS, `centre ${centre.jd1 + centre.jd2} k ${k}`).toBeLessThan(1e-4);
        worst = Math.max(worst, ...errors);
      }
    }
    console.log(`nutation00bAtSteps vs nutation00b: worst ${(worst / UAS).toExponential(2)} µas`);
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
