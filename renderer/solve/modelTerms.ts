import { TERM_SPANS, type JointModel, type SegmentableTerm, type TermSetting, type TermSpan } from '../../core/joint/joint-model.ts';

/** A JointModel the form edits in place. */
export type EditableModel = { -readonly [K in keyof JointModel]: JointModel[K] };

type TermKey = { [K in keyof JointModel]: JointModel[K] extends TermSetting ? K : never }[keyof JointModel];
type NumberKey = { [K in keyof JointModel]: JointModel[K] extends number ? K : never }[keyof JointModel];

/** The model's terms as the form lists them, in the words of the trade, grouped by what they belong to. */
export const TERM_GROUPS: readonly { readonly title: string; readonly terms: readonly { readonly key: TermKey; readonly label: string; readonly spans?: SegmentableTerm }[] }[] = [
  { title: 'Per star', terms: [
    { key: 'starPosition', label: 'Position correction at the catalogue epoch' },
    { key: 'properMotion', label: 'Proper motion' },
    { key: 'parallax', label: 'Parallax' },
  ] },
  { title: 'Common to all observations', terms: [
    { key: 'deltaKappa', label: 'Aberration constant correction Δκ' },
    { key: 'flexure', label: 'Flexure (∝ sin z)' },
    { key: 'refractionScale', label: 'Refraction scale' },
    { key: 'temperature', label: 'Temperature coefficients' },
    { key: 'seasonal', label: 'Annual instrument term' },
    { key: 'latitudeVariation', label: 'Latitude variation (periods below)' },
    { key: 'diurnalAberrationScale', label: 'Diurnal-aberration scale' },
  ] },
  { title: 'Instrument, per night or per segment', terms: [
    { key: 'clockOffset', label: 'Clock offset' },
    { key: 'clockRate', label: 'Clock rate', spans: 'clockRate' },
    { key: 'azimuth', label: 'Azimuth a', spans: 'azimuth' },
    { key: 'level', label: 'Level b', spans: 'level' },
    { key: 'collimation', label: 'Collimation c', spans: 'collimation' },
    { key: 'zeroPoint', label: 'Zenith-distance zero point', spans: 'zeroPoint' },
  ] },
];

/** How a free instrument term varies, in words (segments run between the instrument's events). */
export const SPAN_LABELS: Readonly<Record<TermSpan, string>> = {
  'per-night': 'per night', 'per-segment': 'per segment', 'per-segment-drift': 'per segment + drift',
};
export const SPANS: readonly TermSpan[] = TERM_SPANS;

/** Stated precisions and settings, with the unit and the range parseJointModel accepts. */
export const NUMBER_FIELDS: readonly { readonly key: NumberKey; readonly label: string; readonly min: number; readonly max: number; readonly step: number }[] = [
  { key: 'wireSigmaS', label: 'One wire crossing, σ (s)', min: 1e-6, max: 1, step: 0.001 },
  { key: 'readingSigmaArcsec', label: 'One zenith-distance reading, σ (″)', min: 1e-6, max: 10, step: 0.01 },
  { key: 'clockComparisonSigmaS', label: 'One clock comparison, σ (s)', min: 1e-7, max: 1, step: 0.0001 },
  { key: 'levelSigmaArcsec', label: 'One level reading, σ (″)', min: 1e-6, max: 10, step: 0.01 },
  { key: 'flexureAprioriArcsec', label: 'Flexure applied before the solve (″)', min: -10, max: 10, step: 0.01 },
  { key: 'referenceTemperatureC', label: 'Reference temperature (°C)', min: -60, max: 60, step: 0.5 },
  { key: 'robustIterations', label: 'Robust (Huber) passes', min: 1, max: 50, step: 1 },
];

export const SETTINGS: readonly TermSetting[] = ['free', 'fixed', 'absent'];

