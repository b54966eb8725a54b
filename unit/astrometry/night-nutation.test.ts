import { describe, expect, it } from 'vitest';
import { nutation00b, nutation00bAtSteps } from '../../core/earth/nutation-series.ts';
import { UAS } from '../../core/units.ts';

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
