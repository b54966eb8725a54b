import { describe, expect, it } from 'vitest';
import { atan2Fast } from '../../core/astrometry/arctangent.ts';

describe('atan2Fast(y, x)', () => {
  it('matches Math.atan2 (the engine\'s fdlibm) to 1e-15 rad over all quadrants, octant edges and table nodes', () => {
    let worst = 0;
    const pairs: [number, number][] = [];
    // Table nodes k/64 and the points halfway between them, in all eight octants.
    for (let k = 0; k <= 128; k++) {
      const t = k / 128;
      for (const [sy, sx] of [[1, 1], [1, -1], [-1, 1], [-1, -1]]) pairs.push([sy * t, sx], [sy, sx * t]);
    }
    let seed = 12345;
    const next = () => ((seed = (Math.imul(seed, 1103515245) + 12345) >>> 0) / 4294967296);
    for (let k = 0; k < 200_000; k++) {
      const scale = 10 ** (next() * 20 - 10);
      pairs.push([(next() - 0.5) * scale, (next() - 0.5) * scale]);
    }
    let worstPair = pairs[0];
    for (const pair of pairs) {
      const error = Math.abs(atan2Fast(pair[0], pair[1]) - Math.atan2(pair[0], pair[1]));
      if (error > worst) [worst, worstPair] = [error, pair];
    }
    expect(worst, `worst at atan2(${worstPair[0]}, ${worstPair[1]})`).toBeLessThan(1e-15);
    console.log(`atan2Fast vs Math.atan2: worst ${worst.toExponential(2)} rad over ${pairs.length} pairs`);
  });

  it('keeps the signed zeros, the ±π cut and the degenerate arguments of Math.atan2', () => {
    expect(Object.is(atan2Fast(0, 1), 0)).toBe(true);
    expect(Object.is(atan2Fast(-0, 1), -0)).toBe(true);
    expect(atan2Fast(0, -1)).toBe(Math.PI);
    expect(atan2Fast(-0, -1)).toBe(-Math.PI);
    expect(atan2Fast(1, 0)).toBe(Math.PI / 2);
    expect(atan2Fast(-1, 0)).toBe(-Math.PI / 2);
    expect(atan2Fast(0, 0)).toBe(Math.atan2(0, 0));
    expect(atan2Fast(Infinity, 1)).toBe(Math.PI / 2);
    expect(Number.isNaN(atan2Fast(Number.NaN, 1))).toBe(true);
  });

  it('gives the textbook values atan2(1, 1) = π/4, atan2(1, √3) = π/6, atan2(√3, −1) = 2π/3', () => {
    expect(atan2Fast(1, 1)).toBeCloseTo(Math.PI / 4, 15);
    expect(atan2Fast(1, Math.sqrt(3))).toBeCloseTo(Math.PI / 6, 15);
    expect(atan2Fast(Math.sqrt(3), -1)).toBeCloseTo((2 * Math.PI) / 3, 15);
  });
});
