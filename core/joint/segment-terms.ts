import { dateText } from '../archive-folder/folder-text.ts';
import type { JointModel, SegmentableTerm } from './joint-model.ts';
import { SEGMENTABLE_TERMS } from './joint-model.ts';
import type { JointNight, JointObservation } from './joint-observations.ts';

/** An instrument event as the segmentation reads it (core/archive/records.ts InstrumentEventRecord). */
export interface SegmentEvent {
  readonly instrumentId: string;
  /** When it was done, UTC as MJD. */
  readonly utcMjd: number;
  readonly kind: string;
}

/** One instrument term held constant (optionally with a linear drift) between two consecutive events. */
export interface TermSegment {
  readonly term: SegmentableTerm;
  readonly instrumentId: string;
  /** 1-based count of this term's segments within the instrument. */
  readonly number: number;
  /** The event that opens it (UTC MJD; null for the first) and the one that closes it (null for the last). */
  readonly fromUtcMjd: number | null;
  readonly toUtcMjd: number | null;
  /** The nights in it, by index. */
  readonly nights: readonly number[];
  /** Mean TT of its observations (days since J2000.0): the epoch of its value; the drift is per Julian year from it. */
  readonly referenceTtDays: number;
  /** Global index of its value (joint unit: ms/day for the clock rate, mas otherwise) and of its drift per year (−1 without). */
  readonly value: number;
  readonly drift: number;
}

/** Which events cut a term: a clock change (reset) cuts the clock rate only; any other event cuts the instrument's geometry (common practice). */
export function cutsTerm(term: SegmentableTerm, kind: string): boolean {
  return term === 'clockRate' ? kind === 'clock-change' : kind !== 'clock-change';
}

const LABEL: Record<SegmentableTerm, [string, string]> = {
  clockRate: ['clock rate', 'ms/day'], azimuth: ['azimuth a', 'mas'], level: ['level b', 'mas'], collimation: ['collimation c', 'mas'], zeroPoint: ['zero point', 'mas'],
};

/**
 * The segments of every instrument term the model spans over segments (termSpan per-segment or
 * per-segment-drift, term free), their global parameters appended to `names`, and for each term
 * the segment of each night (−1: the term is per night). A night belongs to the segment opened by
 * the last event at or before its first observation. Segments without nights get no parameter.
 */
export function segmentTerms(model: JointModel, nights: readonly JointNight[], observations: readonly JointObservation[], events: readonly SegmentEvent[], names: string[]): { segments: TermSegment[]; nightSegment: Record<SegmentableTerm, Int32Array> } {
  const firstUtc = new Float64Array(nights.length).fill(Infinity);
  const ttSum = new Float64Array(nights.length), count = new Int32Array(nights.length);
  for (const o of observations) { firstUtc[o.night] = Math.min(firstUtc[o.night], o.utcMjd); ttSum[o.night] += o.ttDaysSinceJ2000; count[o.night]++; }
  const segments: TermSegment[] = [];
  const nightSegment = Object.fromEntries(SEGMENTABLE_TERMS.map((t) => [t, new Int32Array(nights.length).fill(-1)])) as Record<SegmentableTerm, Int32Array>;
  for (const term of SEGMENTABLE_TERMS) {
    const span = model.termSpan[term];
    if (span === 'per-night' || model[term] !== 'free') continue;
    for (const instrumentId of [...new Set(nights.map((n) => n.instrumentId))]) {
      const cuts = events.filter((e) => e.instrumentId === instrumentId && cutsTerm(term, e.kind)).map((e) => e.utcMjd).sort((a, b) => a - b);
      const members = cuts.map(() => [] as number[]).concat([[]]);
      nights.forEach((n, i) => {
        if (n.instrumentId !== instrumentId || count[i] === 0) return;
        let k = 0;
        while (k < cuts.length && cuts[k] <= firstUtc[i]) k++;
        members[k].push(i);
      });
      let number = 0;
      members.forEach((list, k) => {
        if (list.length === 0) return;
        number++;
        const [label, unit] = LABEL[term];
        const from = k > 0 ? cuts[k - 1] : null, to = k < cuts.length ? cuts[k] : null;
        const name = `${instrumentId} ${label} segment ${number} (${from === null ? 'start' : dateText(Math.floor(from))}–${to === null ? 'end' : dateText(Math.floor(to))})`;
        const value = names.push(`${name} (${unit})`) - 1;
        const drift = span === 'per-segment-drift' ? names.push(`${name} drift (${unit}/yr)`) - 1 : -1;
        const tt = list.reduce((s, n) => s + ttSum[n], 0) / list.reduce((s, n) => s + count[n], 0);
        segments.push({ term, instrumentId, number, fromUtcMjd: from, toUtcMjd: to, nights: list, referenceTtDays: tt, value, drift });
        for (const n of list) nightSegment[term][n] = segments.length - 1;
      });
    }
  }
  return { segments, nightSegment };
}

/** The night's own value of a term from the nightly reduction, in the joint unit (ms/day, mas). */
export function nightlyValue(night: JointNight, term: SegmentableTerm): number {
  const v = night.nightly;
  return 1000 * (term === 'clockRate' ? v.clockRateSPerDay : term === 'azimuth' ? v.azimuthArcsec : term === 'level' ? v.levelArcsec : term === 'collimation' ? v.collimationArcsec : v.zenithZeroArcsec);
}
