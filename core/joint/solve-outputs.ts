import { ObservationFlag, type JointSolution } from '../solver/index.ts';
import type { StarListRow } from '../formats/star-list.ts';
import type { JointLayout } from './build-joint-problem.ts';
import type { SegmentableTerm } from './joint-model.ts';
import type { TermSegment } from './segment-terms.ts';
import type { JointNight, JointObservation } from './joint-observations.ts';

/** The correlation matrix of the star and global parameters, in the solver's order (names as in core/joint/build-joint-problem.ts, unit in brackets). */
export interface CorrelationMatrix {
  readonly names: readonly string[];
  /** names.length rows of names.length values in −1…1; a parameter not estimated has 1 on the diagonal and 0 elsewhere. */
  readonly matrix: readonly (readonly number[])[];
}

export function correlationOf(solution: JointSolution): CorrelationMatrix {
  const n = solution.globalNames.length;
  const matrix = Array.from({ length: n }, (_, i) => Array.from(solution.globalCorrelation.subarray(i * n, (i + 1) * n)));
  return { names: [...solution.globalNames], matrix };
}

/** One night's instrument terms as solved: the nightly reduction's value plus the joint correction; σ null for a term held fixed or absent. */
export interface NightInstrumentTerms {
  readonly id: string;
  readonly instrumentId: string;
  readonly nightDateMjd: number;
  /** Mean TT of the night's transits, days since J2000.0, and their mean temperature (°C). */
  readonly ttDaysSinceJ2000: number;
  readonly temperatureC: number;
  readonly transits: number;
  readonly clockOffsetS: number; readonly clockOffsetSigmaS: number | null;
  readonly clockRateSPerDay: number; readonly clockRateSigmaSPerDay: number | null;
  readonly azimuthArcsec: number; readonly azimuthSigmaArcsec: number | null;
  readonly levelArcsec: number; readonly levelSigmaArcsec: number | null;
  readonly collimationArcsec: number; readonly collimationSigmaArcsec: number | null;
  readonly zeroPointArcsec: number; readonly zeroPointSigmaArcsec: number | null;
}

/**
 * Per-night instrument series (clock offset s, rate s/day, a, b, c and zero point arcsec):
 * the locals of block 2n (right ascension) and 2n+1 (zero point) converted from ms, ms/day and
 * mas and added to the nightly reduction's constants, as JointNight.nightly documents; a term
 * held per segment gives its segment's value (and drift) at the night's mean time instead.
 */
export function instrumentSeries(solution: JointSolution, layout: JointLayout, nights: readonly JointNight[], observations: readonly JointObservation[]): NightInstrumentTerms[] {
  const tt = new Float64Array(nights.length), temperature = new Float64Array(nights.length), count = new Int32Array(nights.length);
  for (const o of observations) { tt[o.night] += o.ttDaysSinceJ2000; temperature[o.night] += o.temperatureC; count[o.night]++; }
  return nights.map((night, n) => {
    const term = (block: number, index: number, base: number, scale: number): [number, number | null] => {
      if (index < 0 || solution.localOffset[block + 1] - solution.localOffset[block] <= index) return [base, null];
      const k = solution.localOffset[block] + index;
      return [base + solution.localEstimate[k] * scale, solution.localError[k] * scale];
    };
    const v = night.nightly;
    const meanTt = tt[n] / Math.max(count[n], 1);
    const spanned = (term: SegmentableTerm, perNight: [number, number | null]): [number, number | null] => {
      const k = layout.nightSegment[term][n];
      return k < 0 ? perNight : segmentValueAt(solution, layout.segments[k], meanTt);
    };
    const [clockOffsetS, clockOffsetSigmaS] = term(2 * n, layout.clockOffset, v.clockOffsetS, 1e-3);
    const [clockRateSPerDay, clockRateSigmaSPerDay] = spanned('clockRate', term(2 * n, layout.clockRate, v.clockRateSPerDay, 1e-3));
    const [azimuthArcsec, azimuthSigmaArcsec] = spanned('azimuth', term(2 * n, layout.azimuth, v.azimuthArcsec, 1e-3));
    const [levelArcsec, levelSigmaArcsec] = spanned('level', term(2 * n, layout.level, v.levelArcsec, 1e-3));
    const [collimationArcsec, collimationSigmaArcsec] = spanned('collimation', term(2 * n, layout.collimation, v.collimationArcsec, 1e-3));
    const [zeroPointArcsec, zeroPointSigmaArcsec] = spanned('zeroPoint', term(2 * n + 1, layout.zeroPoint, v.zenithZeroArcsec, 1e-3));
    return {
      id: night.id, instrumentId: night.instrumentId, nightDateMjd: night.nightDateMjd,
      ttDaysSinceJ2000: tt[n] / Math.max(count[n], 1), temperatureC: temperature[n] / Math.max(count[n], 1), transits: count[n],
      clockOffsetS, clockOffsetSigmaS, clockRateSPerDay, clockRateSigmaSPerDay, azimuthArcsec, azimuthSigmaArcsec,
      levelArcsec, levelSigmaArcsec, collimationArcsec, collimationSigmaArcsec, zeroPointArcsec, zeroPointSigmaArcsec,
    };
  });
}

/** A segment's value at TT `ttDays` (days since J2000.0) in the series' unit (s/day or arcsec: the joint unit / 1000) with its σ from the covariance of value and drift. */
export function segmentValueAt(solution: JointSolution, segment: TermSegment, ttDays: number): [number, number] {
  const n = solution.globalNames.length, i = segment.value, j = segment.drift;
  const dt = j < 0 ? 0 : (ttDays - segment.referenceTtDays) / 365.25;
  const value = solution.globalEstimate[i] + (j < 0 ? 0 : dt * solution.globalEstimate[j]);
  const c = solution.globalCovariance;
  const variance = c[i * n + i] + (j < 0 ? 0 : dt * dt * c[j * n + j] + 2 * dt * c[i * n + j]);
  return [value * 1e-3, Math.sqrt(Math.max(variance, 0)) * 1e-3];
}

const FLAG_NAMES: Record<number, string> = Object.fromEntries(Object.entries(ObservationFlag).map(([name, code]) => [code, name]));

/** One coordinate of one transit after the solve: residual (O − C minus the fitted corrections, mas), final weight (1/mas²), flag (fit, downweighted, outlier, untestable, rejected). */
export interface CoordinateResidual {
  readonly residualMas: number;
  readonly weight: number;
  readonly flag: string;
}

export interface ObservationResidual {
  readonly starId: string;
  readonly nightId: string;
  readonly utcMjd: number;
  /** Right ascension on the sky (Δα·cos δ) and zenith distance; zenith null without a reading. */
  readonly ra: CoordinateResidual;
  readonly zenith: CoordinateResidual | null;
}

/** Every observation's residuals, final weights and flags, in archive order (large: built on request). */
export function observationResiduals(solution: JointSolution, layout: JointLayout, stars: readonly StarListRow[], nights: readonly JointNight[], observations: readonly JointObservation[]): ObservationResidual[] {
  const row = (k: number): CoordinateResidual | null => (k < 0 ? null
    : { residualMas: solution.residual[k], weight: solution.finalWeight[k], flag: FLAG_NAMES[solution.flag[k]] ?? `code ${solution.flag[k]}` });
  return observations.map((o, i) => ({
    starId: stars[o.star].id, nightId: nights[o.night].id, utcMjd: o.utcMjd, ra: row(layout.raRow[i])!, zenith: row(layout.zenithRow[i]),
  }));
}
