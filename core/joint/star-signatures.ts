import type { JointSolution } from '../solver/index.ts';
import type { StarListRow } from '../formats/star-list.ts';
import type { JointLayout } from './build-joint-problem.ts';
import type { JointObservation } from './joint-observations.ts';

/**
 * One star's annual signal resolved onto its parallax phase and its aberration phase (a point on
 * the diagnostics dial): parallax follows Earth's barycentric position, aberration its velocity,
 * a quarter-year apart, so the two amplitudes separate; an instrument term left out of the model
 * lands away from both axes' expected values.
 */
export interface StarSignature {
  readonly id: string;
  /**
   * Amplitude on the parallax factors, mas (≈ the star's solved absolute parallax), with its 1σ
   * conditional on every other parameter (from the star's own rows: a lower bound, 2–5 times
   * smaller than the solve's parallax σ, which also carries the correlations with position,
   * proper motion and the nights' terms — use that one for the error bar of the parallax itself).
   */
  readonly parallaxPhaseMas: number; readonly parallaxPhaseConditionalSigmaMas: number;
  /** Amplitude on the aberration factors, mas of κ (≈ the solved Δκ when the model holds), with its conditional 1σ as above. */
  readonly aberrationPhaseMas: number; readonly aberrationPhaseConditionalSigmaMas: number;
  /** Correlation of the two amplitudes (−1…1): near ±1 when the star's season does not separate them. */
  readonly correlation: number;
  /** The star's parallax factors at its observed instants, for the parallax ellipse: TT (days since J2000.0), ∂(α cos δ)/∂ϖ and ∂δ/∂ϖ (mas per mas). */
  readonly parallaxFactors: { readonly ttDaysSinceJ2000: readonly number[]; readonly raFactor: readonly number[]; readonly decFactor: readonly number[] };
}

/** Row partials on ϖ and κ (mas per mas) of each coordinate, as build-joint-problem.ts sets them. */
function partials(o: JointObservation): { ra: [number, number]; zenith: [number, number] } {
  return { ra: [-o.cosDec * o.hourAnglePerParallax, -o.cosDec * o.hourAnglePerAberration], zenith: [o.zenithPerParallax, o.zenithPerAberration] };
}

/**
 * Per star, the weighted least-squares fit of its total annual signal — post-fit residual plus
 * its absolute parallax × parallax factor plus the solved Δκ × aberration factor, both
 * coordinates, final weights — to p·(parallax factor) + q·(aberration factor). The 2×2 inverse
 * times the solve's covariance factor gives conditional errors (see StarSignature). An annual
 * signal the model leaves out (a thermal term) moves the aberration amplitude by many of them.
 */
export function starSignatures(solution: JointSolution, layout: JointLayout, stars: readonly StarListRow[], observations: readonly JointObservation[]): StarSignature[] {
  const count = stars.length;
  const n = new Float64Array(3 * count), b = new Float64Array(2 * count);
  const factors = stars.map(() => ({ ttDaysSinceJ2000: [] as number[], raFactor: [] as number[], decFactor: [] as number[] }));
  const deltaKappa = layout.deltaKappa >= 0 ? solution.globalEstimate[layout.deltaKappa] : 0;
  const add = (star: number, row: number, p: number, a: number, parallaxMas: number): void => {
    if (row < 0) return;
    const w = solution.finalWeight[row];
    const y = solution.residual[row] + parallaxMas * p + deltaKappa * a;
    n[3 * star] += w * p * p; n[3 * star + 1] += w * p * a; n[3 * star + 2] += w * a * a;
    b[2 * star] += w * p * y; b[2 * star + 1] += w * a * y;
  };
  const parallaxOf = stars.map((s, i) => (s.parallaxMas ?? 0) + (layout.star[i].parallax >= 0 ? solution.globalEstimate[layout.star[i].parallax] : 0));
  observations.forEach((o, k) => {
    const { ra, zenith } = partials(o);
    add(o.star, layout.raRow[k], ra[0], ra[1], parallaxOf[o.star]);
    add(o.star, layout.zenithRow[k], zenith[0], zenith[1], parallaxOf[o.star]);
    const f = factors[o.star];
    f.ttDaysSinceJ2000.push(o.ttDaysSinceJ2000); f.raFactor.push(ra[0]); f.decFactor.push(o.zenithPerParallax * o.zenithPerDec);
  });
  const out: StarSignature[] = [];
  stars.forEach((star, i) => {
    const [npp, npa, naa] = [n[3 * i], n[3 * i + 1], n[3 * i + 2]];
    const det = npp * naa - npa * npa;
    if (!(det > 1e-12 * npp * naa) || factors[i].raFactor.length === 0) return;
    const scale = solution.covarianceFactor;
    const p = (naa * b[2 * i] - npa * b[2 * i + 1]) / det, q = (npp * b[2 * i + 1] - npa * b[2 * i]) / det;
    out.push({
      id: star.id, parallaxPhaseMas: p, parallaxPhaseConditionalSigmaMas: Math.sqrt((scale * naa) / det),
      aberrationPhaseMas: q, aberrationPhaseConditionalSigmaMas: Math.sqrt((scale * npp) / det), correlation: -npa / Math.sqrt(npp * naa),
      parallaxFactors: factors[i],
    });
  });
  return out;
}
