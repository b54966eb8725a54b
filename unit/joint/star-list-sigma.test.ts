// Catalogue priors from the star list's own columns (SOLVE.md `starListSigma`, FORMATS.md
// `positionSigmaMas`, `pmSigmaMasYr`): the same priors as the model file's per-star entries, so the
// same solution; the order of precedence per component; and the switch that ignores the columns.
import { beforeAll, describe, expect, it } from 'vitest';
import { catalogueSigmaOf } from '../../core/joint/build-joint-problem.ts';
import { DEFAULT_JOINT_MODEL } from '../../core/joint/joint-model.ts';
import type { ArchiveSolveResult } from '../../core/joint/solve-archive.ts';
import type { SolveInputs } from '../../core/joint/solve-inputs.ts';
import type { SimulatedArchive } from '../../core/simulate/simulate-archive.ts';
import { modelFor, simulatedInputs, solve } from './joint-helpers.ts';

let archive: SimulatedArchive;
let inputs: SolveInputs;
let fromModel: ArchiveSolveResult;
beforeAll(async () => {
  const made = await simulatedInputs({ seed: 57, years: 2, starCount: 6, nightsPerYearTarget: 80, blunderRate: 0 });
  archive = made.archive;
  inputs = made.inputs;
  fromModel = await solve(inputs, modelFor(archive, { robustIterations: 1 }));
}, 120_000);

describe('catalogue σ from the star list', () => {
  it('gives the same solution as the same σ stated per star in the model file (to 1e-9 mas)', async () => {
    const stated = new Map(archive.truth.stars.map((s) => [s.id, s]));
    const stars = inputs.stars.map((s) => ({ ...s, positionSigmaMas: stated.get(s.id)!.catalogueSigmaPositionMas, pmSigmaMasYr: stated.get(s.id)!.catalogueSigmaPmMasYr }));
    const model = { ...modelFor(archive, { robustIterations: 1 }), catalogueSigma: { default: null, stars: {} } };
    const fromList = await solve({ ...inputs, stars }, model);
    fromList.stars.forEach((s, k) => {
      expect(s.parallaxMas!).toBeCloseTo(fromModel.stars[k].parallaxMas!, 9);
      expect(s.pmDecSigmaMasYr!).toBeCloseTo(fromModel.stars[k].pmDecSigmaMasYr!, 9);
    });
    // With priors, no sum-zero constraint is needed, and the notes do not claim one.
    expect(fromList.notes.join(' ')).toBe(fromModel.notes.join(' '));
    const ignored = await solve({ ...inputs, stars }, { ...model, starListSigma: false });
    expect(Math.abs(ignored.stars[0].parallaxMas! - fromList.stars[0].parallaxMas!)).toBeGreaterThan(1e-6);
  }, 120_000);

  it('takes each component from the model entry, else the list, else the default', () => {
    const star = { ...inputs.stars[0], positionSigmaMas: 7, pmSigmaMasYr: null };
    const base = { ...DEFAULT_JOINT_MODEL, catalogueSigma: { default: { positionMas: 20, pmMasYr: 2 }, stars: {} } };
    expect(catalogueSigmaOf(base, star)).toEqual({ positionMas: 7, pmMasYr: 2 });
    expect(catalogueSigmaOf({ ...base, starListSigma: false }, star)).toEqual({ positionMas: 20, pmMasYr: 2 });
    expect(catalogueSigmaOf({ ...base, catalogueSigma: { default: null, stars: { [star.id]: { positionMas: 3, pmMasYr: 0.5 } } } }, star)).toEqual({ positionMas: 3, pmMasYr: 0.5 });
    expect(catalogueSigmaOf(DEFAULT_JOINT_MODEL, { ...star, positionSigmaMas: undefined })).toEqual({ positionMas: null, pmMasYr: null });
  });
});
