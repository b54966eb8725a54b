import { mjdToCalendarDay } from '../time/julian-date.ts';
import { NIGHT_CONSTANT_NAMES } from './night-inputs.ts';
import type { NightReductionResult, TransitResult } from './night-result.ts';

/** 'YYYY-MM-DD' of a whole MJD. */
export function isoDateOfMjd(mjd: number): string {
  const { year, month, day } = mjdToCalendarDay(mjd);
  return `${year}-${String(month).padStart(2, '0')}-${String(day).padStart(2, '0')}`;
}

/** hh:mm:ss.sss of seconds from 0 h of the night's date (may exceed 24 h: shown as +1d). */
export function clockText(seconds: number): string {
  const days = Math.floor(seconds / 86_400);
  const s = seconds - days * 86_400;
  const hh = Math.floor(s / 3600), mm = Math.floor((s % 3600) / 60), ss = s % 60;
  return `${String(hh).padStart(2, '0')}:${String(mm).padStart(2, '0')}:${ss.toFixed(3).padStart(6, '0')}${days !== 0 ? ` ${days > 0 ? '+' : ''}${days}d` : ''}`;
}

const LABELS: Record<(typeof NIGHT_CONSTANT_NAMES)[number], [string, string, number]> = {
  clockOffsetS: ['clock offset', 's', 4], clockRateSPerDay: ['clock rate', 's/day', 4], azimuthArcsec: ['azimuth a', '″', 3],
  levelArcsec: ['level b', '″', 3], collimationArcsec: ['collimation c', '″', 3], zenithZeroArcsec: ['zenith zero', '″', 3],
};

function flagText(t: TransitResult): string {
  const flags = [t.userRejected ? 'user-rejected' : '', t.outlierTime ? 'outlier(RA)' : '', t.outlierZenith ? 'outlier(z)' : ''].filter((f) => f !== '');
  return flags.join(' ');
}

/** The night's report as readable text: clock terms, constants with errors, the O − C table, flags and probable causes. */
export function formatNightText(r: NightReductionResult): string {
  const lines: string[] = [`Night ${isoDateOfMjd(r.nightDateMjd)} — instrument ${r.instrumentId} — ${r.transits.length} transits`, ''];
  if (r.clockComparisons !== null) {
    lines.push(`Clock comparisons: ${r.clockComparisons.count}, unit-weight error ${r.clockComparisons.unitWeightErrorS === null ? '—' : `${r.clockComparisons.unitWeightErrorS.toFixed(4)} s`}`);
  }
  lines.push(`Clock reference: ${clockText(r.clockReferenceS)} (clock time); UTC = clock + offset + rate × (clock − reference)`, '', 'Constants:');
  for (const name of NIGHT_CONSTANT_NAMES) {
    const c = r.constants[name];
    const [label, unit, digits] = LABELS[name];
    lines.push(`  ${label.padEnd(14)} ${c.value.toFixed(digits).padStart(11)} ${unit.padEnd(5)} ${c.sigma === null ? '         ' : `± ${c.sigma.toFixed(digits).padStart(7)}`}  ${c.source}`);
  }
  const uweTime = r.unitWeightErrorTimeS === null ? '—' : `${r.unitWeightErrorTimeS.toFixed(4)} s`;
  const uweZenith = r.unitWeightErrorZenithArcsec === null ? '—' : `${r.unitWeightErrorZenithArcsec.toFixed(3)}″`;
  lines.push('', `Unit-weight error: right ascension ${uweTime} of time, zenith distance ${uweZenith}`, '');
  lines.push('row  star          culm   clamp  observed UTC      O−C s     O−C″cosδ   z obs °     refr ″   O−C z ″   O−C δ ″  flags');
  for (const t of r.transits) {
    const z = t.zenith;
    lines.push([
      String(t.row).padStart(3), t.starId.padEnd(13), t.culmination.padEnd(6), t.clamp.padEnd(6), clockText(t.observedUtcS).padEnd(16),
      t.ocTimeS.toFixed(4).padStart(9), t.ocRaArcsecCosDec.toFixed(3).padStart(10),
      (z === null ? '—' : z.observedDeg.toFixed(5)).padStart(10), (z === null ? '—' : z.refractionArcsec.toFixed(2)).padStart(9),
      (z === null ? '—' : z.ocZenithArcsec.toFixed(3)).padStart(9), (z === null ? '—' : z.ocDeclinationArcsec.toFixed(3)).padStart(9), ` ${flagText(t)}`,
    ].join(' '));
  }
  const hinted = r.transits.filter((t) => t.hints.length > 0 || t.outlierTime || t.outlierZenith);
  if (hinted.length > 0) {
    lines.push('', 'Flags and probable causes:');
    for (const t of hinted) {
      const cause = t.hints.length === 0 ? 'no simple cause fits; check the record' : t.hints.slice(0, 2).map((h) => `${h.cause} (${h.detail}; misfit ${h.misfitSigma.toFixed(1)}σ)`).join('; or ');
      lines.push(`  row ${t.row} ${t.starId}: ${cause}`);
    }
  }
  lines.push('', `Outlier rule: ${r.outlierRule}.`);
  for (const n of r.notes) lines.push(`Note: ${n}`);
  return `${lines.join('\n')}\n`;
}

const CSV_HEADER = 'nightDate,instrumentId,row,starId,culmination,clamp,wireCount,meanWireReadingS,clockCorrectionS,observedUtcS,predictedUtcS,mayerA,mayerB,mayerC,mayerCorrectionS,ocTimeS,ocRaArcsecCosDec,zenithReading,zenithObservedDeg,refractionArcsec,zenithTrueDeg,zenithPredictedDeg,ocZenithArcsec,ocDeclinationArcsec,outlierTime,outlierZenith,userRejected,probableCause';

/** One CSV line per transit with every intermediate value (RFC 4180; the cause quoted). */
export function formatNightCsv(results: readonly NightReductionResult[]): string {
  const lines = [CSV_HEADER];
  for (const r of results) {
    for (const t of r.transits) {
      const z = t.zenith;
      const cause = t.hints[0]?.cause ?? '';
      lines.push([
        isoDateOfMjd(r.nightDateMjd), r.instrumentId, t.row, t.starId, t.culmination, t.clamp, t.wireCount, t.meanWireReadingS.toFixed(4), t.clockCorrectionS.toFixed(5),
        t.observedUtcS.toFixed(4), t.predictedUtcS.toFixed(4), t.mayer.azimuthFactor.toFixed(6), t.mayer.levelFactor.toFixed(6), t.mayer.collimationFactor.toFixed(6),
        t.mayer.correctionS.toFixed(5), t.ocTimeS.toFixed(5), t.ocRaArcsecCosDec.toFixed(4),
        z?.reading ?? '', z?.observedDeg.toFixed(7) ?? '', z?.refractionArcsec.toFixed(4) ?? '', z?.trueDeg.toFixed(7) ?? '', z?.predictedDeg.toFixed(7) ?? '',
        z?.ocZenithArcsec.toFixed(4) ?? '', z?.ocDeclinationArcsec.toFixed(4) ?? '', t.outlierTime, t.outlierZenith, t.userRejected, cause,
      ].join(','));
    }
  }
  return `${lines.join('\n')}\n`;
}
