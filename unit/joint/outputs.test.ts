// The joint solve's outputs beyond the star list (SOLVE.md "Output"): the correlation matrix,
// the per-night instrument series with errors against the simulator's known truth
// (core/simulate), and the per-observation residuals, weights and flags.
import { beforeAll, describe, expect, it } from 'vitest';
import type { SimulatedArchive } from '../../core/simulate/simulate-archive.ts';
import { observationResiduals } from '../../core/joint/solve-outputs.ts';
import { solveResultJson } from '../../core/joint/solve-result-json.ts';
import type { ArchiveSolveResult } from '../../core/joint/solve-archive.ts';
import type { SolveInputs } from '../../core/joint/solve-inputs.ts';
import { modelFor, simulatedInputs, solve } from './joint-helpers.ts';

let archive: SimulatedArchive;
let result: ArchiveSolveResult;
let stars: SolveInputs['stars'];
beforeAll(async () => {
  const made = await simulatedInputs({ seed: 31, years: 1, starCount: 6, nightsPerYearTarget: 150, blunderRate: 0 });
  archive = made.archive;
  stars = made.inputs.stars;
  result = await solve(made.inputs, modelFor(archive, { robustIterations: 1 }));
}, 60_000);

describe('joint solve outputs', () => {
  it('correlation: names are the solver globals; each entry is cov_ij/(σ_i σ_j) of the global covariance, symmetric, 1 on the diagonal', () => {
    const { names, matrix } = result.correlation;
    const n = names.length;
    expect(names).toEqual(result.solution.globalNames);
    expect(names).toContain('Δκ (mas)');
    const cov = result.solution.globalCovariance;
    let offDiagonal = 0;
    for (let i = 0; i < n; i++) {
      expect(matrix[i][i]).toBeCloseTo(1, 12);
      for (let j = 0; j < n; j++) {
        expect(matrix[i][j]).toBeCloseTo(matrix[j][i], 12);
        // Definition of the correlation coefficient (common practice), recomputed independently.
        const variances = cov[i * n + i] * cov[j * n + j];
        if (i !== j) expect(matrix[i][j]).toBeCloseTo(variances > 0 ? cov[i * n + j] / Math.sqrt(variances) : 0, 9);
        if (i !== j) offDiagonal = Math.max(offDiagonal, Math.abs(matrix[i][j]));
      }
    }
    // A star's position and proper motion share one epoch offset: some correlation must show.
    expect(offDiagonal).toBeGreaterThan(0.1);
    expect(offDiagonal).toBeLessThanOrEqual(1);
  });

  it('instrument series: per night a, c and rate with σ; collimation and azimuth pulls against the simulated truth have unit width', () => {
    expect(result.instrumentSeries).toHaveLength(result.nights.length);
    const pulls: number[] = [];
    for (const night of result.instrumentSeries) {
      const truth = archive.truth.nights.find((t) => t.nightId === night.id);
      expect(truth, `truth of ${night.id}`).toBeDefined();
      expect(night.collimationSigmaArcsec! > 0 && night.azimuthSigmaArcsec! > 0 && night.clockRateSigmaSPerDay! > 0).toBe(true);
      pulls.push((night.collimationArcsec - truth!.collimationArcsec) / night.collimationSigmaArcsec!);
      pulls.push((night.azimuthArcsec - truth!.azimuthArcsec) / night.azimuthSigmaArcsec!);
    }
    const mean = pulls.reduce((s, p) => s + p, 0) / pulls.length;
    const std = Math.sqrt(pulls.reduce((s, p) => s + (p - mean) ** 2, 0) / (pulls.length - 1));
    console.log(`a and c pulls over ${result.nights.length} nights: mean ${mean.toFixed(2)}, std ${std.toFixed(2)}`);
    // n ≈ 100 pulls: the std's own scatter is ~0.07; 0.75–1.3 leaves room for the correlated a/c pair (common practice).
    expect(Math.abs(mean)).toBeLessThan(0.4);
    expect(std).toBeGreaterThan(0.75);
    expect(std).toBeLessThan(1.3);
  });

  it('observationResiduals: one row per transit; weights 1/σ² in a plain pass; Σ w v² ≤ χ²; flags named', () => {
    const rows = observationResiduals(result.solution, result.layout, stars, result.nights, result.observations);
    expect(rows).toHaveLength(result.observations.length);
    let sum = 0;
    rows.forEach((r, k) => {
      const o = result.observations[k];
      expect(r.ra.weight).toBeCloseTo(o.nightlyOutlierRa ? 0 : o.logWeight / o.sigmaRaMas ** 2, 12);
      sum += r.ra.weight * r.ra.residualMas ** 2 + (r.zenith ? r.zenith.weight * r.zenith.residualMas ** 2 : 0);
      expect(['fit', 'rejected', 'untestable']).toContain(r.ra.flag);
    });
    expect(sum).toBeLessThanOrEqual(result.chiSquare * (1 + 1e-12));
    // Priors add to χ² but are few: the rows carry most of it.
    expect(sum).toBeGreaterThan(0.8 * result.chiSquare);
    expect(result.degreesOfFreedom).toBeGreaterThan(0);
    expect(result.chiSquare / result.degreesOfFreedom).toBeCloseTo(result.unitWeightError ** 2, 9);
  });

  it('solveResultJson(result, catalogue) is the CLI and saved-reduction shape: JSON-safe, nights counted per star, residuals only when asked', () => {
    const plain = solveResultJson(result, stars);
    expect(JSON.parse(JSON.stringify(plain))).toEqual(plain);
    expect(plain).not.toHaveProperty('residuals');
    const nightsOfStar = plain.starNights as Record<string, number>;
    // Recounted here from the solve's observation list: the distinct nights each star's transits fall on.
    for (const s of result.stars) {
      const nights = new Set(result.observations.filter((o) => stars[o.star].id === s.id).map((o) => o.night));
      expect(nightsOfStar[s.id]).toBe(nights.size);
      expect(nightsOfStar[s.id]).toBeLessThanOrEqual(s.observations);
      expect(nightsOfStar[s.id]).toBeGreaterThan(0);
    }
    const withRows = solveResultJson(result, stars, { residuals: true });
    expect((withRows.residuals as unknown[]).length).toBe(result.observations.length);
  });
});
