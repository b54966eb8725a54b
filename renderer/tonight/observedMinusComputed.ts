import type { InstrumentRecord } from '../../core/archive/records.ts';
import { blunderHints } from '../../core/instrument/blunder-hints.ts';
import type { ClampPosition } from '../../core/instrument/culmination.ts';
import { clampSign } from '../../core/instrument/culmination.ts';
import { reduceToMeanWire, STELLAR_REVOLUTIONS_PER_UT1_DAY, wireHourAngleIntervalRad } from '../../core/instrument/wire-reduction.ts';
import { zenithDistanceFromReading } from '../../core/instrument/zenith-distance.ts';
import { ARCSEC, DEG, SECOND_OF_TIME_ANGLE, SECONDS_PER_DAY } from '../../core/units.ts';
import type { WireEntry } from './entryParsing.ts';
import type { ProgrammeRow } from './programmeRows.ts';

/** The limits beyond which an O−C is flagged at once; set by the user. */
export interface Tolerances {
  readonly timeS: number;
  readonly zenithArcsec: number;
}

/** The O−C of one entry as typed. */
export interface EntryCheck {
  /** Mean-wire clock time, MJD. */
  readonly meanClockMjd: number;
  /** Observed mean wire − predicted transit, both on the instrument clock, seconds of time. */
  readonly timeOmcS: number;
  /** Each observed wire's reduced time minus the mean, seconds (empty for a single time). */
  readonly wireResidualsS: readonly number[];
  /** Zenith distance from the reading − predicted zenith distance, arcseconds; null without a reading. */
  readonly zenithOmcArcsec: number | null;
  readonly timeFlagged: boolean;
  readonly zenithFlagged: boolean;
  /** Probable causes (core blunderHints), best first, in words. */
  readonly hints: readonly string[];
}

/** The micrometer scale of an instrument with tonight's zero point (degrees). */
export function zenithOfReadingRad(reading: number, instrument: InstrumentRecord, zeroPointDeg: number): number {
  return zenithDistanceFromReading(reading, { zeroPointRad: zeroPointDeg * DEG, scaleRadPerUnit: instrument.readingScaleArcsecPerUnit * ARCSEC, sense: instrument.readingSense });
}

function direction(row: ProgrammeRow, clamp: ClampPosition): number {
  return (row.transit.culmination === 'upper' ? 1 : -1) * clampSign(clamp);
}

/**
 * The clock time (MJD) at which the star should cross each wire: the mean-wire prediction moved
 * back by each wire's hour-angle interval (the inverse of core reduceToMeanWire; mean solar clock).
 */
export function expectedWireClockMjd(row: ProgrammeRow, predictedClockMjd: number, instrument: InstrumentRecord, clamp: ClampPosition): number[] {
  return instrument.wireIntervalsEquatorialS.map((intervalS) => {
    const hourAngleS = wireHourAngleIntervalRad(intervalS * SECOND_OF_TIME_ANGLE, row.transit.declinationRad) / SECOND_OF_TIME_ANGLE;
    return predictedClockMjd - (direction(row, clamp) * hourAngleS) / STELLAR_REVOLUTIONS_PER_UT1_DAY / SECONDS_PER_DAY;
  });
}

/**
 * O−C as typed: wires reduced to the mean wire (core reduceToMeanWire, mean solar clock), minus
 * the predicted clock time; the reading turned into a zenith distance minus the predicted one.
 * Flags beyond the tolerances, and asks core blunderHints for causes with σ = tolerance / 5, so
 * a hint is offered exactly when an O−C passes its tolerance. `others` are the night's other
 * rows with their predicted clock times, for the "wrong star" hint.
 */
export function checkEntry(
  row: ProgrammeRow,
  predictedClockMjd: number,
  wires: WireEntry,
  reading: number | null,
  instrument: InstrumentRecord,
  setting: { readonly zeroPointDeg: number; readonly clamp: ClampPosition; readonly tolerances: Tolerances },
  others: readonly { readonly catalogueId: string; readonly predictedClockMjd: number }[],
): EntryCheck {
  const relativeS = (mjd: number) => (mjd - predictedClockMjd) * SECONDS_PER_DAY;
  let meanS: number;
  let wireResidualsS: readonly number[] = [];
  const observed = wires.wireClockMjd.flatMap((mjd, wireIndex) => (mjd === null ? [] : [{ wireIndex, clockTimeS: relativeS(mjd) }]));
  if (wires.single || instrument.wireIntervalsEquatorialS.length === 0) {
    meanS = observed[0].clockTimeS;
  } else {
    const reduction = reduceToMeanWire(observed, instrument.wireIntervalsEquatorialS, row.transit.declinationRad, row.transit.culmination, setting.clamp, 'mean-solar');
    meanS = reduction.meanWireTimeS;
    wireResidualsS = reduction.residualsS;
  }
  const zenithOmcRad = reading === null ? null : zenithOfReadingRad(reading, instrument, setting.zeroPointDeg) - row.transit.observedZenithRad;
  const { timeS, zenithArcsec } = setting.tolerances;
  const intervals = instrument.wireIntervalsEquatorialS;
  const candidates = blunderHints({
    timeResidualS: meanS,
    timeSigmaS: timeS / 5,
    zenithResidualRad: zenithOmcRad,
    zenithSigmaRad: (zenithArcsec * ARCSEC) / 5,
    declinationRad: row.transit.declinationRad,
    adjacentWireSpacingsS: intervals.slice(1).map((interval, k) => Math.abs(interval - intervals[k])),
    observedWireCount: wires.single ? 1 : observed.length,
    micrometerRadPerTurn: instrument.readingUnit === 'micrometer-turn' ? instrument.readingScaleArcsecPerUnit * ARCSEC : null,
    otherCulminationResidualS: null,
    otherStarResidualsS: others.map((other) => ({ starId: other.catalogueId, residualS: meanS - relativeS(other.predictedClockMjd) })),
  });
  return {
    meanClockMjd: predictedClockMjd + meanS / SECONDS_PER_DAY,
    timeOmcS: meanS,
    wireResidualsS,
    zenithOmcArcsec: zenithOmcRad === null ? null : zenithOmcRad / ARCSEC,
    timeFlagged: Math.abs(meanS) > timeS,
    zenithFlagged: zenithOmcRad !== null && Math.abs(zenithOmcRad / ARCSEC) > zenithArcsec,
    hints: candidates.map((candidate) => candidate.detail),
  };
}
