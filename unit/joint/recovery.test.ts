// Recovery of the simulator's known truth (core/simulate) by the joint solve over many small
// archives: the pulls (estimate − truth)/σ of parallax, both proper motions and Δκ must have mean
// within ±0.1 and standard deviation within 0.9–1.1, as a correct estimator with correct formal
// errors gives (a property of least squares with the true noise model; common practice).
import { describe, expect, it } from 'vitest';
import { modelFor, pulls, simulatedInputs, solve } from './joint-helpers.ts';

const ARCHIVES = Number(process.env.JOINT_RECOVERY_ARCHIVES ?? 200);

function stats(values: readonly number[]): { mean: number; std: number } {
  const mean = values.reduce((s, v) => s + v, 0) / values.length;
  return { mean, std: Math.sqrt(values.reduce((s, v) => s + (v - mean) ** 2, 0) / (values.length - 1)) };
}

describe(`joint solve recovers the truth of ${ARCHIVES} simulated archives (8 stars × 2 years, no blunders)`, () => {
  it('pulls of parallax, μα*, μδ and Δκ have mean within ±0.1 and std within 0.9–1.1', async () => {
    const all = { parallax: [] as number[], pmRa: [] as number[], pmDec: [] as number[], deltaKappa: [] as number[] };
    const started = performance.now();
    for (let seed = 1; seed <= ARCHIVES; seed++) {
      // Δκ injected at 0.05″ so that a wrong sign or scale of the aberration factors shows.
      const { archive, inputs } = await simulatedInputs({ seed: 1000 + seed, years: 2, starCount: 8, blunderRate: 0, deltaKappaArcsec: 0.05 });
      const result = await solve(inputs, modelFor(archive, { robustIterations: 1 }));
      const p = pulls(archive, result);
      all.parallax.push(...p.parallax); all.pmRa.push(...p.pmRa); all.pmDec.push(...p.pmDec); all.deltaKappa.push(p.deltaKappa);
    }
    const seconds = (performance.now() - started) / 1000;
    for (const [name, values] of Object.entries(all)) {
      const { mean, std } = stats(values);
      console.log(`pull ${name}: n = ${values.length}, mean ${mean.toFixed(3)}, std ${std.toFixed(3)}`);
      // With n pulls the mean's own scatter is 1/√n (0.07 for n = 200): the ±0.1 band is then ~1.4σ for Δκ.
      expect(Math.abs(mean), `${name} pull mean`).toBeLessThan(0.1);
      expect(std, `${name} pull std`).toBeGreaterThan(0.9);
      expect(std, `${name} pull std`).toBeLessThan(1.1);
    }
    console.log(`${ARCHIVES} archives simulated and solved in ${seconds.toFixed(1)} s`);
  }, 900_000);
});
