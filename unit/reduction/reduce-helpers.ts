// Parses test files with the real parsers and runs the nightly reduction on them.
import { parseClockComparisons } from '../../core/formats/clock-comparisons.ts';
import { parseSiteDescription } from '../../core/formats/site-description.ts';
import { parseStarList } from '../../core/formats/star-list.ts';
import { parseTransitLog } from '../../core/formats/transit-log.ts';
import type { StridingLevelReadings } from '../../core/instrument/striding-level.ts';
import { defaultNightConfiguration } from '../../core/reduction/night-inputs.ts';
import type { NightConfiguration } from '../../core/reduction/night-inputs.ts';
import { reduceObservingNight } from '../../core/reduction/reduce-observing-night.ts';
import type { NightOutcome } from '../../core/reduction/reduce-observing-night.ts';
import type { NightReductionResult } from '../../core/reduction/night-result.ts';
import { UNCONTROLLED } from '../../core/task/task-control.ts';
import { instantFromUtc, NIGHT_MJD, SITE_JSON, STAR_CSV } from './forward-night.ts';

const bytes = (text: string): Uint8Array => new TextEncoder().encode(text);

/** Striding-level readings that give exactly `levelArcsec` (division 1″; b = d·Σ(w − e)/(2n)). */
export function levelReadingsFor(levelArcsec: number): StridingLevelReadings {
  const setting = { westDiv: 10 + levelArcsec, eastDiv: 10 - levelArcsec };
  return { direct: [setting], reversed: [setting], divisionArcsec: 1 };
}

export async function reduceTestNight(
  logCsv: string, clockCsv: string | null, configure: (c: NightConfiguration) => NightConfiguration, levelArcsec: number | null,
): Promise<NightOutcome> {
  const site = parseSiteDescription(bytes(SITE_JSON), 'site.json').rows[0];
  const stars = parseStarList(bytes(STAR_CSV), 'stars.csv');
  const log = parseTransitLog(bytes(logCsv), { fileName: 'log.csv', knownStarIds: new Set(stars.rows.map((s) => s.id)) });
  if (log.rejected.length > 0 || stars.rejected.length > 0) throw new Error(`test files rejected: ${JSON.stringify([...log.rejected, ...stars.rejected])}`);
  const clock = clockCsv === null ? [] : parseClockComparisons(bytes(clockCsv), 'clock.csv').rows;
  const levelReadings = levelArcsec === null ? null : levelReadingsFor(levelArcsec);
  return reduceObservingNight({
    site: site.site, instrument: site.instruments[0], nightDateMjd: NIGHT_MJD, stars: stars.rows, transits: log.rows,
    clockComparisons: clock, levelReadings, collimatorReadings: null, weather: null,
    configuration: configure(defaultNightConfiguration(clock.length > 0, levelReadings !== null)),
    previous: null, flexureArcsec: 0, instantFromUtc,
  }, UNCONTROLLED);
}

export function expectReduced(outcome: NightOutcome): NightReductionResult {
  if (!outcome.ok) throw new Error(`the night was not reduced: ${JSON.stringify(outcome)}`);
  return outcome.result;
}
