import { collimationFromCollimator } from '../instrument/collimation.ts';
import type { ClockFit } from '../instrument/clock-fit.ts';
import { levelFromStridingReadings } from '../instrument/striding-level.ts';
import { ARCSEC, SECONDS_PER_DAY } from '../units.ts';
import type { ConstantSetting, NightConstantName, NightReductionInput } from './night-inputs.ts';
import type { ConstantResult } from './night-result.ts';

/** A held constant's value and source, or null when the setting is `free`. */
export type HeldConstant = ConstantResult | null;

/** The reading-derived value of a constant, or the reason there is none. */
function fromReadings(name: NightConstantName, input: NightReductionInput, clockFit: ClockFit | null): ConstantResult | string {
  switch (name) {
    case 'clockOffsetS':
      return clockFit === null ? 'no clock comparisons for this night (or the log gives UTC)' : { value: clockFit.offsetS, sigma: clockFit.offsetSigmaS, source: 'readings' };
    case 'clockRateSPerDay':
      if (clockFit === null) return 'no clock comparisons for this night (or the log gives UTC)';
      if (!clockFit.rateDetermined) return 'the comparisons do not determine a rate (one comparison, or all at one reading); fix the rate or free it';
      return { value: clockFit.rateSPerS * SECONDS_PER_DAY, sigma: clockFit.rateSigmaSPerS === null ? null : clockFit.rateSigmaSPerS * SECONDS_PER_DAY, source: 'readings' };
    case 'levelArcsec':
      return input.levelReadings === null ? 'no striding-level readings for this night' : { value: levelFromStridingReadings(input.levelReadings) / ARCSEC, sigma: null, source: 'readings' };
    case 'collimationArcsec': {
      const c = input.collimatorReadings;
      if (c === null) return 'no collimator readings for this night';
      return { value: collimationFromCollimator(c.clampWestTurns, c.clampEastTurns, c.meanWireTurns, c.arcsecPerTurn * ARCSEC, c.sense) / ARCSEC, sigma: null, source: 'readings' };
    }
    default:
      return `${name} has no readings of its own; set it free, fixed or carried`;
  }
}

/**
 * Resolves one setting: `fixed` → its value, `carried` → the previous night's, `readings` → the
 * night's own readings (clock comparisons, striding level, collimator), `free` → null. Returns the
 * reason in words when the setting cannot be honoured (readings absent, no previous night).
 */
export function resolveConstant(name: NightConstantName, setting: ConstantSetting, input: NightReductionInput, clockFit: ClockFit | null): HeldConstant | string {
  switch (setting.mode) {
    case 'free':
      return null;
    case 'fixed':
      return Number.isFinite(setting.value) ? { value: setting.value, sigma: null, source: 'fixed' } : `${name}: fixed value ${setting.value} is not a finite number`;
    case 'carried':
      return input.previous === null ? `${name} is to be carried from the previous night, but none was given` : { value: input.previous[name], sigma: null, source: 'carried' };
    case 'readings': {
      const r = fromReadings(name, input, clockFit);
      return typeof r === 'string' ? `${name} from readings: ${r}` : r;
    }
  }
}
