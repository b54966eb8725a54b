// NightSlowTerms interpolates nutation06a and earthState over half a day; the check is the exact
// per-instant functions themselves (nutation06a matches ERFA nut06a to µas in unit/earth, earthState
// is astronomy-engine's). The bound is the class's stated accuracy: 1 µas in nutation, and Earth's
// velocity to 1e-5 m/s (≪ the 1.8 m/s astronomy-engine itself has against ERFA, TOOLCHAIN.md).
import { describe, expect, it } from 'vitest';
import { earthState } from '../../core/astrometry/earth-state.ts';
import { nutation06a } from '../../core/earth/nutation-series.ts';
import { NightSlowTerms } from '../../core/reduction/night-slow-terms.ts';
import { MAS, SECONDS_PER_DAY } from '../../core/units.ts';

/** The astronomical unit, IAU 2012 Resolution B2. */
const ASTRONOMICAL_UNIT_M = 149_597_870_700;

const MICROARCSEC = MAS / 1000;
const M_PER_S_IN_AU_PER_DAY = SECONDS_PER_DAY / ASTRONOMICAL_UNIT_M;

describe('NightSlowTerms', () => {
  it('at(tt) reproduces nutation06a to 1 µas and earthState to 1 m in position, 1e-5 m/s in velocity across ±0.5 day (four epochs)', () => {
    for (const centre of [2_451_545.25, 2_455_197.75, 2_459_580.0, 2_461_041.6]) {
      const slow = new NightSlowTerms({ jd1: centre, jd2: 0 }, 0.5);
      for (let step = -10; step <= 10; step++) {
        const tt = { jd1: centre, jd2: step * 0.0493 };
        expect(slow.covers(tt)).toBe(true);
        const got = slow.at(tt);
        const want = nutation06a(tt);
        const e = earthState(tt);
        expect(Math.abs(got.nutation.dpsiRad - want.dpsiRad), `Δψ at ${centre} ${step}`).toBeLessThan(MICROARCSEC);
        expect(Math.abs(got.nutation.depsRad - want.depsRad), `Δε at ${centre} ${step}`).toBeLessThan(MICROARCSEC);
        for (let i = 0; i < 3; i++) {
          expect(Math.abs(got.earth.barycentricPositionAu[i] - e.barycentricPositionAu[i]) * ASTRONOMICAL_UNIT_M).toBeLessThan(1);
          expect(Math.abs(got.earth.heliocentricPositionAu[i] - e.heliocentricPositionAu[i]) * ASTRONOMICAL_UNIT_M).toBeLessThan(1);
          expect(Math.abs(got.earth.barycentricVelocityAuPerDay[i] - e.barycentricVelocityAuPerDay[i])).toBeLessThan(1e-5 * M_PER_S_IN_AU_PER_DAY);
        }
      }
    }
  });

  it('refuses an instant outside its stretch, with the fix in the message', () => {
    const slow = new NightSlowTerms({ jd1: 2_459_580, jd2: 0 }, 0.5);
    expect(slow.covers({ jd1: 2_459_580, jd2: 0.51 })).toBe(false);
    expect(() => slow.at({ jd1: 2_459_580, jd2: 0.51 })).toThrow(/outside the stretch.*covers\(\)/);
  });
});
