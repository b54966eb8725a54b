import type { StarListRow } from '../formats/star-list.ts';
import type { JointSolution } from '../solver/index.ts';
import type { JointLayout } from './build-joint-problem.ts';
import type { JointObservation } from './joint-observations.ts';

const MONTHS = ['January', 'February', 'March', 'April', 'May', 'June', 'July', 'August', 'September', 'October', 'November', 'December'];

/** The months (0–11, from the day of year of TT) a star is observed in, as the shortest covering run, e.g. "March–May"; null when it covers 6 months or more. */
export function seasonOf(observations: readonly JointObservation[], star: number): string | null {
  const months = new Set<number>();
  for (const o of observations) if (o.star === star) months.add(Math.floor((((o.ttDaysSinceJ2000 / 365.25) % 1 + 1) % 1) * 12));
  if (months.size === 0 || months.size >= 6) return null;
  // The covering run starts after the largest gap in the cycle of months.
  const sorted = [...months].sort((a, b) => a - b);
  let start = sorted[0], gap = sorted[0] + 12 - sorted[sorted.length - 1];
  for (let i = 1; i < sorted.length; i++) if (sorted[i] - sorted[i - 1] > gap) { gap = sorted[i] - sorted[i - 1]; start = sorted[i]; }
  const end = (start + 12 - gap) % 12;
  return start === end ? `${MONTHS[start]} only` : `${MONTHS[start]}–${MONTHS[end]}`;
}

function plainName(name: string): string {
  return name.replace(/ \(.*\)$/, '').replace('Δϖ', 'parallax').replace('Δμα*', 'proper motion in RA').replace('Δμδ', 'proper motion in Dec')
    .replace('Δα*₀', 'RA position').replace('Δδ₀', 'Dec position');
}

/**
 * The degeneracy report (core/solver) in words: each weak or singular direction with its
 * parameters, its condition index √(λmax/λ), how it was resolved, and for star parameters the
 * season the star is seen in when that is under half a year (the usual cause, DESIGN §4).
 */
export function describeDegeneracies(solution: JointSolution, observations: readonly JointObservation[], stars: readonly StarListRow[], layout: JointLayout): string[] {
  const report = solution.degeneracy;
  if (report === null) return [];
  const starOf = new Map<string, number>();
  layout.star.forEach((s, i) => { for (const g of [s.ra, s.dec, s.pmRa, s.pmDec, s.parallax]) if (g >= 0) starOf.set(solution.globalNames[g], i); });
  const out: string[] = [];
  for (const w of report.weakest) {
    if (w.status === 'determined') continue;
    const conditionIndex = Math.sqrt(1 / Math.max(w.relativeEigenvalue, Number.EPSILON));
    const parts = w.combination.filter((c) => Math.abs(c.coefficient) >= 0.2);
    const byStar = new Map<string, string[]>();
    const others: string[] = [];
    for (const c of parts) {
      const s = starOf.get(c.name);
      if (s === undefined) others.push(plainName(c.name));
      else byStar.set(stars[s].id, [...(byStar.get(stars[s].id) ?? []), plainName(c.name).replace(`${stars[s].id} `, '')]);
    }
    const phrases = [...byStar].map(([id, terms]) => {
      const season = seasonOf(observations, stars.findIndex((s) => s.id === id));
      return `${terms.join(' and ')} of star ${id}${season ? `: seen only in ${season}` : ''}`;
    });
    const priors = w.resolvedBy.filter((r) => r.startsWith('prior on ')).length;
    const named = [...w.resolvedBy.filter((r) => !r.startsWith('prior on ')), ...(priors > 0 ? [`${priors} prior(s) (catalogue, clock comparisons, level)`] : [])];
    const how = w.resolution === 'constraint' ? `fixed by ${named.join(', ')}` : w.resolution === 'minimum-norm' ? 'not determined: solved as minimum norm, its parameters\' errors hold only with it at zero' : 'left to the data';
    out.push(`${w.status} combination (condition index ${conditionIndex.toFixed(0)}): ${[...phrases, ...others].join('; ') || 'spread over many parameters'} — ${how}`);
  }
  for (const b of report.singularBlocks.slice(0, 5)) out.push(`night block ${b.block}: ${b.combination.map((c) => c.name).join(', ')} cannot be separated; minimum norm used`);
  if (report.singularBlockCount > 5) out.push(`${report.singularBlockCount - 5} more night blocks with a singular combination`);
  return out;
}
