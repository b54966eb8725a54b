// Model comparison of an optional term (SOLVE.md "--compare"): the temperature term must be
// significant (nested F-test, BIC) when the simulator injects a thermal drift, and not when it
// does not. p-value thresholds are common practice (1 % and 1 ‰).
import { describe, expect, it } from 'vitest';
import { compareTerm } from '../../core/joint/compare-term.ts';
import { prepareArchive } from '../../core/joint/prepare-archive.ts';
import { UNCONTROLLED } from '../../core/task/task-control.ts';
import { modelFor, simulatedInputs, TIME_SCALE } from './joint-helpers.ts';

describe('compareTerm(prepared, model, "temperature")', () => {
  it('finds the temperature term significant with an injected 0.05″/°C drift and not without it', async () => {
    const request = { seed: 21, years: 2, starCount: 8, blunderRate: 0 };
    const verdicts = [];
    for (const thermal of [{ raArcsecPerC: 0.05, decArcsecPerC: 0.05 }, { raArcsecPerC: 0, decArcsecPerC: 0 }]) {
      const { archive, inputs } = await simulatedInputs({ ...request, thermal });
      const model = modelFor(archive);
      const prepared = await prepareArchive(inputs, model, TIME_SCALE, UNCONTROLLED);
      verdicts.push(compareTerm(prepared, model, 'temperature', UNCONTROLLED));
    }
    const [hot, cold] = verdicts;
    console.log(`temperature term: F ${hot.fTest.f.toFixed(1)} p ${hot.fTest.pValue.toExponential(1)} injected; F ${cold.fTest.f.toFixed(2)} p ${cold.fTest.pValue.toFixed(2)} absent`);
    expect(hot.fTest.numeratorDegrees).toBe(2);
    expect(hot.fTest.pValue).toBeLessThan(1e-3);
    expect(hot.with.bic).toBeLessThan(hot.without.bic);
    expect(cold.fTest.pValue).toBeGreaterThan(0.01);
    expect(cold.with.bic).toBeGreaterThan(cold.without.bic);
  }, 60_000);
});
