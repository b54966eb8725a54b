// Per-segment instrument terms (SOLVE.md "termSpan"): the simulator's collimation walks from night
// to night, so the test rewrites it in the simulated transit times (the simulator cannot make a
// step on its own): every transit's wire times are moved by Mayer's collimation term for the
// difference between the wanted c and the simulator's true c of that night (truth.json), so that
// c is 1.0″ before an adjustment event planted mid-archive and 2.5″ after it (solved per segment),
// or 2.5″ + 0.5″/yr·(t − event) after it (solved per segment with drift).
// Mayer's formula τ = (a A + b B + c C)/15 with C = sec δ (sec(180° − δ) at lower culmination), the
// star observed at hour angle −τ (Chauvenet, Manual of Spherical and Practical Astronomy, vol. II;
// the simulator's convention, core/simulate/observe-transit.ts). Recovery is judged against this
// known truth: the step and the drift within 3σ, parallax pulls unbiased.
import { beforeAll, describe, expect, it } from 'vitest';
import { dateMjd } from '../../core/archive-folder/folder-text.ts';
import type { InstrumentEventRecord } from '../../core/archive/records.ts';
import type { TransitLogRow } from '../../core/formats/transit-log.ts';
import { mayerFactors } from '../../core/instrument/mayer.ts';
import type { ArchiveSolveResult } from '../../core/joint/solve-archive.ts';
import type { SolveInputs } from '../../core/joint/solve-inputs.ts';
import type { SimulatedArchive } from '../../core/simulate/simulate-archive.ts';
import { DEG } from '../../core/units.ts';
import { modelFor, pulls, simulatedInputs, solve } from './joint-helpers.ts';

const SIDEREAL_PER_UT1 = 1.002737811911354; // IERS Conventions 2010 eq. 5.15
const BEFORE_ARCSEC = 1.0, AFTER_ARCSEC = 2.5, DRIFT_ARCSEC_PER_YEAR = 0.5;

/** The inputs with collimation rewritten (see the header) and one adjustment event at `eventMjd`. */
function withCollimationStep(archive: SimulatedArchive, inputs: SolveInputs, eventMjd: number, driftArcsecPerYear: number): SolveInputs {
  const trueC = new Map(archive.truth.nights.map((t) => {
    const night = archive.nights.find((n) => n.id === t.nightId)!;
    return [dateMjd(night.localDate), t.collimationArcsec] as const;
  }));
  const latitudeRad = inputs.site.site.latitudeDeg * DEG;
  const decDeg = new Map(inputs.stars.map((s) => [s.id, s.decDeg]));
  const transits = inputs.transits.map((row): TransitLogRow => {
    if (row.times.kind !== 'clock') throw new Error('the simulated log is expected to give clock times');
    const mjd = row.nightDateMjd!;
    const approximateUtc = mjd + row.times.wires[0].clockS / 86_400;
    const wanted = approximateUtc < eventMjd ? BEFORE_ARCSEC : AFTER_ARCSEC + driftArcsecPerYear * (approximateUtc - eventMjd) / 365.25;
    const c = mayerFactors(latitudeRad, decDeg.get(row.starId)! * DEG, row.culmination).collimationFactor;
    const shiftS = -((wanted - trueC.get(mjd)!) * c) / (15 * SIDEREAL_PER_UT1);
    return { ...row, times: { kind: 'clock', wires: row.times.wires.map((w) => ({ ...w, clockS: w.clockS + shiftS })) } };
  });
  const event: InstrumentEventRecord = {
    id: 'planted-adjustment', instrumentId: inputs.site.instruments[0].id, utcMjd: eventMjd, kind: 'adjustment', note: 'planted by the test',
  } as InstrumentEventRecord;
  return { ...inputs, transits, events: [...(inputs.events ?? []), event] };
}

interface Case { archive: SimulatedArchive; perSegment: ArchiveSolveResult; drift: ArchiveSolveResult; eventMjd: number }
const cases: Case[] = [];

