/**
 * What the joint solve of an archive estimates (DESIGN.md §4), read from a model file (JSON,
 * documented in SOLVE.md). Every term is 'free', 'fixed' (held at the nightly reduction's value or
 * the catalogue's) or 'absent'. Defaults are common practice for a meridian circle archive.
 */
export type TermSetting = 'free' | 'fixed' | 'absent';

/** Instrument terms that may be held constant between instrument events instead of per night. */
export const SEGMENTABLE_TERMS = ['clockRate', 'azimuth', 'level', 'collimation', 'zeroPoint'] as const;
export type SegmentableTerm = (typeof SEGMENTABLE_TERMS)[number];
/**
 * How a free instrument term varies in time: one value per night; one value per segment between
 * consecutive instrument events (site.json), a new value after each event; or per segment plus a
 * linear drift in time within it. Clock-change events cut the clock rate only; every other event
 * cuts azimuth, level, collimation and zero point (segment-terms.ts).
 */
export type TermSpan = 'per-night' | 'per-segment' | 'per-segment-drift';
export const TERM_SPANS: readonly TermSpan[] = ['per-night', 'per-segment', 'per-segment-drift'];

export interface CatalogueSigma {
  /** Stated 1σ of the catalogue position at its epoch, per coordinate on the sky (mas). */
  readonly positionMas: number;
  /** Stated 1σ of each proper-motion component (mas per Julian year). */
  readonly pmMasYr: number;
}

export interface JointModel {
  /** Per star: position corrections at the catalogue epoch, proper motion, parallax. */
  readonly starPosition: TermSetting;
  readonly properMotion: TermSetting;
  readonly parallax: TermSetting;
  /** Add the star list's parallax ± parallaxSigmaMas as a prior (only where the list gives σ). */
  readonly parallaxPrior: boolean;
  /**
   * Catalogue precision used as priors on the position and proper-motion corrections: they fix
   * the zero point and rate of the declination system (and of right ascension without clock
   * comparisons), DESIGN §4. `default` for stars not listed; null for none: sum-zero constraints
   * are then applied instead and the report says so.
   */
  readonly catalogueSigma: { readonly default: CatalogueSigma | null; readonly stars: Readonly<Record<string, CatalogueSigma>> };
  /**
   * Take a star's catalogue σ from the star list where it states them (`positionSigmaMas`,
   * `pmSigmaMasYr`, each on its own): after an entry in `catalogueSigma.stars`, before
   * `catalogueSigma.default`. Default true; false ignores the list's columns.
   */
  readonly starListSigma: boolean;
  /** Global: Δκ (arcsec), refraction scale (fraction of the model's refraction), flexure f (arcsec). */
  readonly deltaKappa: TermSetting;
  readonly refractionScale: TermSetting;
  readonly flexure: TermSetting;
  /** Horizontal flexure the nightly reduction applies before the joint correction (arcsec). */
  readonly flexureAprioriArcsec: number;
  /** Temperature coefficients of both coordinates (arcsec/°C of T − referenceTemperatureC), common to all stars. */
  readonly temperature: TermSetting;
  readonly referenceTemperatureC: number;
  /** An annual cos/sin term common to all stars in each coordinate (a seasonal instrument term). */
  readonly seasonal: TermSetting;
  /** Per night: clock offset (free with the comparisons as prior when there are any), clock rate, a, b, c, zero point. */
  readonly clockOffset: TermSetting;
  readonly clockRate: TermSetting;
  readonly azimuth: TermSetting;
  readonly level: TermSetting;
  readonly collimation: TermSetting;
  readonly zeroPoint: TermSetting;
  /** Stated precision: one wire crossing (s of time), one zenith-distance reading (arcsec), one clock comparison (s), one level reading (arcsec). */
  readonly wireSigmaS: number;
  readonly readingSigmaArcsec: number;
  readonly clockComparisonSigmaS: number;
  readonly levelSigmaArcsec: number;
  /** Huber IRLS passes (1: plain weighted least squares). */
  readonly robustIterations: number;
  /** Per instrument term: per night (default) or constant between instrument events, optionally with a linear drift (segment-terms.ts). */
  readonly termSpan: Readonly<Record<SegmentableTerm, TermSpan>>;
  /**
   * Latitude variation Δφ(t) common to all stars: a cos/sin pair (mas) per period in
   * `latitudeVariationPeriodsDays` (default the Chandler wobble's ≈433 d alone: an annual pair is
   * the same column as the seasonal declination term and a season-locked thermal term, so it is
   * only offered on request), zero at 2000 January 1.5 TT.
   */
  readonly latitudeVariation: TermSetting;
  readonly latitudeVariationPeriodsDays: readonly number[];
  /** Scale correction of the diurnal aberration (fraction of the 0.32″ cos φ the reduction applies). */
  readonly diurnalAberrationScale: TermSetting;
  /** Re-estimate the weights per star (each coordinate) and per night from the residuals (variance-components.ts). */
  readonly varianceComponents: boolean;
}

