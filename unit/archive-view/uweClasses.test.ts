// Classification of a night's unit-weight error for the Archive overview. The class limits are
// this view's own choice (renderer/archive/uweClasses.ts), so the checks pin the boundary rule and
// the refusal of impossible values; the a priori precision is DEFAULT_JOINT_MODEL's (0.03 s a
// wire, 0.3″ a reading).
import { describe, expect, test } from 'vitest';
import { describeQuality, nightUweClass, uweClass, UWE_CLASS_LABELS, UWE_CLASS_LIMITS } from '../../renderer/archive/uweClasses.ts';
import { failedQuality, qualityOfReduction } from '../../renderer/archive/nightQuality.ts';
import type { NightReductionResult, TransitResult } from '../../core/reduction/night-result.ts';

describe('uweClass(unitWeightError)', () => {
  test('puts each value in its class; a value on a limit goes to the class above', () => {
    expect([0, 0.9, 1.1999, 1.2, 1.99, 2, 4.99, 5, 40].map(uweClass)).toEqual([0, 0, 0, 1, 1, 2, 2, 3, 3]);
  });
  test('null (no redundancy) is "not reduced"', () => {
    expect(uweClass(null)).toBe('not-reduced');
  });
  test('refuses NaN and negative values with a message naming the fix', () => {
    expect(() => uweClass(Number.NaN)).toThrow(/meridian-ledger night/);
    expect(() => uweClass(-0.1)).toThrow(/negative or not a number/);
  });
  test('the legend states every limit', () => {
    const words = Object.values(UWE_CLASS_LABELS).join(' ');
    for (const limit of UWE_CLASS_LIMITS) expect(words).toContain(String(limit));
    expect(words).toContain('not reduced');
  });
});

// Only the fields qualityOfReduction reads; the rest of a TransitResult does not enter it.
function transit(overrides: Partial<TransitResult> = {}): TransitResult {
  return { wireCount: 4, userRejected: false, outlierTime: false, outlierZenith: false, ...overrides } as Partial<TransitResult> as TransitResult;
}

function result(uweTimeS: number | null, uweZenithArcsec: number | null, transits: TransitResult[]): NightReductionResult {
  return { unitWeightErrorTimeS: uweTimeS, unitWeightErrorZenithArcsec: uweZenithArcsec, transits } as Partial<NightReductionResult> as NightReductionResult;
}

describe('qualityOfReduction(nightId, key, result, apriori)', () => {
  const apriori = { wireSigmaS: 0.03, readingSigmaArcsec: 0.3 };
  test('divides the time UWE by σ_wire/√n and the zenith UWE by σ_reading, and keeps the worse', () => {
    const transits = [transit(), transit(), transit({ outlierZenith: true }), transit({ userRejected: true })];
    // 4 wires: a priori σ of a mean wire = 0.03 s / √4 = 0.015 s; 0.0225 s / 0.015 s = 1.5.
    const q = qualityOfReduction('n', 'k', result(0.0225, 0.9, transits), apriori);
    expect(q.unitWeightErrorTime).toBeCloseTo(1.5, 12);
    expect(q.unitWeightErrorZenith).toBeCloseTo(3, 12);
    expect(q.unitWeightError).toBeCloseTo(3, 12);
    expect(q).toMatchObject({ transitsUsed: 3, transitsRejected: 1, transitsUserRejected: 1, reduced: true, failure: null });
    expect(uweClass(q.unitWeightError)).toBe(2);
  });
  test('without redundancy in either coordinate the night has no UWE and is "not reduced"', () => {
    const q = qualityOfReduction('n', 'k', result(null, null, [transit()]), apriori);
    expect(q.unitWeightError).toBeNull();
    expect(nightUweClass(q)).toBe('not-reduced');
    expect(describeQuality(q)).toMatch(/too few transits/);
  });
  test('a refused night says why, and a night not yet computed says so', () => {
    const q = failedQuality('n', 'k', 3, 'instrument x is not among the site\'s instruments');
    expect(nightUweClass(q)).toBe('not-reduced');
    expect(describeQuality(q)).toBe('not reduced: instrument x is not among the site\'s instruments');
    expect(describeQuality(undefined)).toMatch(/not computed yet/);
  });
});
