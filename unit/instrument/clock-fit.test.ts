import { describe, expect, it } from 'vitest';
import { clockCorrectionS, fitClock, removePersonalEquationS } from '../../core/instrument/clock-fit.ts';
import { seededRandom } from './seeded-random.ts';

describe('fitClock', () => {
  it('recovers a simulated offset and rate within formal errors, pulls of unit width over 400 nights', () => {
    const random = seededRandom(11);
    const pullsOffset: number[] = [];
    const pullsRate: number[] = [];
    for (let night = 0; night < 400; night++) {
      const offset = random.normal() * 2;
      const rate = random.normal() * 1e-5; // ~0.9 s/day
      const sigma = 0.01;
      const comparisons = Array.from({ length: 6 }, (_, k) => {
        const clock = 72_000 + k * 3000 + random.uniform() * 100;
        return { clockReadingS: clock, signalUtcS: clock + offset + rate * (clock - 79_000) + sigma * random.normal(), sigmaS: sigma };
      });
      const fit = fitClock(comparisons);
      pullsOffset.push((clockCorrectionS(fit, 79_000) - offset) / Math.hypot(fit.offsetSigmaS!, (79_000 - fit.referenceClockS) * fit.rateSigmaSPerS!));
      pullsRate.push((fit.rateSPerS - rate) / fit.rateSigmaSPerS!);
    }
    for (const pulls of [pullsOffset, pullsRate]) {
      const rms = Math.sqrt(pulls.reduce((s, p) => s + p * p, 0) / pulls.length);
      // A unit-width pull distribution: rms within ±12 % for 400 draws (≈ 3.4 standard errors of the rms).
      expect(rms).toBeGreaterThan(0.88);
      expect(rms).toBeLessThan(1.12);
    }
  });

  it('one comparison: offset only, rate zero, and it says so', () => {
    const fit = fitClock([{ clockReadingS: 1000, signalUtcS: 1001.25 }]);
    expect(fit.offsetS).toBeCloseTo(1.25, 12);
    expect(fit.rateSPerS).toBe(0);
    expect(fit.rateDetermined).toBe(false);
    expect(fit.notes.join(' ')).toMatch(/one comparison: offset only/);
    expect(fit.offsetSigmaS).toBeNull();
  });

  it('two comparisons give the straight line exactly, errors from a priori sigmas only', () => {
    const fit = fitClock([
      { clockReadingS: 0, signalUtcS: 1, sigmaS: 0.02 },
      { clockReadingS: 3600, signalUtcS: 3601.36, sigmaS: 0.02 },
    ]);
    expect(fit.rateSPerS).toBeCloseTo(1e-4, 14);
    expect(clockCorrectionS(fit, 0)).toBeCloseTo(1, 12);
    expect(fit.unitWeightError).toBeNull();
    expect(fit.offsetSigmaS).toBeCloseTo(0.02 / Math.SQRT2, 12);
  });

  it('refuses an empty night and a non-positive sigma, naming the fix', () => {
    expect(() => fitClock([])).toThrow(/at least one comparison/);
    expect(() => fitClock([{ clockReadingS: 0, signalUtcS: 0, sigmaS: 0 }])).toThrow(/must be > 0/);
  });
});

describe('removePersonalEquationS', () => {
  it('an observer who records 0.12 s late gets 0.12 s taken off; no stated equation leaves the time alone', () => {
    expect(removePersonalEquationS(100, 0.12)).toBeCloseTo(99.88, 12);
    expect(removePersonalEquationS(100, undefined)).toBe(100);
  });
});
