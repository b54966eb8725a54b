import type { ReductionRecord } from '../../core/archive/records.ts';
import { withSigma } from '../solve/format.ts';
import { instrumentSummary } from '../solve/instrumentSummary.ts';
import { degeneraciesOfStar, savedConfiguration, savedResults } from '../solve/savedResults.ts';
import type { SolveSelection } from '../solve/solveSelection.ts';
import { escapeHtml as e } from './escapeHtml.ts';
import { modelSettings } from './modelSettings.ts';
import { reportFigures } from './reportPlots.ts';
import { REPORT_CSS } from './reportStyle.ts';

/** What the printable report of one saved solve is made from. */
export interface SolveReportInput {
  readonly reduction: ReductionRecord;
  /** The archive in words (site label and where it is stored), for the header. */
  readonly archiveLabel: string;
  /** The store's star labels by star id; a star without one is shown by its id. */
  readonly starLabels: ReadonlyMap<string, string>;
  /** The version of the app that writes the report (renderer/solve/appVersion.ts). */
  readonly appVersion: string;
  /** When the report is written, ISO 8601 UTC. */
  readonly generatedUtc: string;
}

const row = (cells: readonly string[], header = false) => `<tr>${cells.map((c, k) => (header || k === 0 ? `<th scope="${header ? 'col' : 'row'}">${c}</th>` : `<td>${c}</td>`)).join('')}</tr>`;
const num = (text: string) => `<td class="number">${e(text)}</td>`;
const utc = (iso: string) => `${iso.slice(0, 16).replace('T', ' ')} UTC`;

function selectionWords(selection: SolveSelection | undefined): string {
  if (selection === undefined) return 'not recorded with this solve';
  const list = (ids: readonly string[] | null, what: string) => (ids === null ? `every ${what}` : `${ids.length} ${what}${ids.length === 1 ? '' : 's'}: ${ids.join(', ')}`);
  const span = selection.fromDate === null && selection.untilDate === null ? 'all nights' : `nights ${selection.fromDate ?? 'from the first'} to ${selection.untilDate ?? 'the last'}`;
  return `${list(selection.starIds, 'star')}; ${list(selection.instrumentIds, 'instrument')}; ${span}`;
}

function headerSection(input: SolveReportInput): string {
  const r = input.reduction;
  const results = savedResults(r);
  const { selection } = savedConfiguration(r);
  const lines: [string, string][] = [
    ['Archive', input.archiveLabel], ['Selection', selectionWords(selection)],
    ['Solved', `${utc(r.createdUtc)} with version ${r.codeVersion}`], ['Input fingerprint', r.inputFingerprint],
    ['Unit-weight error', `${results.unitWeightError.toFixed(3)} (χ² ${results.chiSquare.toFixed(1)} on ${results.degreesOfFreedom} degrees of freedom)`],
    ['Report written', `${utc(input.generatedUtc)} by Meridian Ledger ${input.appVersion}`],
  ];
  return `<h1>Joint solve: ${e(r.label)}</h1>
<table class="meta"><tbody>${lines.map(([k, v]) => row([e(k), e(v)])).join('')}</tbody></table>`;
}

function modelSection(reduction: ReductionRecord): string {
  const { model } = savedConfiguration(reduction);
  const settings = modelSettings(model);
  return `<h2>Model</h2>
<table data-section="model"><thead>${row(['Term or setting', 'Value'], true)}</thead><tbody>${settings.map((s) => row([`<code>${e(s.name)}</code>`, e(s.value)])).join('')}</tbody></table>`;
}

const GLOBAL_LABELS: Readonly<Record<string, string>> = {
  deltaKappaArcsec: 'Δκ (″): correction to the constant of aberration',
  flexureArcsec: 'Horizontal flexure f (″)',
  temperatureRaArcsecPerC: 'Temperature term in α (″/°C)',
  temperatureDecArcsecPerC: 'Temperature term in δ (″/°C)',
  refractionScale: 'Refraction scale',
  diurnalAberrationScale: 'Diurnal aberration scale',
};

function globalSection(reduction: ReductionRecord): string {
  const g = savedResults(reduction).global;
  const names = Object.keys(g).filter((k) => !/Sigma/.test(k));
  // The solver names each σ after its value with "Sigma" before the unit (deltaKappaSigmaArcsec) or at the end (refractionScaleSigma).
  const sigmaOf = (name: string) => g[name.replace(/((?:Arcsec|Mas).*)$/, 'Sigma$1')] ?? g[`${name}Sigma`] ?? null;
  const rows = names.map((name) => {
    const value = g[name];
    const sigma = sigmaOf(name);
    const significance = value != null && sigma != null && sigma > 0 ? `${(value / sigma).toFixed(1)}σ` : '—';
    return `<tr><th scope="row">${e(GLOBAL_LABELS[name] ?? name)}</th>${num(withSigma(value, sigma, 4))}${num(significance)}</tr>`;
  });
  return `<h2>Terms common to all observations</h2>
<table data-section="global"><thead>${row(['Term', 'Value ± 1σ', 'Value / σ'], true)}</thead><tbody>${rows.join('')}</tbody></table>`;
}

