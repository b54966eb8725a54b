import { describe, expect, it } from 'vitest';
import { AstroTime, BaryState, Body } from 'astronomy-engine';
import { sunBarycentricState } from '../../core/astrometry/sun-barycentric-offset.ts';
import { ASTRONOMICAL_UNIT_M } from '../../core/astrometry/constants.ts';

describe('sunBarycentricState(days)', () => {
  it('agrees with astronomy-engine BaryState(Sun) (EQJ) within 0.25 m/s and 3e-5 au over 1900–2100', () => {
    let worstV = 0, worstP = 0;
    for (let days = -36525; days <= 36525; days += 211.7) {
      const ours = sunBarycentricState(days);
      const theirs = BaryState(Body.Sun, AstroTime.FromTerrestrialTime(days));
      const dv = Math.hypot(ours.velocityAuPerDay[0] - theirs.vx, ours.velocityAuPerDay[1] - theirs.vy, ours.velocityAuPerDay[2] - theirs.vz) * ASTRONOMICAL_UNIT_M / 86400;
      const dp = Math.hypot(ours.positionAu[0] - theirs.x, ours.positionAu[1] - theirs.y, ours.positionAu[2] - theirs.z);
      worstV = Math.max(worstV, dv); worstP = Math.max(worstP, dp);
    }
    console.log(`Sun barycentric offset vs astronomy-engine: worst ${worstV.toFixed(3)} m/s, ${worstP.toExponential(2)} au`);
    expect(worstV).toBeLessThan(0.25);
    expect(worstP).toBeLessThan(3e-5);
  });
});
