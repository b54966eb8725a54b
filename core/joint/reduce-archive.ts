import { utcCountS } from '../formats/utc-instant.ts';
import { defaultNightConfiguration, type NightReductionInput } from '../reduction/night-inputs.ts';
import { reduceObservingNight } from '../reduction/reduce-observing-night.ts';
import type { TransitResult } from '../reduction/night-result.ts';
import { TaskCancelledError, type TaskControl } from '../task/task-control.ts';
import type { TimeScale } from '../time/timescale.ts';
import type { TransitLogRow } from '../formats/transit-log.ts';
import type { JointModel } from './joint-model.ts';
import type { JointNight, JointObservation } from './joint-observations.ts';
import { nightKey, type SolveInputs } from './solve-inputs.ts';

const SIDEREAL_PER_UT1 = 1.002737811911354; // IERS Conventions 2010 eq. 5.15, as core/reduction uses it

export interface ReducedArchive {
  readonly nights: readonly JointNight[];
  readonly observations: JointObservation[];
  /** Nights the nightly reduction refused, with its reasons (the joint solve goes on without them). */
  readonly skipped: readonly string[];
}

function groupByNight(rows: readonly TransitLogRow[], defaultInstrument: string): Map<string, { mjd: number; instrumentId: string; rows: TransitLogRow[] }> {
  const out = new Map<string, { mjd: number; instrumentId: string; rows: TransitLogRow[] }>();
  for (const row of rows) {
    if (row.nightDateMjd === null) continue;
    const instrumentId = row.instrumentId ?? defaultInstrument;
    const key = nightKey(row.nightDateMjd, instrumentId);
    const entry = out.get(key) ?? { mjd: row.nightDateMjd, instrumentId, rows: [] };
    entry.rows.push(row);
    out.set(key, entry);
  }
  return new Map([...out].sort((a, b) => a[1].mjd - b[1].mjd));
}

/** Clock-term priors from the comparisons' geometry: a straight line through n points of σ each, referred to their mean time. */
function clockPrior(utcS: readonly number[], sigmaS: number): { referenceS: number; prior: JointNight['clockPrior'] } {
  const n = utcS.length;
  const referenceS = utcS.reduce((s, v) => s + v, 0) / n;
  const spreadDays2 = utcS.reduce((s, v) => s + ((v - referenceS) / 86_400) ** 2, 0);
  return { referenceS, prior: { offsetSigmaS: sigmaS / Math.sqrt(n), rateSigmaSPerDay: n >= 2 && spreadDays2 > 0 ? sigmaS / Math.sqrt(spreadDays2) : null } };
}

function observationOf(t: TransitResult, ctx: { night: number; star: number; nightMjd: number; referenceS: number; epochJyear: number; temperatureC: number; logWeight: number; model: JointModel; timeScale: TimeScale }): JointObservation {
  const utcMjd = ctx.nightMjd + t.observedUtcS / 86_400;
  const instant = ctx.timeScale.fromUtc({ jd1: 2400000.5 + ctx.nightMjd, jd2: t.observedUtcS / 86_400 });
  const ttDays = instant.tt.jd1 - 2451545 + instant.tt.jd2;
  const cosDec = Math.cos(t.apparentDecDeg * Math.PI / 180);
  const z = t.zenith;
  return {
    night: ctx.night, star: ctx.star, culmination: t.culmination, utcMjd, ttDaysSinceJ2000: ttDays,
    yearsFromEpoch: 2000 + ttDays / 365.25 - ctx.epochJyear,
    ocRaMas: t.ocRaArcsecCosDec * 1000,
    sigmaRaMas: 15_000 * SIDEREAL_PER_UT1 * cosDec * ctx.model.wireSigmaS / Math.sqrt(Math.max(t.wireCount, 1)),
    cosDec, mayerA: t.mayer.azimuthFactor, mayerB: t.mayer.levelFactor, mayerC: (t.clamp === 'east' ? -1 : 1) * t.mayer.collimationFactor,
    clockDtDays: (t.observedUtcS - ctx.referenceS) / 86_400,
    ocZenithMas: z === null ? Number.NaN : z.ocZenithArcsec * 1000,
    sigmaZenithMas: ctx.model.readingSigmaArcsec * 1000,
    zenithRad: z === null ? Number.NaN : z.trueDeg * Math.PI / 180,
    refractionMas: z === null ? 0 : z.refractionArcsec * 1000,
    zenithPerDec: t.culmination === 'lower' ? -1 : z?.side === 'north' ? 1 : -1,
    temperatureC: ctx.temperatureC, logWeight: t.userRejected ? 0 : ctx.logWeight,
    nightlyOutlierRa: t.grossBlunderTime, nightlyOutlierZenith: t.grossBlunderZenith,
    hourAnglePerParallax: 0, zenithPerParallax: 0, hourAnglePerAberration: 0, zenithPerAberration: 0,
  };
}

