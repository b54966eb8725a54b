import type { StarListRow } from '../formats/star-list.ts';
import type { InstrumentRecord } from '../formats/site-description.ts';
import { blunderHints } from '../instrument/blunder-hints.ts';
import type { BlunderCandidate } from '../instrument/blunder-hints.ts';
import { mayerFactors } from '../instrument/mayer.ts';
import { ARCSEC } from '../units.ts';
import { nominalClockSeconds } from './night-clock.ts';
import type { NightClockModel } from './night-clock.ts';
import { wireSeconds } from './prepare-transits.ts';
import type { PreparedTransit } from './prepare-transits.ts';
import { reduceToMeanWire } from '../instrument/wire-reduction.ts';
import type { NightPredictions } from './star-predictions.ts';
import { timeResidualS } from './time-fit.ts';

/** Stars whose catalogue right ascension puts their passage within this of the observation are tried as "wrong star" (s). */
const WRONG_STAR_WINDOW_S = 900;

export interface BlunderSearch {
  readonly instrument: InstrumentRecord;
  readonly stars: readonly StarListRow[];
  readonly predictions: NightPredictions;
  readonly latitudeRad: number;
  readonly nightDateMjd: number;
  readonly clock: NightClockModel;
  readonly azimuthArcsec: number;
  readonly levelArcsec: number;
  readonly collimationArcsec: number;
  readonly timeSigmaS: number;
  readonly zenithSigmaRad: number;
}

/** The time residual the same observation would have as another star or culmination (null when that passage cannot be computed). */
function residualAs(t: PreparedTransit, star: StarListRow, culmination: 'upper' | 'lower', roughUtcS: number, search: BlunderSearch): number | null {
  try {
    const prediction = search.predictions.nearest(star, culmination, roughUtcS);
    const factors = mayerFactors(search.latitudeRad, prediction.topocentricDecRad, culmination);
    // The mean wire depends on the star (sec δ of the wire intervals, direction of motion): reduce again.
    const scale = t.row.times.kind === 'utc' ? 'mean-solar' : search.instrument.clockTimeScale;
    const intervals = search.instrument.wireIntervalsS.length === 0 ? [0] : search.instrument.wireIntervalsS;
    const meanWire = reduceToMeanWire(wireSeconds(t.row, search.nightDateMjd), intervals, prediction.topocentricDecRad, culmination, t.row.clamp, scale);
    const nominalS = nominalClockSeconds(meanWire.meanWireTimeS, scale);
    const as: PreparedTransit = { ...t, star, prediction, factors, meanWire, nominalS, row: { ...t.row, starId: star.id, culmination } };
    return timeResidualS(as, search.clock, search.azimuthArcsec, search.levelArcsec, search.collimationArcsec);
  } catch {
    return null;
  }
}

/** Catalogue-place difference of passage times (s, wrapped to ±12 h): a coarse filter before the full prediction. */
function roughPassageGapS(a: StarListRow, b: StarListRow): number {
  const gap = ((b.raDeg - a.raDeg) / 15) * 3600 * 0.99727;
  return gap - 86_164 * Math.round(gap / 86_164);
}

/**
 * Probable causes for a large residual of transit `t` (blunderHints): wire miscount from the
 * instrument's adjacent wire spacings, a whole micrometer turn, a clock second or minute, the other
 * culmination (its passage computed), or another programme star whose passage falls within 15 min
 * of this one (computed in full). `ocTimeS` and `ocZenithRad` are the residuals of `t`.
 */
export function hintsFor(t: PreparedTransit, ocTimeS: number, ocZenithRad: number | null, search: BlunderSearch): BlunderCandidate[] {
  const intervals = search.instrument.wireIntervalsS;
  const spacings = intervals.slice(1).map((v, k) => Math.abs(v - intervals[k]));
  // blunderHints offers causes only from 5σ on; the costly passages are computed only then.
  const large = Math.abs(ocTimeS) >= 5 * search.timeSigmaS;
  const other = t.row.culmination === 'upper' ? 'lower' : 'upper';
  const observedUtcS = t.prediction.utcS + ocTimeS / 1.0027379;
  const otherStarResidualsS = large
    ? search.stars
        .filter((s) => s.id !== t.star.id && Math.abs(roughPassageGapS(t.star, s) - ocTimeS) < WRONG_STAR_WINDOW_S)
        .flatMap((s) => {
          const residualS = residualAs(t, s, t.row.culmination, observedUtcS, search);
          return residualS === null ? [] : [{ starId: s.id, residualS }];
        })
    : [];
  const otherCulminationResidualS = large ? residualAs(t, t.star, other, observedUtcS, search) : null;
  const micrometer = search.instrument.zenithScale;
  return blunderHints({
    timeResidualS: ocTimeS,
    timeSigmaS: search.timeSigmaS,
    zenithResidualRad: ocZenithRad,
    zenithSigmaRad: search.zenithSigmaRad,
    declinationRad: t.prediction.topocentricDecRad,
    adjacentWireSpacingsS: spacings,
    observedWireCount: t.meanWire.wireCount,
    micrometerRadPerTurn: micrometer !== null && micrometer.unit === 'turn' && t.row.zenithReading?.unit === 'turns' ? micrometer.arcsecPerUnit * ARCSEC : null,
    otherCulminationResidualS,
    otherStarResidualsS,
  });
}