/** Every number of the form that lies outside the range parseJointModel accepts, in words. */
export function modelProblems(model: JointModel): string[] {
  return NUMBER_FIELDS.filter((f) => !(Number.isFinite(model[f.key]) && model[f.key] >= f.min && model[f.key] <= f.max))
    .map((f) => `${f.label} must be a number from ${f.min} to ${f.max} (got ${model[f.key]}).`)
    .concat(catalogueProblems(model), periodProblems(model));
}

/** The periods of the latitude-variation term (days), range as parseJointModel accepts them. */
export const LATITUDE_PERIOD_RANGE_DAYS = { min: 30, max: 3000, most: 4 } as const;

/**
 * The periods typed in the form, "433, 365.25" or "433 365.25": one number per entry, NaN for an
 * entry that is not a number (modelProblems then names it), so the model always holds what was typed.
 */
export function parsePeriodsText(text: string): number[] {
  return text.split(/[\s,;]+/).filter((part) => part !== '').map((part) => (/^[+-]?(\d+\.?\d*|\.\d+)$/.test(part) ? Number(part) : Number.NaN));
}

function periodProblems(model: JointModel): string[] {
  if (model.latitudeVariation === 'absent') return [];
  const periods = model.latitudeVariationPeriodsDays;
  const { min, max, most } = LATITUDE_PERIOD_RANGE_DAYS;
  if (periods.length < 1 || periods.length > most) return [`Latitude-variation periods: give 1 to ${most} periods in days (got ${periods.length}).`];
  return periods.flatMap((p, k) => (Number.isFinite(p) && p >= min && p <= max ? [] : [`Latitude-variation period ${k + 1} must be a number of days from ${min} to ${max} (got ${Number.isNaN(p) ? 'text that is not a number' : p}).`]));
}

function catalogueProblems(model: JointModel): string[] {
  const sigma = model.catalogueSigma.default;
  if (sigma === null) return [];
  return [['Catalogue position, σ (mas)', sigma.positionMas], ['Catalogue proper motion, σ (mas/yr)', sigma.pmMasYr] as const]
    .filter(([, v]) => !(Number.isFinite(v) && Number(v) > 0)).map(([label, v]) => `${label} must be a number above 0 (got ${v}).`);
}

/** The terms that differ between two models, as "Parallax: free → absent" lines. */
export function modelDifferences(a: JointModel, b: JointModel): string[] {
  const labels = new Map<string, string>([['catalogueSigma', 'Catalogue precision'], ['parallaxPrior', 'Catalogue parallax as a prior'], ['starListSigma', 'Stated σ from the star list'],
    ['varianceComponents', 'Weights from the residuals (variance components)'], ['latitudeVariationPeriodsDays', 'Latitude-variation periods (days)'], ['termSpan', 'Segments'], ...TERM_GROUPS.flatMap((g) => g.terms.map((t) => [t.key, t.label] as const)), ...NUMBER_FIELDS.map((f) => [f.key, f.label] as const)]);
  return [...labels].filter(([key]) => JSON.stringify(a[key as keyof JointModel]) !== JSON.stringify(b[key as keyof JointModel]))
    .map(([key, label]) => `${label}: ${describeValue(a[key as keyof JointModel])} → ${describeValue(b[key as keyof JointModel])}`);
}

function describeValue(value: JointModel[keyof JointModel]): string {
  if (typeof value !== 'object' || value === null || Array.isArray(value)) return JSON.stringify(value);
  if (!('default' in value)) {
    const spans = Object.entries(value as JointModel['termSpan']).filter(([, span]) => span !== 'per-night');
    return spans.length === 0 ? 'every term per night' : spans.map(([term, span]) => `${term} ${SPAN_LABELS[span]}`).join(', ');
  }
  const sigma = (value as JointModel['catalogueSigma']).default;
  const perStar = Object.keys((value as JointModel['catalogueSigma']).stars).length;
  const base = sigma === null ? 'none' : `${sigma.positionMas} mas and ${sigma.pmMasYr} mas/yr`;
  return perStar > 0 ? `${base} (${perStar} stars with their own)` : base;
}