export const DEFAULT_JOINT_MODEL: JointModel = {
  starPosition: 'free', properMotion: 'free', parallax: 'free', parallaxPrior: false,
  catalogueSigma: { default: null, stars: {} }, starListSigma: true,
  deltaKappa: 'free', refractionScale: 'absent', flexure: 'free', flexureAprioriArcsec: 0,
  // Temperature free: an archive with temperatures nearly always has a thermal term of some size (unmodelled, 0.02″/°C puts the
  // demo's parallaxes several σ off); without temperatures it is held at 0 and the report says so (build-joint-problem.ts).
  temperature: 'free', referenceTemperatureC: 10, seasonal: 'absent',
  clockOffset: 'free', clockRate: 'free', azimuth: 'free', level: 'free', collimation: 'free', zeroPoint: 'free',
  // Common practice: eye-and-ear timing ~0.03 s per wire, a micrometer reading ~0.3″, GNSS/radio comparisons ~2 ms, a striding level ~0.4″.
  wireSigmaS: 0.03, readingSigmaArcsec: 0.3, clockComparisonSigmaS: 0.002, levelSigmaArcsec: 0.4,
  robustIterations: 5,
  termSpan: { clockRate: 'per-night', azimuth: 'per-night', level: 'per-night', collimation: 'per-night', zeroPoint: 'per-night' },
  latitudeVariation: 'absent', latitudeVariationPeriodsDays: [433], diurnalAberrationScale: 'absent', varianceComponents: false,
};

const TERM_KEYS = ['starPosition', 'properMotion', 'parallax', 'deltaKappa', 'refractionScale', 'flexure', 'temperature', 'seasonal',
  'latitudeVariation', 'diurnalAberrationScale', 'clockOffset', 'clockRate', 'azimuth', 'level', 'collimation', 'zeroPoint'] as const;
const NUMBER_KEYS = { flexureAprioriArcsec: [-10, 10], referenceTemperatureC: [-60, 60], wireSigmaS: [1e-6, 1], readingSigmaArcsec: [1e-6, 10],
  clockComparisonSigmaS: [1e-7, 1], levelSigmaArcsec: [1e-6, 10], robustIterations: [1, 50] } as const;

const OTHER_KEYS = ['parallaxPrior', 'starListSigma', 'catalogueSigma', 'termSpan', 'latitudeVariationPeriodsDays', 'varianceComponents'];

function termSpanOf(value: unknown, base: JointModel['termSpan'], problems: string[]): JointModel['termSpan'] {
  const out: Record<string, TermSpan> = { ...base };
  if (typeof value !== 'object' || value === null || Array.isArray(value)) {
    problems.push(`model key "termSpan" must be an object such as {"collimation": "per-segment"} (got ${JSON.stringify(value)})`);
    return base;
  }
  for (const [term, span] of Object.entries(value as Record<string, unknown>)) {
    if (!(SEGMENTABLE_TERMS as readonly string[]).includes(term)) problems.push(`termSpan.${term}: not an instrument term that can span segments; known: ${SEGMENTABLE_TERMS.join(', ')}`);
    else if (!(TERM_SPANS as readonly unknown[]).includes(span)) problems.push(`termSpan.${term} must be ${TERM_SPANS.map((t) => `"${t}"`).join(', ')} (got ${JSON.stringify(span)})`);
    else out[term] = span as TermSpan;
  }
  return out as JointModel['termSpan'];
}

