import { regularizedIncompleteBeta } from './incomplete-beta.ts';

function check(f: number, d1: number, d2: number, what: string): void {
  if (!(d1 > 0 && d2 > 0)) throw new RangeError(`${what}: degrees of freedom ${d1}, ${d2} must be positive`);
  if (!(f >= 0) || Number.isNaN(f)) throw new RangeError(`${what}: F = ${f}; pass F ≥ 0`);
}

/** P(F ≤ f) for Fisher's F with (d1, d2) degrees of freedom: I_{d1 f/(d1 f + d2)}(d1/2, d2/2) (A&S 26.6.2). */
export function fDistributionCdf(f: number, d1: number, d2: number): number {
  check(f, d1, d2, 'fDistributionCdf');
  if (f === Infinity) return 1;
  return regularizedIncompleteBeta((d1 * f) / (d1 * f + d2), d1 / 2, d2 / 2);
}

/** P(F > f), computed directly as I_{d2/(d2 + d1 f)}(d2/2, d1/2) so that small tail probabilities keep their digits. */
export function fDistributionSurvival(f: number, d1: number, d2: number): number {
  check(f, d1, d2, 'fDistributionSurvival');
  if (f === Infinity) return 0;
  return regularizedIncompleteBeta(d2 / (d2 + d1 * f), d2 / 2, d1 / 2);
}
