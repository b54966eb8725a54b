import { describe, expect, it } from 'vitest';
import { clockCsv, simulateNight, transitLogCsv, TRUTH } from './forward-night.ts';
import { expectReduced, reduceTestNight } from './reduce-helpers.ts';

// Round trip through our own forward model (forward-night.ts): the exact line-of-sight geometry,
// exact wire intervals and the refraction inverse, against the reduction's Mayer first-order form.

describe('reduceObservingNight round trip', () => {
  it('recovers a, c, clock offset and zenith zero exactly (< 3 mas, 0.2 ms) from a noise-free night, b from the level', async () => {
    const log = transitLogCsv(simulateNight(1, TRUTH, 0, 0));
    const r = expectReduced(await reduceTestNight(log, null, (c) => ({ ...c, clockRateSPerDay: { mode: 'fixed', value: TRUTH.clockRateSPerDay } }), TRUTH.levelArcsec));
    // The clock truth is stated at reference 86400 s; the reduction's offset at its own reference epoch.
    const offsetAtReference = TRUTH.clockOffsetS + (TRUTH.clockRateSPerDay / 86_400) * (r.clockReferenceS - TRUTH.clockReferenceS);
    expect(r.constants.clockOffsetS.value).toBeCloseTo(offsetAtReference, 4);
    expect(Math.abs(r.constants.azimuthArcsec.value - TRUTH.azimuthArcsec)).toBeLessThan(0.003);
    expect(Math.abs(r.constants.collimationArcsec.value - TRUTH.collimationArcsec)).toBeLessThan(0.003);
    expect(r.constants.levelArcsec.source).toBe('readings');
    expect(r.constants.levelArcsec.value).toBeCloseTo(TRUTH.levelArcsec, 12);
    expect(Math.abs(r.constants.zenithZeroArcsec.value - TRUTH.zenithZeroArcsec)).toBeLessThan(0.003);
    for (const t of r.transits) {
      expect(Math.abs(t.ocTimeS), t.starId).toBeLessThan(2e-4);
      expect(Math.abs(t.zenith!.ocZenithArcsec), t.starId).toBeLessThan(0.003);
      expect(t.outlierTime || t.outlierZenith).toBe(false);
    }
  });

  it('takes the clock from the comparisons (fitClock) and recovers offset and rate of the clock', async () => {
    const log = transitLogCsv(simulateNight(2, TRUTH, 0, 0));
    const clock = clockCsv([64_800, 75_600, 90_000, 100_800], TRUTH, 0, 2);
    const r = expectReduced(await reduceTestNight(log, clock, (c) => c, TRUTH.levelArcsec));
    expect(r.constants.clockOffsetS.source).toBe('readings');
    expect(r.constants.clockRateSPerDay.value).toBeCloseTo(TRUTH.clockRateSPerDay, 4);
    expect(Math.abs(r.constants.azimuthArcsec.value - TRUTH.azimuthArcsec)).toBeLessThan(0.003);
    expect(Math.max(...r.transits.map((t) => Math.abs(t.ocTimeS)))).toBeLessThan(2e-4);
  });

  it('pulls of a, c, clock offset and zenith zero over 80 noisy nights have the width of Student\'s t (formal errors are right)', async () => {
    const pulls: Record<string, number[]> = { offset: [], a: [], c: [], zero: [] };
    for (let seed = 10; seed < 90; seed++) {
      const log = transitLogCsv(simulateNight(seed, TRUTH, 0.03, 0.3));
      const r = expectReduced(await reduceTestNight(log, null, (c) => ({ ...c, clockRateSPerDay: { mode: 'fixed', value: TRUTH.clockRateSPerDay } }), TRUTH.levelArcsec));
      const offsetTruth = TRUTH.clockOffsetS + (TRUTH.clockRateSPerDay / 86_400) * (r.clockReferenceS - TRUTH.clockReferenceS);
      const k = r.constants;
      pulls.offset.push((k.clockOffsetS.value - offsetTruth) / k.clockOffsetS.sigma!);
      pulls.a.push((k.azimuthArcsec.value - TRUTH.azimuthArcsec) / k.azimuthArcsec.sigma!);
      pulls.c.push((k.collimationArcsec.value - TRUTH.collimationArcsec) / k.collimationArcsec.sigma!);
      pulls.zero.push((k.zenithZeroArcsec.value - TRUTH.zenithZeroArcsec) / k.zenithZeroArcsec.sigma!);
    }
    // Formal errors scaled by the night's unit-weight error: a pull is Student's t with ν = 14 − 3
    // (right ascension) or 14 − 1 (zenith) degrees of freedom, width √(ν/(ν − 2)) (any statistics text).
    const expectedWidth: Record<string, number> = { offset: Math.sqrt(11 / 9), a: Math.sqrt(11 / 9), c: Math.sqrt(11 / 9), zero: Math.sqrt(13 / 11) };
    for (const [name, values] of Object.entries(pulls)) {
      const mean = values.reduce((s, v) => s + v, 0) / values.length;
      const sd = Math.sqrt(values.reduce((s, v) => s + (v - mean) ** 2, 0) / (values.length - 1));
      console.log(`pull ${name}: mean ${mean.toFixed(3)}, sd ${sd.toFixed(3)} over ${values.length} nights`);
      // 80 samples: the mean's standard error is 0.12 and the sd's about 0.09 (normal theory); 3.5σ bounds.
      expect(Math.abs(mean), name).toBeLessThan(0.45);
      expect(Math.abs(sd - expectedWidth[name]), name).toBeLessThan(0.32);
    }
  });
});
