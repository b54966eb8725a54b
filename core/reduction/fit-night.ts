import type { ClockFit } from '../instrument/clock-fit.ts';
import type { TaskControl } from '../task/task-control.ts';
import { TaskCancelledError } from '../task/task-control.ts';
import { ARCSEC, DEG } from '../units.ts';
import { hintsFor } from './night-blunders.ts';
import { clockCorrectionAtS } from './night-clock.ts';
import type { NightConstantName, NightReductionInput } from './night-inputs.ts';
import type { ConstantResult, NightReductionResult, TransitResult } from './night-result.ts';
import type { PrepareContext, PreparedTransit } from './prepare-transits.ts';
import type { HeldConstant } from './resolve-constants.ts';
import { MAX_OUTLIER_FRACTION, OUTLIER_SIGMAS, rejectOutliers, screenGrossBlunders } from './robust-rejection.ts';
import { fitTimeTerms, mayerCorrectionS, timeResidualS } from './time-fit.ts';
import type { TimeSolution } from './time-fit.ts';
import { fitZenithZero, zenithSteps } from './zenith-fit.ts';
import type { ZenithSolution } from './zenith-fit.ts';

/** Robust-scale floors: 2 ms of time and 20 mas, below any real night's scatter (noise-free data would reject rounding). */
export const TIME_SIGMA_FLOOR_S = 0.002;
export const ZENITH_SIGMA_FLOOR_RAD = 0.02 * ARCSEC;

/**
 * Gross-blunder limits, from the night's median residual at the a-priori constants: 60″ on the sky
 * in right ascension (4 s of time at the equator; azimuth, level and collimation of a working
 * instrument move a star by a few arcseconds on the sky, not more) and 30″ in zenith distance (half
 * a typical micrometer turn). Common practice for a screening step, chosen here, not from a source.
 */
export const GROSS_TIME_SKY_ARCSEC = 60;
export const GROSS_ZENITH_ARCSEC = 30;

export const OUTLIER_RULE = `first, residuals at the a-priori constants more than ${GROSS_TIME_SKY_ARCSEC}″ on the sky (right ascension) or ${GROSS_ZENITH_ARCSEC}″ (zenith distance) from the night's median are screened out as gross blunders; then |r·√w| > ${OUTLIER_SIGMAS} × max(1.4826·MAD corrected for the fit's degrees of freedom and small samples, floor) (floors ${TIME_SIGMA_FLOOR_S} s of time, ${ZENITH_SIGMA_FLOOR_RAD / ARCSEC}″), worst first, refitting after each, at most ${MAX_OUTLIER_FRACTION * 100} % of a night's transits, in right ascension and zenith distance separately`;

type Held = Record<NightConstantName, HeldConstant>;

function constant(held: HeldConstant, fitted: number, sigma: number | null): ConstantResult {
  return held ?? { value: fitted, sigma, source: 'fitted' };
}

function timeFit(prepared: readonly PreparedTransit[], held: Held, ctx: PrepareContext) {
  const terms = {
    clock: ctx.aprioriClock, freeClockOffset: held.clockOffsetS === null, freeClockRate: held.clockRateSPerDay === null,
    azimuthArcsec: held.azimuthArcsec?.value ?? null, levelArcsec: held.levelArcsec?.value ?? null, collimationArcsec: held.collimationArcsec?.value ?? null,
  };
  const freeCount = [terms.freeClockOffset, terms.freeClockRate, terms.azimuthArcsec === null, terms.levelArcsec === null, terms.collimationArcsec === null].filter(Boolean).length;
  const notRejected = prepared.flatMap((t, k) => (t.userRejected ? [] : [k]));
  const onSkyArcsec = (k: number): number => {
    const t = prepared[k];
    return 15 * Math.cos(t.prediction.topocentricDecRad) * timeResidualS(t, terms.clock, terms.azimuthArcsec ?? 0, terms.levelArcsec ?? 0, terms.collimationArcsec ?? 0);
  };
  const { kept: usable, gross } = screenGrossBlunders(notRejected, onSkyArcsec, GROSS_TIME_SKY_ARCSEC);
  if (usable.length < freeCount) {
    throw new RangeError(`${usable.length} usable transits for ${freeCount} free right-ascension constants; fix some constants (--fix) or observe more stars`);
  }
  const robust = rejectOutliers<TimeSolution>(usable, prepared.map((t) => t.weight), freeCount + 1, TIME_SIGMA_FLOOR_S, (included) => fitTimeTerms(prepared, included, terms));
  return { ...robust, outliers: [...gross, ...robust.outliers], gross };
}