/**
 * Runs the nightly reduction (core/reduction) on every night of the archive with the clock from
 * the comparisons, b held at the striding level's mean (0 without readings), a, c and the zero
 * point free, flexure at `model.flexureAprioriArcsec`; returns every transit's O − C and geometry
 * for the joint model. Reports progress in nights; throws TaskCancelledError when cancelled.
 */
export async function reduceArchive(inputs: SolveInputs, model: JointModel, timeScale: TimeScale, control: TaskControl): Promise<ReducedArchive> {
  const starIndex = new Map(inputs.stars.map((s, i) => [s.id, i]));
  const defaultInstrument = inputs.site.instruments[0]?.id ?? '';
  const groups = [...groupByNight(inputs.transits, defaultInstrument).values()];
  const nights: JointNight[] = [];
  const observations: JointObservation[] = [];
  const skipped: string[] = [];
  for (let g = 0; g < groups.length; g++) {
    if (control.cancellation.isCancelled) throw new TaskCancelledError('the joint solve (nightly reductions)', g);
    control.reportProgress(g, groups.length);
    if (g % 10 === 0) await control.yieldToHost();
    const group = groups[g];
    const instrument = inputs.site.instruments.find((i) => i.id === group.instrumentId);
    const record = inputs.nights.get(nightKey(group.mjd, group.instrumentId));
    const label = record?.id ?? `night ${group.mjd} (${group.instrumentId})`;
    if (instrument === undefined) { skipped.push(`${label}: instrument ${group.instrumentId} is not in site.json`); continue; }
    const comparisons = inputs.comparisons.filter((c) => c.nightDateMjd === group.mjd && (c.instrumentId === null || c.instrumentId === group.instrumentId));
    const level = record?.levelReadings ?? [];
    const levelMean = level.length > 0 ? level.reduce((s, r) => s + r.levelArcsec, 0) / level.length : 0;
    const configuration = { ...defaultNightConfiguration(comparisons.length > 0, false), levelArcsec: { mode: 'fixed' as const, value: levelMean } };
    const weather = record?.weather ? { temperatureC: record.weather.temperatureC, pressureHpa: record.weather.pressureHpa, humidityPercent: record.weather.relativeHumidityPercent } : null;
    const input: NightReductionInput = {
      site: inputs.site.site, instrument, nightDateMjd: group.mjd, stars: inputs.stars, transits: group.rows, clockComparisons: comparisons,
      levelReadings: null, collimatorReadings: null, weather, configuration, previous: null, flexureArcsec: model.flexureAprioriArcsec,
      instantFromUtc: (utc) => timeScale.fromUtc(utc),
    };
    const outcome = await reduceObservingNight(input, { ...control, reportProgress: () => {} });
    if (!outcome.ok) { skipped.push(`${label}: ${[...outcome.problems, ...outcome.rejected.map((r) => `row ${r.row}: ${r.reason}`)].join('; ')}`); continue; }
    const result = outcome.result;
    const utcS = comparisons.map((c) => utcCountS(c.utc) - group.mjd * 86_400);
    const clock = comparisons.length > 0 ? clockPrior(utcS, model.clockComparisonSigmaS)
      : { referenceS: result.transits.reduce((s, t) => s + t.observedUtcS, 0) / result.transits.length, prior: null };
    const night = nights.length;
    const c = result.constants;
    nights.push({
      id: label, instrumentId: group.instrumentId, nightDateMjd: group.mjd, clockPrior: clock.prior,
      levelPriorSigmaArcsec: level.length > 0 ? model.levelSigmaArcsec / Math.sqrt(level.length) : null,
      nightly: { clockOffsetS: c.clockOffsetS.value, clockRateSPerDay: c.clockRateSPerDay.value, azimuthArcsec: c.azimuthArcsec.value, levelArcsec: c.levelArcsec.value, collimationArcsec: c.collimationArcsec.value, zenithZeroArcsec: c.zenithZeroArcsec.value },
    });
    const rowByLine = new Map(group.rows.map((r) => [r.row, r]));
    for (const t of result.transits) {
      const star = starIndex.get(t.starId);
      if (star === undefined) continue;
      const row = rowByLine.get(t.row);
      observations.push(observationOf(t, {
        night, star, nightMjd: group.mjd, referenceS: clock.referenceS, epochJyear: inputs.stars[star].epochJyear,
        temperatureC: row?.temperatureC ?? weather?.temperatureC ?? model.referenceTemperatureC, logWeight: row?.weight ?? 1, model, timeScale,
      }));
    }
  }
  control.reportProgress(groups.length, groups.length);
  return { nights, observations, skipped };
}