function starSection(input: SolveReportInput): string {
  const results = savedResults(input.reduction);
  const rows = results.stars.map((star) => {
    const label = input.starLabels.get(star.id);
    const warnings = degeneraciesOfStar(results.degeneracies, star.id);
    return `<tr data-star-id="${e(star.id)}"><th scope="row">${e(star.id)}${label !== undefined && label !== star.id ? `<br>${e(label)}` : ''}</th>${num(String(results.starNights?.[star.id] ?? '—'))}${num(String(star.observations))}${num(withSigma(star.parallaxMas, star.parallaxSigmaMas, 2))}${num(withSigma(star.pmRaMasYr, star.pmRaSigmaMasYr, 2))}${num(withSigma(star.pmDecMasYr, star.pmDecSigmaMasYr, 2))}<td class="warning">${warnings.map(e).join('<br>') || '—'}</td></tr>`;
  });
  return `<h2>Stars: absolute parallax and proper motion (formal 1σ)</h2>
<table data-section="stars"><thead>${row(['Star', 'Nights', 'Transits', 'Parallax (mas)', 'μα* (mas/yr)', 'μδ (mas/yr)', 'What the data cannot separate'], true)}</thead><tbody>${rows.join('')}</tbody></table>`;
}

function wordsSection(reduction: ReductionRecord): string {
  const results = savedResults(reduction);
  const list = (items: readonly string[], none: string) => (items.length === 0 ? `<p>${none}</p>` : `<ul>${items.map((d) => `<li>${e(d)}</li>`).join('')}</ul>`);
  return `<h2>Degeneracies: what the data cannot separate, and how it was resolved</h2>
${list(results.degeneracies, 'The solve reported no weak combination of parameters.')}
<h2>Notes of the solve</h2>
${list(results.notes, 'None.')}`;
}

function instrumentSection(reduction: ReductionRecord): string {
  const spread = (s: { mean: number; scatter: number }, digits: number) => `${s.mean.toFixed(digits)} (scatter ${s.scatter.toFixed(digits)})`;
  const rows = instrumentSummary(savedResults(reduction).instrumentSeries ?? []).map((i) =>
    `<tr><th scope="row">${e(i.instrumentId)}</th>${num(String(i.nights))}${num(spread(i.clockOffsetS, 4))}${num(spread(i.azimuthArcsec, 3))}${num(spread(i.levelArcsec, 3))}${num(spread(i.collimationArcsec, 3))}${num(spread(i.zeroPointArcsec, 3))}</tr>`);
  return `<h2>Instrument series, per instrument over its nights</h2>
<table data-section="instruments"><thead>${row(['Instrument', 'Nights', 'Clock offset (s)', 'Azimuth a (″)', 'Level b (″)', 'Collimation c (″)', 'Zero point (″)'], true)}</thead><tbody>${rows.join('') || '<tr><td colspan="7">No instrument series was saved with this solve.</td></tr>'}</tbody></table>`;
}

function figureSection(reduction: ReductionRecord): string {
  const { figures, missing } = reportFigures(reduction);
  const body = figures.map((f, k) => `<figure>${f.svg}<figcaption>Figure ${k + 1}. ${e(f.title)}</figcaption></figure>`).join('\n');
  return `<h2 class="new-page">Signatures: the plots of this solve</h2>
${body}${missing.length > 0 ? `<p>Not drawn:</p><ul>${missing.map((m) => `<li>${e(m)}</li>`).join('')}</ul>` : ''}`;
}

/**
 * The printable report of a saved solve as one self-contained HTML document: inline CSS for A4
 * print, inline SVG plots, no script and no external resource (the app's Content-Security-Policy
 * forbids them, and a printed report must not depend on anything else). Every text that comes
 * from the archive or the solve is escaped.
 */
export function solveReportHtml(input: SolveReportInput): string {
  return `<!DOCTYPE html>
<html lang="en"><head><meta charset="utf-8"><title>${e(`Solve report — ${input.reduction.label}`)}</title>
<style>${REPORT_CSS}</style></head>
<body>
${headerSection(input)}
${modelSection(input.reduction)}
${globalSection(input.reduction)}
${starSection(input)}
${wordsSection(input.reduction)}
${instrumentSection(input.reduction)}
${figureSection(input.reduction)}
</body></html>
`;
}