function zenithFit(prepared: readonly PreparedTransit[], held: Held, flexureRad: number) {
  const withReading = prepared.flatMap((t, k) => (t.userRejected || t.zenithFromReadingRad === null ? [] : [k]));
  const heldZero = held.zenithZeroArcsec === null ? null : held.zenithZeroArcsec.value * ARCSEC;
  const residualArcsec = (k: number): number => (zenithSteps(prepared[k], heldZero ?? 0, flexureRad)?.residualRad ?? 0) / ARCSEC;
  const { kept: usable, gross } = screenGrossBlunders(withReading, residualArcsec, GROSS_ZENITH_ARCSEC);
  const robust = rejectOutliers<ZenithSolution>(usable, prepared.map((t) => t.weight), 2, ZENITH_SIGMA_FLOOR_RAD, (included) => fitZenithZero(prepared, included, heldZero, flexureRad));
  return { ...robust, outliers: [...gross, ...robust.outliers], gross };
}

function transitResult(t: PreparedTransit, time: TimeSolution, zero: ZenithSolution, flexureRad: number): Omit<TransitResult, 'outlierTime' | 'outlierZenith' | 'grossBlunderTime' | 'grossBlunderZenith' | 'hints'> {
  const correctionS = clockCorrectionAtS(time.clock, t.nominalS);
  const observedUtcS = t.nominalS + correctionS;
  const tau = mayerCorrectionS(t, time.azimuthArcsec, time.levelArcsec, time.collimationArcsec);
  const ocTimeS = 1.002737811911354 * (observedUtcS - t.prediction.utcS) + tau;
  const z = zenithSteps(t, zero.zeroRad, flexureRad);
  return {
    row: t.row.row, line: t.row.line, starId: t.star.id, culmination: t.row.culmination, clamp: t.row.clamp, timeKind: t.row.times.kind,
    wireCount: t.meanWire.wireCount, meanWireReadingS: t.meanWire.meanWireTimeS, meanWireSigmaS: t.meanWire.standardErrorS,
    clockCorrectionS: correctionS, observedUtcS,
    mayer: { ...t.factors, correctionS: tau },
    predictedUtcS: t.prediction.utcS, apparentRaDeg: t.prediction.apparentRaRad / DEG, apparentDecDeg: t.prediction.apparentDecRad / DEG,
    ocTimeS, ocRaArcsecCosDec: 15 * ocTimeS * Math.cos(t.prediction.topocentricDecRad),
    zenith: z === null || t.row.zenithReading === null ? null : {
      reading: t.row.zenithReading.value, readingUnit: t.row.zenithReading.unit, observedDeg: z.observedRad / DEG,
      refractionArcsec: z.refractionRad / ARCSEC, flexureTermArcsec: z.flexureTermRad / ARCSEC, trueDeg: z.trueRad / DEG,
      predictedDeg: t.prediction.zenithDistanceRad / DEG, side: t.prediction.side, weatherSource: t.weatherSource,
      ocZenithArcsec: z.residualRad / ARCSEC, ocDeclinationArcsec: z.declinationResidualRad / ARCSEC,
    },
    weight: t.weight, userRejected: t.userRejected,
  };
}

