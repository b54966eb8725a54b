import type { NightInstrumentTerms } from '../../core/joint/solve-outputs.ts';

/** Mean and scatter (population standard deviation) of one per-night term over an instrument's nights. */
export interface TermSpread {
  readonly mean: number;
  readonly scatter: number;
}

export interface InstrumentSummary {
  readonly instrumentId: string;
  readonly nights: number;
  readonly transits: number;
  /** Clock offset (s), azimuth a, level b, collimation c, zero point (arcsec). */
  readonly clockOffsetS: TermSpread;
  readonly azimuthArcsec: TermSpread;
  readonly levelArcsec: TermSpread;
  readonly collimationArcsec: TermSpread;
  readonly zeroPointArcsec: TermSpread;
}

function spread(values: readonly number[]): TermSpread {
  const mean = values.reduce((s, v) => s + v, 0) / values.length;
  const variance = values.reduce((s, v) => s + (v - mean) ** 2, 0) / values.length;
  return { mean, scatter: Math.sqrt(variance) };
}

/** The per-night instrument series of a solve, summarised per instrument (in first-seen order). */
export function instrumentSummary(series: readonly NightInstrumentTerms[]): InstrumentSummary[] {
  const groups = new Map<string, NightInstrumentTerms[]>();
  for (const night of series) {
    const list = groups.get(night.instrumentId);
    if (list === undefined) groups.set(night.instrumentId, [night]);
    else list.push(night);
  }
  return [...groups].map(([instrumentId, nights]) => ({
    instrumentId, nights: nights.length, transits: nights.reduce((s, n) => s + n.transits, 0),
    clockOffsetS: spread(nights.map((n) => n.clockOffsetS)), azimuthArcsec: spread(nights.map((n) => n.azimuthArcsec)),
    levelArcsec: spread(nights.map((n) => n.levelArcsec)), collimationArcsec: spread(nights.map((n) => n.collimationArcsec)),
    zeroPointArcsec: spread(nights.map((n) => n.zeroPointArcsec)),
  }));
}