function sigmaOf(value: unknown, where: string, problems: string[]): CatalogueSigma | null {
  const o = value as Record<string, unknown> | null;
  if (typeof o !== 'object' || o === null || !(Number(o.positionMas) > 0) || !(Number(o.pmMasYr) > 0)) {
    problems.push(`${where} must be {"positionMas": > 0, "pmMasYr": > 0} (got ${JSON.stringify(value)})`);
    return null;
  }
  return { positionMas: Number(o.positionMas), pmMasYr: Number(o.pmMasYr) };
}

/**
 * A model file's JSON text merged over DEFAULT_JOINT_MODEL (or `base`); every problem is listed
 * (unknown key, wrong value and the allowed ones), nothing half-read.
 */
export function parseJointModel(text: string, base: JointModel = DEFAULT_JOINT_MODEL): { model: JointModel | null; problems: string[] } {
  let raw: unknown;
  try { raw = JSON.parse(text); } catch (error) { return { model: null, problems: [`model file is not JSON: ${(error as Error).message}`] }; }
  if (typeof raw !== 'object' || raw === null || Array.isArray(raw)) return { model: null, problems: ['model file must hold one JSON object'] };
  const problems: string[] = [];
  const out: Record<string, unknown> = { ...base };
  for (const [key, value] of Object.entries(raw as Record<string, unknown>)) {
    if ((TERM_KEYS as readonly string[]).includes(key)) {
      if (value === 'free' || value === 'fixed' || value === 'absent') out[key] = value;
      else problems.push(`model key "${key}" must be "free", "fixed" or "absent" (got ${JSON.stringify(value)})`);
    } else if (key in NUMBER_KEYS) {
      const [low, high] = NUMBER_KEYS[key as keyof typeof NUMBER_KEYS];
      if (typeof value === 'number' && value >= low && value <= high) out[key] = value;
      else problems.push(`model key "${key}" must be a number in ${low}…${high} (got ${JSON.stringify(value)})`);
    } else if (key === 'parallaxPrior' || key === 'varianceComponents' || key === 'starListSigma') {
      if (typeof value === 'boolean') out[key] = value; else problems.push(`model key "${key}" must be true or false (got ${JSON.stringify(value)})`);
    } else if (key === 'termSpan') {
      out[key] = termSpanOf(value, base.termSpan, problems);
    } else if (key === 'latitudeVariationPeriodsDays') {
      if (Array.isArray(value) && value.length >= 1 && value.length <= 4 && value.every((v) => typeof v === 'number' && v >= 30 && v <= 3000)) out[key] = [...value];
      else problems.push(`model key "latitudeVariationPeriodsDays" must be a list of 1 to 4 periods in days, each in 30…3000 (got ${JSON.stringify(value)})`);
    } else if (key === 'catalogueSigma') {
      const o = value as Record<string, unknown>;
      const def = o?.default === null || o?.default === undefined ? null : sigmaOf(o.default, 'catalogueSigma.default', problems);
      const stars: Record<string, CatalogueSigma> = {};
      for (const [id, s] of Object.entries((o?.stars ?? {}) as Record<string, unknown>)) {
        const sigma = sigmaOf(s, `catalogueSigma.stars.${id}`, problems);
        if (sigma) stars[id] = sigma;
      }
      out[key] = { default: def, stars };
    } else {
      problems.push(`unknown model key "${key}"; known keys: ${[...TERM_KEYS, ...Object.keys(NUMBER_KEYS), ...OTHER_KEYS].join(', ')}`);
    }
  }
  return problems.length > 0 ? { model: null, problems } : { model: out as unknown as JointModel, problems };
}
