import { describe, expect, it } from 'vitest';
import { falseAlarmProbability, lombScarglePeriodogram } from '../../core/solver/lomb-scargle.ts';
import { gaussian, seededRandom } from './random.ts';

describe('lombScarglePeriodogram(time, values, frequencies)', () => {
  it('equals the classical periodogram |Σ y′e^(−iωt)|²/(N·σ²) at Fourier frequencies of even sampling (Scargle 1982 §II)', () => {
    const random = seededRandom(81);
    const n = 64;
    const time = Float64Array.from({ length: n }, (_, k) => k * 0.5);
    const values = Float64Array.from({ length: n }, () => gaussian(random));
    const frequencies = Float64Array.from({ length: 20 }, (_, j) => (j + 1) / (n * 0.5));
    const power = lombScarglePeriodogram(time, values, frequencies);
    const mean = values.reduce((s, y) => s + y, 0) / n;
    const variance = values.reduce((s, y) => s + (y - mean) ** 2, 0) / (n - 1);
    frequencies.forEach((f, j) => {
      let re = 0;
      let im = 0;
      for (let k = 0; k < n; k++) {
        re += (values[k] - mean) * Math.cos(2 * Math.PI * f * time[k]);
        im -= (values[k] - mean) * Math.sin(2 * Math.PI * f * time[k]);
      }
      expect(Math.abs(power[j] - (re * re + im * im) / (n * variance))).toBeLessThan(1e-10);
    });
  });

  it('equals the χ² reduction of a least-squares sinusoid fit over 2σ² for uneven sampling (Lomb 1976)', () => {
    const random = seededRandom(82);
    const n = 90;
    const time = Float64Array.from({ length: n }, () => random() * 3650);
    const values = Float64Array.from({ length: n }, (_, k) => 0.3 * Math.sin((2 * Math.PI * time[k]) / 365.25) + gaussian(random));
    const frequencies = Float64Array.of(1 / 365.25, 1 / 100, 1 / 27.3, 0.5);
    const power = lombScarglePeriodogram(time, values, frequencies);
    const mean = values.reduce((s, y) => s + y, 0) / n;
    const y = values.map((v) => v - mean);
    const total = y.reduce((s, v) => s + v * v, 0);
    frequencies.forEach((f, j) => {
      // Independent 2-parameter fit y ≈ a cos ωt + b sin ωt by its 2×2 normal equations.
      let cc = 0; let cs = 0; let ss = 0; let yc = 0; let ys = 0;
      for (let k = 0; k < n; k++) {
        const c = Math.cos(2 * Math.PI * f * time[k]);
        const s = Math.sin(2 * Math.PI * f * time[k]);
        cc += c * c; cs += c * s; ss += s * s; yc += y[k] * c; ys += y[k] * s;
      }
      const det = cc * ss - cs * cs;
      const a = (ss * yc - cs * ys) / det;
      const b = (cc * ys - cs * yc) / det;
      const reduction = a * yc + b * ys; // Σy² − χ²_fit for least squares
      expect(Math.abs(power[j] - reduction / (2 * (total / (n - 1))))).toBeLessThan(1e-9);
    });
  });

  it('peaks at an injected annual signal in a decade of uneven residuals', () => {
    const random = seededRandom(83);
    const n = 400;
    const time = Float64Array.from({ length: n }, () => random() * 3650);
    const values = Float64Array.from({ length: n }, (_, k) => 0.5 * Math.cos((2 * Math.PI * time[k]) / 365.25 + 1) + gaussian(random));
    const frequencies = Float64Array.from({ length: 2000 }, (_, j) => (j + 1) / 3650 / 4);
    const power = lombScarglePeriodogram(time, values, frequencies);
    let best = 0;
    for (let j = 1; j < power.length; j++) if (power[j] > power[best]) best = j;
    expect(Math.abs(1 / frequencies[best] - 365.25)).toBeLessThan(10);
    expect(falseAlarmProbability(power[best], n)).toBeLessThan(1e-6);
    expect(falseAlarmProbability(0.1, 100)).toBeGreaterThan(0.999);
  });

  it('names mismatched inputs', () => {
    expect(() => lombScarglePeriodogram(new Float64Array(5), new Float64Array(4), Float64Array.of(1))).toThrow(/one value per epoch/);
    expect(() => lombScarglePeriodogram(Float64Array.of(0, 1, 2), Float64Array.of(1, 2, 3), Float64Array.of(0))).toThrow(/f > 0/);
  });
});
