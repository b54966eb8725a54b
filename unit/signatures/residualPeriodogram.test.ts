import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { residualPeriodogramPlot } from '../../renderer/signatures/residualPeriodogram.ts';
import type { ObservationResidual } from '../../core/joint/solve-outputs.ts';

const YEAR = 365.25;

/** Residual rows of one invented star every ~5 days over three years. */
function rows(signal: (mjd: number, k: number) => number, flagEvery = 0): ObservationResidual[] {
  return Array.from({ length: 220 }, (_, k) => {
    const utcMjd = 59200 + k * 5 + ((k * 37) % 11) / 10;
    return { starId: 'TEST-1', nightId: `night-${k}`, utcMjd, ra: { residualMas: signal(utcMjd, k), weight: 1, flag: flagEvery > 0 && k % flagEvery === 0 ? 'outlier' : 'fit' }, zenith: null };
  });
}

/**
 * Deterministic noise, uniform in [−1, 1]: the mulberry32 generator (a public-domain 32-bit
 * generator, common practice for reproducible test noise), seeded.
 */
function noiseSource(seed: number): (k: number) => number {
  let state = seed >>> 0;
  const values: number[] = [];
  return (k: number) => {
    while (values.length <= k) {
      state = (state + 0x6d2b79f5) >>> 0;
      let z = state;
      z = Math.imul(z ^ (z >>> 15), z | 1);
      z ^= z + Math.imul(z ^ (z >>> 7), z | 61);
      values.push((((z ^ (z >>> 14)) >>> 0) / 4294967296) * 2 - 1);
    }
    return values[k];
  };
}
const noise = noiseSource(1);

describe('residualPeriodogramPlot', () => {
  it('an annual sinusoid of 30 mas over noise of ±20 mas is flagged significant at 1/yr', () => {
    const model = residualPeriodogramPlot(rows((t, k) => 30 * Math.sin((2 * Math.PI * t) / YEAR) + 20 * noise(k)), null, 'ra');
    expect(model.note).toContain('significant annual peak');
    expect(model.note).not.toContain('no significant');
    expect(model.markers[0]).toMatchObject({ x: 1, tone: 'flagged' });
    // Highest peak of the grid lies within one grid resolution (1/span ≈ 0.33 cycles per year) of 1/yr.
    const line = model.lines[0].points;
    const peak = line.reduce((best, p) => (p[1] > best[1] ? p : best));
    expect(Math.abs(peak[0] - 1)).toBeLessThan(0.34);
  });

  it('white noise is not flagged in 19 of 20 sequences or more (false alarm 0.1 % by construction)', () => {
    let flagged = 0;
    fc.assert(fc.property(fc.integer({ min: 1, max: 1_000_000 }), (seed) => {
      const fresh = noiseSource(seed);
      const model = residualPeriodogramPlot(rows((_t, k) => 20 * fresh(k)), null, 'ra');
      if (model.markers[0].tone === 'flagged') flagged++;
    }), { numRuns: 20, seed: 42 });
    expect(flagged).toBeLessThanOrEqual(1);
  });

  it('leaves out residuals not fitted at full weight, and refuses too short a span', () => {
    const model = residualPeriodogramPlot(rows((_t, k) => noise(k), 4), 'TEST-1', 'ra');
    expect(model.note).toMatch(/^165 residuals fitted/);
    expect(() => residualPeriodogramPlot(rows(() => 1).slice(0, 40), null, 'ra')).toThrow(/over 195 days; an annual term needs/);
    expect(() => residualPeriodogramPlot(rows(() => 1), null, 'zenith')).toThrow(/0 fitted residuals/);
  });
});
