/**
 * What the joint solve of an archive estimates (DESIGN.md §4), read from a model file (JSON,
 * documented in SOLVE.md). Every term is 'free', 'fixed' (held at the nightly reduction's value or
 * the catalogue's) or 'absent'. Defaults are common practice for a meridian circle archive.
 */
export type TermSetting = 'free' | 'fixed' | 'absent';

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
}

export const DEFAULT_JOINT_MODEL: JointModel = {
  starPosition: 'free', properMotion: 'free', parallax: 'free', parallaxPrior: false,
  catalogueSigma: { default: null, stars: {} },
  deltaKappa: 'free', refractionScale: 'absent', flexure: 'free', flexureAprioriArcsec: 0,
  temperature: 'absent', referenceTemperatureC: 10, seasonal: 'absent',
  clockOffset: 'free', clockRate: 'free', azimuth: 'free', level: 'free', collimation: 'free', zeroPoint: 'free',
  // Common practice: eye-and-ear timing ~0.03 s per wire, a micrometer reading ~0.3″, GNSS/radio comparisons ~2 ms, a striding level ~0.4″.
  wireSigmaS: 0.03, readingSigmaArcsec: 0.3, clockComparisonSigmaS: 0.002, levelSigmaArcsec: 0.4,
  robustIterations: 5,
};

const TERM_KEYS = ['starPosition', 'properMotion', 'parallax', 'deltaKappa', 'refractionScale', 'flexure', 'temperature', 'seasonal',
  'clockOffset', 'clockRate', 'azimuth', 'level', 'collimation', 'zeroPoint'] as const;
const NUMBER_KEYS = { flexureAprioriArcsec: [-10, 10], referenceTemperatureC: [-60, 60], wireSigmaS: [1e-6, 1], readingSigmaArcsec: [1e-6, 10],
  clockComparisonSigmaS: [1e-7, 1], levelSigmaArcsec: [1e-6, 10], robustIterations: [1, 50] } as const;

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
    } else if (key === 'parallaxPrior') {
      if (typeof value === 'boolean') out[key] = value; else problems.push(`model key "parallaxPrior" must be true or false (got ${JSON.stringify(value)})`);
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
      problems.push(`unknown model key "${key}"; known keys: ${[...TERM_KEYS, ...Object.keys(NUMBER_KEYS), 'parallaxPrior', 'catalogueSigma'].join(', ')}`);
    }
  }
  return problems.length > 0 ? { model: null, problems } : { model: out as unknown as JointModel, problems };
}
