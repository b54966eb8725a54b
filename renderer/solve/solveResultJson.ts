import type { ArchiveSolveResult } from '../../core/joint/solve-archive.ts';
import type { SolveInputs } from '../../core/joint/solve-inputs.ts';

/**
 * A solve's results as plain JSON, in the shape `meridian-ledger solve --json` prints
 * (main/cli/commands/solve.ts, which the renderer may not import), so that a saved reduction and
 * the CLI's output can be compared key by key. `starNights` adds, per star id, the number of
 * distinct nights the star was observed on (the CLI gives transits only). `catalogue` is the star
 * list the solve read (observation `star` indexes into it).
 */
export function solveResultJson(result: ArchiveSolveResult, catalogue: SolveInputs['stars']): Record<string, unknown> {
  const nightsOfStar = new Map<string, Set<number>>();
  for (const o of result.observations) {
    const id = catalogue[o.star].id;
    const set = nightsOfStar.get(id) ?? new Set<number>();
    set.add(o.night);
    nightsOfStar.set(id, set);
  }
  return {
    stars: result.stars, global: result.global, unitWeightError: result.unitWeightError, chiSquare: result.chiSquare,
    degreesOfFreedom: result.degreesOfFreedom, degeneracies: result.degeneracies, notes: result.notes,
    nights: result.nights.map((n) => ({ id: n.id, instrumentId: n.instrumentId, nightly: n.nightly })),
    segments: result.segments, latitudeVariation: result.latitudeVariation, varianceComponents: result.varianceComponents,
    correlation: result.correlation, instrumentSeries: result.instrumentSeries, signatures: result.signatures,
    starNights: Object.fromEntries([...nightsOfStar].map(([id, set]) => [id, set.size])),
  };
}
