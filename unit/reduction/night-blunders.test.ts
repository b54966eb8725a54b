import { describe, expect, it } from 'vitest';
import { simulateNight, transitLogCsv, TRUTH } from './forward-night.ts';
import { expectReduced, reduceTestNight } from './reduce-helpers.ts';

// Blunders planted in one simulated night (forward-night.ts); the expected causes are those of
// core/instrument/blunder-hints.ts (common practice checks at the telescope).

describe('reduceObservingNight blunders', async () => {
  const rows = simulateNight(7, TRUTH, 0.01, 0.1);
  // Wire miscount: the time of wire 2 entered in the column of wire 1 (wire 2 left empty).
  const wireRow = rows.find((r) => r.id === 'LK-03')!;
  wireRow.wireClockS[0] = wireRow.wireClockS[1];
  wireRow.wireClockS[1] = null;
  // Micrometer slip: one whole turn too many on LK-09.
  rows.find((r) => r.id === 'LK-09')!.turns += 1;
  // Wrong star: LK-07 observed but logged as LK-06 (whose own row is absent).
  const swapped = rows.filter((r) => r.id !== 'LK-06').map((r) => (r.id === 'LK-07' ? { ...r, id: 'LK-06' } : r));
  const r = expectReduced(await reduceTestNight(transitLogCsv(swapped), null, (c) => ({ ...c, clockRateSPerDay: { mode: 'fixed', value: TRUTH.clockRateSPerDay } }), TRUTH.levelArcsec));
  const byStar = new Map(r.transits.map((t) => [t.starId, t]));

  it('flags the wire miscount as an outlier with cause wire-miscounted (spacing·sec δ / wires)', () => {
    const t = byStar.get('LK-03')!;
    expect(t.outlierTime).toBe(true);
    expect(t.hints[0]?.cause).toBe('wire-miscounted');
  });

  it('flags the one-turn micrometer slip with cause micrometer-turn-miscounted', () => {
    const t = byStar.get('LK-09')!;
    expect(t.outlierZenith).toBe(true);
    expect(t.outlierTime).toBe(false);
    expect(t.hints[0]?.cause).toBe('micrometer-turn-miscounted');
    expect(t.hints[0]?.detail).toMatch(/by 1$/);
  });

  it('flags the swapped star with cause wrong-star naming the star actually observed', () => {
    const t = byStar.get('LK-06')!;
    expect(t.outlierTime).toBe(true);
    const wrong = t.hints.find((h) => h.cause === 'wrong-star');
    expect(wrong?.detail).toMatch(/LK-07/);
  });

  it('keeps sensible residuals for the good transits (< 5σ of their noise) and recovers a and c', () => {
    for (const t of r.transits.filter((x) => !['LK-03', 'LK-09', 'LK-06'].includes(x.starId))) {
      // Mean-wire noise 0.01 s / √5 = 4.5 ms; zenith noise 0.1″.
      expect(Math.abs(t.ocTimeS), t.starId).toBeLessThan(0.03);
      expect(Math.abs(t.zenith!.ocZenithArcsec), t.starId).toBeLessThan(0.5);
      expect(t.outlierTime || t.outlierZenith, t.starId).toBe(false);
    }
    expect(Math.abs(r.constants.azimuthArcsec.value - TRUTH.azimuthArcsec)).toBeLessThan(5 * r.constants.azimuthArcsec.sigma!);
    expect(Math.abs(r.constants.collimationArcsec.value - TRUTH.collimationArcsec)).toBeLessThan(5 * r.constants.collimationArcsec.sigma!);
  });
});
