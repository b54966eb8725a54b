import { describe, expect, it } from 'vitest';
import { AstroTime, GeoMoon } from 'astronomy-engine';
import { moonGeocentricAu } from '../../core/astrometry/moon-low-precision.ts';
import { DEG } from '../../core/units.ts';

describe('moonGeocentricAu(days)', () => {
  it('agrees with astronomy-engine GeoMoon within 0.5° and 1% over 1900–2100', () => {
    for (let days = -36525; days <= 36525; days += 997.3) {
      const ours = moonGeocentricAu(days);
      const theirs = GeoMoon(AstroTime.FromTerrestrialTime(days));
      const t = [theirs.x, theirs.y, theirs.z];
      const cos = (ours[0] * t[0] + ours[1] * t[1] + ours[2] * t[2]) / (Math.hypot(...ours) * Math.hypot(...t));
      expect(Math.acos(Math.min(1, cos)) / DEG, `day ${days}`).toBeLessThan(0.5);
      expect(Math.abs(Math.hypot(...ours) / Math.hypot(...t) - 1), `day ${days}`).toBeLessThan(0.01);
    }
  });
});
