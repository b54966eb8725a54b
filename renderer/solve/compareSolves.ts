import type { SavedResults } from './savedResults.ts';

/** One star in two solves: values (mas, mas/yr) and the difference second − first in units of σ. */
export interface ComparedStar {
  readonly id: string;
  readonly first: { readonly parallaxMas: number | null; readonly parallaxSigmaMas: number | null; readonly pmRaMasYr: number | null; readonly pmDecMasYr: number | null } | null;
  readonly second: ComparedStar['first'];
  /** (second − first) / √(σ₁² + σ₂²) for parallax and both proper motions; null when either lacks a value or σ. */
  readonly parallaxSigmas: number | null;
  readonly pmRaSigmas: number | null;
  readonly pmDecSigmas: number | null;
}

function sigmas(a: number | null | undefined, sa: number | null | undefined, b: number | null | undefined, sb: number | null | undefined): number | null {
  if (a == null || b == null || sa == null || sb == null) return null;
  const combined = Math.hypot(sa, sb);
  return combined > 0 ? (b - a) / combined : null;
}

/**
 * Side-by-side stars of two solves, in the first solve's order then stars only the second has.
 * The σ of a difference treats the two solves as independent; two solves of the same transits are
 * strongly correlated, so a difference of even 0.3σ between them is worth a look (common practice).
 */
export function compareSolves(first: SavedResults, second: SavedResults): ComparedStar[] {
  const byId = new Map(second.stars.map((s) => [s.id, s]));
  const ids = [...first.stars.map((s) => s.id), ...second.stars.map((s) => s.id).filter((id) => !first.stars.some((s) => s.id === id))];
  const firstById = new Map(first.stars.map((s) => [s.id, s]));
  return ids.map((id) => {
    const a = firstById.get(id), b = byId.get(id);
    const pick = (s: typeof a) => (s === undefined ? null : { parallaxMas: s.parallaxMas, parallaxSigmaMas: s.parallaxSigmaMas, pmRaMasYr: s.pmRaMasYr, pmDecMasYr: s.pmDecMasYr });
    return {
      id, first: pick(a), second: pick(b),
      parallaxSigmas: sigmas(a?.parallaxMas, a?.parallaxSigmaMas, b?.parallaxMas, b?.parallaxSigmaMas),
      pmRaSigmas: sigmas(a?.pmRaMasYr, a?.pmRaSigmaMasYr, b?.pmRaMasYr, b?.pmRaSigmaMasYr),
      pmDecSigmas: sigmas(a?.pmDecMasYr, a?.pmDecSigmaMasYr, b?.pmDecMasYr, b?.pmDecSigmaMasYr),
    };
  });
}