beforeAll(async () => {
  for (const seed of [61, 62, 63]) {
    const { archive, inputs } = await simulatedInputs({ seed, years: 2, starCount: 8, blunderRate: 0, eventsPerYear: 0 });
    const mjds = inputs.transits.map((t) => t.nightDateMjd!).sort((a, b) => a - b);
    const eventMjd = Math.floor(mjds[Math.floor(mjds.length / 2)]) + 0.45;
    const stepped = withCollimationStep(archive, inputs, eventMjd, 0);
    const drifting = withCollimationStep(archive, inputs, eventMjd, DRIFT_ARCSEC_PER_YEAR);
    const perSegment = await solve(stepped, modelFor(archive, { robustIterations: 1, termSpan: { ...modelFor(archive).termSpan, collimation: 'per-segment' } }));
    const drift = await solve(drifting, modelFor(archive, { robustIterations: 1, termSpan: { ...modelFor(archive).termSpan, collimation: 'per-segment-drift' } }));
    cases.push({ archive, perSegment, drift, eventMjd });
  }
}, 300_000);

describe('collimation per segment between instrument events', () => {
  it('makes two collimation segments, cut at the planted adjustment, and no per-night collimation', () => {
    for (const { perSegment, eventMjd } of cases) {
      const c = perSegment.segments.filter((s) => s.term === 'collimation');
      expect(c.map((s) => [s.number, s.fromUtcMjd, s.toUtcMjd])).toEqual([[1, null, eventMjd], [2, eventMjd, null]]);
      expect(perSegment.instrumentSeries.every((n) => n.collimationSigmaArcsec !== null)).toBe(true);
      expect(perSegment.layout.collimation, 'no nightly collimation local').toBe(-1);
    }
  });

  it('recovers the 1.5″ step (per segment) and the 0.5″/yr drift (per segment with drift) within 3σ', () => {
    for (const { perSegment, drift, eventMjd } of cases) {
      const [a, b] = perSegment.segments.filter((s) => s.term === 'collimation');
      const n = perSegment.solution.globalNames.length, cov = perSegment.solution.globalCovariance;
      const [ia, ib] = perSegment.layout.segments.filter((s) => s.term === 'collimation').map((s) => s.value);
      const stepSigma = Math.sqrt(cov[ia * n + ia] + cov[ib * n + ib] - 2 * cov[ia * n + ib]) * 1e-3;
      expect(Math.abs(a.value - BEFORE_ARCSEC), `segment 1 value ${a.value} ± ${a.valueSigma}`).toBeLessThan(3 * a.valueSigma);
      console.log(`step ${(b.value - a.value).toFixed(3)} ± ${stepSigma.toFixed(3)}″ (truth ${AFTER_ARCSEC - BEFORE_ARCSEC}); uwe ${perSegment.unitWeightError.toFixed(3)}`);
      expect(Math.abs(b.value - a.value - (AFTER_ARCSEC - BEFORE_ARCSEC))).toBeLessThan(3 * stepSigma);
      expect(perSegment.unitWeightError, 'the model fits the rewritten archive').toBeLessThan(1.2);
      void eventMjd;
      const [d1, d2] = drift.segments.filter((s) => s.term === 'collimation');
      console.log(`drift segment 1 ${d1.driftPerYear!.toFixed(3)} ± ${d1.driftSigmaPerYear!.toFixed(3)}, segment 2 ${d2.driftPerYear!.toFixed(3)} ± ${d2.driftSigmaPerYear!.toFixed(3)} ″/yr`);
      expect(Math.abs(d1.driftPerYear!)).toBeLessThan(3 * d1.driftSigmaPerYear!);
      expect(Math.abs(d2.driftPerYear! - DRIFT_ARCSEC_PER_YEAR)).toBeLessThan(3 * d2.driftSigmaPerYear!);
      expect(drift.unitWeightError, 'the model fits the rewritten archive').toBeLessThan(1.2);
    }
  });

  it('leaves parallaxes unbiased: pulls over the archives with mean within ±0.6 and rms 0.6–1.4, both models', () => {
    for (const which of ['perSegment', 'drift'] as const) {
      const all = cases.flatMap((c) => pulls(c.archive, c[which]).parallax);
      const mean = all.reduce((s, v) => s + v, 0) / all.length, rms = Math.sqrt(all.reduce((s, v) => s + v * v, 0) / all.length);
      console.log(`parallax pulls, collimation ${which}: n ${all.length}, mean ${mean.toFixed(3)}, rms ${rms.toFixed(3)}`);
      // 24 pulls: the mean scatters by 1/√24 = 0.2 and the rms by about 0.15 (common practice: 3σ bands, rms rounded up).
      expect(Math.abs(mean)).toBeLessThan(0.6);
      expect(rms).toBeGreaterThan(0.6);
      expect(rms).toBeLessThan(1.4);
    }
  });
});
