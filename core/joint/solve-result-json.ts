import type { ArchiveSolveResult } from './solve-archive.ts';
import type { SolveInputs } from './solve-inputs.ts';
import { observationResiduals } from './solve-outputs.ts';

/**
 * A joint solve's result as plain JSON: the shape `meridian-ledger solve --json` prints and the app
 * saves with each reduction, built in one place so that a saved reduction and the CLI's output
 * compare key by key (keys: core/joint/SOLVE.md, "Output"). `starNights` gives, per star id, the
 * number of distinct nights the star was observed on (`stars[].observations` counts transits).
 * With `residuals`, every transit's residuals, weights and flags are added (large: one entry per
 * transit). `catalogue` is the star list the solve read (observation `star` indexes into it).
 */
export function solveResultJson(result: ArchiveSolveResult, catalogue: SolveInputs['stars'], options: { readonly residuals?: boolean } = {}): Record<string, unknown> {
  return {
    stars: result.stars, global: result.global, unitWeightError: result.unitWeightError, chiSquare: result.chiSquare,
    degreesOfFreedom: result.degreesOfFreedom, degeneracies: result.degeneracies, notes: result.notes,
    nights: result.nights.map((n) => ({ id: n.id, instrumentId: n.instrumentId, nightly: n.nightly })),
    segments: result.segments, latitudeVariation: result.latitudeVariation, varianceComponents: result.varianceComponents,
    correlation: result.correlation, instrumentSeries: result.instrumentSeries, signatures: result.signatures,
    starNights: nightsPerStar(result, catalogue),
    ...(options.residuals === true ? { residuals: observationResiduals(result.solution, result.layout, catalogue, result.nights, result.observations) } : {}),
  };
}

function nightsPerStar(result: ArchiveSolveResult, catalogue: SolveInputs['stars']): Record<string, number> {
  const nightsOfStar = new Map<string, Set<number>>();
  for (const o of result.observations) {
    const id = catalogue[o.star].id;
    const set = nightsOfStar.get(id) ?? new Set<number>();
    set.add(o.night);
    nightsOfStar.set(id, set);
  }
  return Object.fromEntries([...nightsOfStar].map(([id, set]) => [id, set.size]));
}
