import { describe, expect, it } from 'vitest';
import { sinCos } from '../../core/astrometry/sine-cosine.ts';

describe('sinCos(angleRad, out)', () => {
  const out = new Float64Array(2);

  it('matches Math.cos and Math.sin (the engine\'s fdlibm) to 2e-15 over ±1000 rad, nodes and half-nodes included', () => {
    let worst = 0;
    const angles: number[] = [];
    for (let k = -600; k <= 600; k++) angles.push((k * Math.PI) / 128, ((k + 0.5) * Math.PI) / 128);
    for (let k = 0; k < 20_000; k++) angles.push((k * 0.1000037 - 1000) * (k % 2 === 0 ? 1 : 1.0000001));
    for (const a of angles) {
      sinCos(a, out);
      const error = Math.max(Math.abs(out[0] - Math.cos(a)), Math.abs(out[1] - Math.sin(a)));
      expect(error, `angle ${a}`).toBeLessThan(2e-15);
      worst = Math.max(worst, error);
    }
    console.log(`sinCos vs Math.cos/Math.sin: worst ${worst.toExponential(2)}`);
  });

  it('gives the textbook values at π/6, π/2, π and −π/3 (cos π/6 = √3/2, sin π/6 = 1/2)', () => {
    sinCos(Math.PI / 6, out);
    expect(out[0]).toBeCloseTo(Math.sqrt(3) / 2, 15);
    expect(out[1]).toBeCloseTo(0.5, 15);
    sinCos(Math.PI / 2, out);
    expect(Math.abs(out[0])).toBeLessThan(1e-15);
    expect(out[1]).toBeCloseTo(1, 15);
    sinCos(Math.PI, out);
    expect(out[0]).toBeCloseTo(-1, 15);
    sinCos(-Math.PI / 3, out);
    expect(out[0]).toBeCloseTo(0.5, 15);
    expect(out[1]).toBeCloseTo(-Math.sqrt(3) / 2, 15);
  });
});