/** Fits the night's free constants (robustly), then builds every transit's result with blunder hints. */
export async function fitNight(
  input: NightReductionInput, prepared: readonly PreparedTransit[], held: Held, ctx: PrepareContext,
  clockFit: ClockFit | null, notes: string[], control: TaskControl,
): Promise<NightReductionResult> {
  const flexureRad = input.flexureArcsec * ARCSEC;
  const time = timeFit(prepared, held, ctx);
  const zen = zenithFit(prepared, held, flexureRad);
  if (time.capReached) notes.push(`right ascension: the ${MAX_OUTLIER_FRACTION * 100} % cap on rejections stopped the outlier search with large residuals left; look at this night by hand`);
  if (zen.capReached) notes.push(`zenith distance: the ${MAX_OUTLIER_FRACTION * 100} % cap on rejections stopped the outlier search with large residuals left`);
  const timeSigmaS = Math.max(time.fit.unitWeightErrorS ?? time.robustSigma, TIME_SIGMA_FLOOR_S);
  const zenithSigmaRad = Math.max(zen.fit.unitWeightErrorRad ?? zen.robustSigma, ZENITH_SIGMA_FLOOR_RAD);
  const search = {
    instrument: input.instrument, stars: input.stars, predictions: ctx.predictions, latitudeRad: ctx.site.latitudeRad, nightDateMjd: input.nightDateMjd, clock: time.fit.clock,
    azimuthArcsec: time.fit.azimuthArcsec, levelArcsec: time.fit.levelArcsec, collimationArcsec: time.fit.collimationArcsec, timeSigmaS, zenithSigmaRad,
  };
  const transits: TransitResult[] = [];
  for (const [k, t] of prepared.entries()) {
    if (control.cancellation.isCancelled) throw new TaskCancelledError('the nightly reduction', k);
    const base = transitResult(t, time.fit, zen.fit, flexureRad);
    const zenithOc = base.zenith === null ? null : base.zenith.ocZenithArcsec * ARCSEC;
    const hints = hintsFor(t, base.ocTimeS, zenithOc, { ...search, timeSigmaS: timeSigmaS / Math.sqrt(t.weight), zenithSigmaRad: zenithSigmaRad / Math.sqrt(t.weight) });
    transits.push({
      ...base, outlierTime: time.outliers.includes(k), outlierZenith: zen.outliers.includes(k),
      grossBlunderTime: time.gross.includes(k), grossBlunderZenith: zen.gross.includes(k), hints,
    });
  }
  await control.yieldToHost();
  const s = time.fit.sigmas;
  const constants = {
    clockOffsetS: constant(held.clockOffsetS, time.fit.clock.offsetS, s.clockOffsetS),
    clockRateSPerDay: constant(held.clockRateSPerDay, time.fit.clock.rateSPerDay, s.clockRateSPerDay),
    azimuthArcsec: constant(held.azimuthArcsec, time.fit.azimuthArcsec, s.azimuthArcsec),
    levelArcsec: constant(held.levelArcsec, time.fit.levelArcsec, s.levelArcsec),
    collimationArcsec: constant(held.collimationArcsec, time.fit.collimationArcsec, s.collimationArcsec),
    zenithZeroArcsec: constant(held.zenithZeroArcsec, zen.fit.zeroRad / ARCSEC, zen.fit.zeroSigmaRad === null ? null : zen.fit.zeroSigmaRad / ARCSEC),
  };
  return {
    instrumentId: input.instrument.id, nightDateMjd: input.nightDateMjd, constants, clockReferenceS: time.fit.clock.referenceS,
    clockComparisons: clockFit === null ? null : { count: input.clockComparisons.length, unitWeightErrorS: clockFit.unitWeightError, notes: clockFit.notes },
    transits, unitWeightErrorTimeS: time.fit.unitWeightErrorS, unitWeightErrorZenithArcsec: zen.fit.unitWeightErrorRad === null ? null : zen.fit.unitWeightErrorRad / ARCSEC,
    robustSigmaTimeS: time.robustSigma, robustSigmaZenithArcsec: zen.robustSigma / ARCSEC,
    freeTimeConstants: time.fit.freeNames, timeCorrelation: time.fit.correlation, outlierRule: OUTLIER_RULE, notes,
    carry: {
      clockOffsetS: constants.clockOffsetS.value, clockRateSPerDay: constants.clockRateSPerDay.value, azimuthArcsec: constants.azimuthArcsec.value,
      levelArcsec: constants.levelArcsec.value, collimationArcsec: constants.collimationArcsec.value, zenithZeroArcsec: constants.zenithZeroArcsec.value,
    },
  };
}
