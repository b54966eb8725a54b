import { describe, expect, it } from 'vitest';
import { earthState, earthStateFast } from '../../core/astrometry/earth-state.ts';
import { ASTRONOMICAL_UNIT_M } from '../../core/astrometry/constants.ts';

describe('earthStateFast(tdb)', () => {
  it('matches earthState (astronomy-engine BaryState) within 0.05 m/s and 3e-5 au over 1900–2100', () => {
    for (let days = -36525; days <= 36525; days += 173.3) {
      const tt = { jd1: 2451545, jd2: days };
      const a = earthState(tt), b = earthStateFast(tt);
      const dv = Math.hypot(...a.barycentricVelocityAuPerDay.map((v, i) => v - b.barycentricVelocityAuPerDay[i])) * ASTRONOMICAL_UNIT_M / 86400;
      const dp = Math.hypot(...a.barycentricPositionAu.map((v, i) => v - b.barycentricPositionAu[i]));
      expect(dv, `day ${days}`).toBeLessThan(0.05);
      expect(dp, `day ${days}`).toBeLessThan(3e-5);
      expect(b.heliocentricPositionAu).toEqual(a.heliocentricPositionAu);
    }
  });
});
