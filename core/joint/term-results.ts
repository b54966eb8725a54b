import type { JointSolution } from '../solver/index.ts';
import type { JointLayout } from './build-joint-problem.ts';
import type { JointModel } from './joint-model.ts';
import type { LatitudeVariationResult, SegmentResult } from './solve-archive.ts';

/** Each segment's value and drift with σ, converted from the joint units (ms/day, mas) to s/day and arcsec. */
export function segmentResults(solution: JointSolution, layout: JointLayout): SegmentResult[] {
  return layout.segments.map((s) => ({
    term: s.term, instrumentId: s.instrumentId, number: s.number, fromUtcMjd: s.fromUtcMjd, toUtcMjd: s.toUtcMjd, nights: s.nights.length,
    referenceTtDaysSinceJ2000: s.referenceTtDays,
    value: solution.globalEstimate[s.value] * 1e-3, valueSigma: solution.globalError[s.value] * 1e-3,
    driftPerYear: s.drift < 0 ? null : solution.globalEstimate[s.drift] * 1e-3, driftSigmaPerYear: s.drift < 0 ? null : solution.globalError[s.drift] * 1e-3,
  }));
}

/** The latitude-variation pairs in arcsec with their amplitude; the amplitude's σ is first-order error propagation of √(c² + s²). */
export function latitudeVariationResults(solution: JointSolution, layout: JointLayout, model: JointModel): LatitudeVariationResult[] {
  const n = solution.globalNames.length;
  return layout.latitudeVariation.map(([i, j], k) => {
    const c = solution.globalEstimate[i], s = solution.globalEstimate[j], v = solution.globalCovariance;
    const amplitude = Math.hypot(c, s);
    const variance = amplitude > 0 ? (c * c * v[i * n + i] + s * s * v[j * n + j] + 2 * c * s * v[i * n + j]) / (amplitude * amplitude) : v[i * n + i];
    return {
      periodDays: model.latitudeVariationPeriodsDays[k], cosArcsec: c * 1e-3, cosSigmaArcsec: solution.globalError[i] * 1e-3,
      sinArcsec: s * 1e-3, sinSigmaArcsec: solution.globalError[j] * 1e-3, amplitudeArcsec: amplitude * 1e-3, amplitudeSigmaArcsec: Math.sqrt(Math.max(variance, 0)) * 1e-3,
    };
  });
}
