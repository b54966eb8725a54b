import { calendarDayToMjd } from '../time/julian-date.ts';

/**
 * What the archive simulator is asked to make. Every field has a practitioner's default
 * (`DEFAULT_SIMULATION_OPTIONS`); `resolveSimulationOptions` merges a partial request with them and
 * refuses impossible values with a message naming the field and the fix.
 */
export interface ThermalTermOptions {
  /**
   * Shift of every star's right ascension on the sky (Δα·cos δ), arcseconds per °C of
   * (T − T_ref), positive eastward (the star seems to transit late). Common to all stars.
   */
  readonly raArcsecPerC: number;
  /** Shift of every star's declination, arcseconds per °C of (T − T_ref), positive northward. */
  readonly decArcsecPerC: number;
  /** T_ref, °C. */
  readonly referenceTemperatureC: number;
}

export interface SimulationOptions {
  /** Any safe integer; the same seed always gives the same archive. */
  readonly seed: number;
  /** Length of the archive in whole years (1–50). */
  readonly years: number;
  /** Programme stars (4–400). */
  readonly starCount: number;
  /** Nights with observations aimed at per year (10–300); weather and season make the real count. */
  readonly nightsPerYearTarget: number;
  /** First local date of the archive, `YYYY-MM-DD` (1972 or later: leap-second era). */
  readonly startDate: string;
  /** Timing noise of one wire crossing, seconds of time (visual eye-and-ear ~0.05, chronograph ~0.02). */
  readonly wireNoiseS: number;
  /** Noise of one zenith-distance reading, arcseconds. */
  readonly zenithNoiseArcsec: number;
  /** Noise of one clock comparison with the time signal, seconds. */
  readonly clockComparisonNoiseS: number;
  /** Noise of one level reading, arcseconds. */
  readonly levelNoiseArcsec: number;
  /** Probability that one wire of a transit is missed. */
  readonly missedWireProbability: number;
  /** Probability that a transit carries a planted blunder. */
  readonly blunderRate: number;
  /** Instrument events (adjustment, relevelling …) per year on average. */
  readonly eventsPerYear: number;
  /** Horizontal flexure f of the transit instrument, arcseconds (z_true = z_obs + f sin z_obs + R). */
  readonly flexureArcsec: number;
  readonly thermal: ThermalTermOptions;
  /** Injected correction to the constant of aberration, arcseconds (the simulator scales aberration). */
  readonly deltaKappaArcsec: number;
  /** Amplitude of a 433-day latitude variation, arcseconds (0: off). */
  readonly latitudeVariationArcsec: number;
  /**
   * Stars added near the zenith for a fixed zenith camera beside the transit instrument (0–60);
   * 0: no camera. The transit instrument observes them too.
   */
  readonly zenithCameraStarCount: number;
}

export const DEFAULT_SIMULATION_OPTIONS: SimulationOptions = {
  seed: 1,
  years: 5,
  starCount: 40,
  nightsPerYearTarget: 110,
  startDate: '2021-01-01',
  wireNoiseS: 0.03,
  zenithNoiseArcsec: 0.3,
  clockComparisonNoiseS: 0.002,
  levelNoiseArcsec: 0.4,
  missedWireProbability: 0.06,
  blunderRate: 0.003,
  eventsPerYear: 1.5,
  flexureArcsec: 0.35,
  thermal: { raArcsecPerC: 0, decArcsecPerC: 0, referenceTemperatureC: 10 },
  deltaKappaArcsec: 0,
  latitudeVariationArcsec: 0,
  zenithCameraStarCount: 0,
};

/** A request: any subset of the options, the thermal term field by field. */
export type SimulationRequest = Partial<Omit<SimulationOptions, 'thermal'>> & { readonly thermal?: Partial<ThermalTermOptions> };

/** The MJD of 0h UTC on `startDate`; throws unless it is a real `YYYY-MM-DD` date from 1972 on. */
export function startDateMjd(startDate: string): number {
  const date = /^(\d{4})-(\d{2})-(\d{2})$/.exec(startDate);
  if (date === null || Number(date[1]) < 1972 || Number(date[1]) > 2100) {
    throw new RangeError(`simulation option startDate must be YYYY-MM-DD between 1972 and 2100 (got "${startDate}")`);
  }
  return calendarDayToMjd(Number(date[1]), Number(date[2]), Number(date[3]));
}

/** Defaults merged with the request; throws a RangeError naming the first impossible field. */
export function resolveSimulationOptions(request: SimulationRequest = {}): SimulationOptions {
  const options: SimulationOptions = {
    ...DEFAULT_SIMULATION_OPTIONS,
    ...request,
    thermal: { ...DEFAULT_SIMULATION_OPTIONS.thermal, ...request.thermal },
  };
  const range = (name: string, value: number, low: number, high: number, integer = false): void => {
    if (!Number.isFinite(value) || value < low || value > high || (integer && !Number.isInteger(value))) {
      throw new RangeError(`simulation option ${name} must be ${integer ? 'an integer' : 'a number'} in ${low}…${high} (got ${value})`);
    }
  };
  if (!Number.isSafeInteger(options.seed)) throw new RangeError(`simulation option seed must be an integer (got ${options.seed})`);
  range('years', options.years, 1, 50, true);
  range('starCount', options.starCount, 4, 400, true);
  range('nightsPerYearTarget', options.nightsPerYearTarget, 10, 300);
  startDateMjd(options.startDate);
  range('wireNoiseS', options.wireNoiseS, 0, 1);
  range('zenithNoiseArcsec', options.zenithNoiseArcsec, 0, 10);
  range('clockComparisonNoiseS', options.clockComparisonNoiseS, 0, 1);
  range('levelNoiseArcsec', options.levelNoiseArcsec, 0, 10);
  range('missedWireProbability', options.missedWireProbability, 0, 0.5);
  range('blunderRate', options.blunderRate, 0, 0.2);
  range('eventsPerYear', options.eventsPerYear, 0, 12);
  range('flexureArcsec', options.flexureArcsec, -10, 10);
  range('thermal.raArcsecPerC', options.thermal.raArcsecPerC, -1, 1);
  range('thermal.decArcsecPerC', options.thermal.decArcsecPerC, -1, 1);
  range('thermal.referenceTemperatureC', options.thermal.referenceTemperatureC, -40, 40);
  range('deltaKappaArcsec', options.deltaKappaArcsec, -1, 1);
  range('latitudeVariationArcsec', options.latitudeVariationArcsec, 0, 1);
  range('zenithCameraStarCount', options.zenithCameraStarCount, 0, 60, true);
  return options;
}
