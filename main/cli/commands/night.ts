import { readFile } from 'node:fs/promises';
import { parseClockComparisons } from '../../../core/formats/clock-comparisons.ts';
import type { ClockComparisonRow } from '../../../core/formats/clock-comparisons.ts';
import { parseDateCell } from '../../../core/formats/cells.ts';
import { describeRejections } from '../../../core/formats/parse-result.ts';
import { parseSiteDescription } from '../../../core/formats/site-description.ts';
import { parseStarList } from '../../../core/formats/star-list.ts';
import { parseTransitLog } from '../../../core/formats/transit-log.ts';
import { groupNights } from '../../../core/reduction/group-nights.ts';
import { defaultNightConfiguration, NIGHT_CONSTANT_NAMES } from '../../../core/reduction/night-inputs.ts';
import type { ConstantSetting, NightConfiguration, NightConstantName, NightConstants } from '../../../core/reduction/night-inputs.ts';
import type { NightReductionResult } from '../../../core/reduction/night-result.ts';
import { formatNightCsv, formatNightText, isoDateOfMjd } from '../../../core/reduction/night-report.ts';
import { reduceObservingNight } from '../../../core/reduction/reduce-observing-night.ts';
import { UNCONTROLLED } from '../../../core/task/task-control.ts';
import { bundledEarthOrientationTable } from '../../../core/time/bundled-earth-orientation.ts';
import { BUNDLED_LEAP_SECONDS } from '../../../core/time/bundled-leap-seconds.ts';
import { TimeScale } from '../../../core/time/timescale.ts';
import { type CliIo, type Command, EXIT_FAILED, EXIT_OK, UsageError } from '../command.ts';

const USAGE = `Usage: meridian-ledger night --site SITE.json --stars STARS.csv [--clock CLOCK.csv]
                           [--night YYYY-MM-DD] [--instrument ID] [--fix NAME=VALUE]... [--free NAME]...
                           [--json | --csv] LOG.csv

Reduces a night's transit log: clock correction (from the clock comparisons, or from the stars),
mean wire, predicted passages, Mayer's constants by least squares, O−C in right ascension and zenith
distance, outliers and probable blunders. Without --night every night of the log is reduced in turn.
NAME is one of ${NIGHT_CONSTANT_NAMES.join(', ')} (units in the name).
Defaults: clock offset and rate from the comparisons (offset free and rate 0 without), a and c free,
b 0 (no level readings on the command line), zenith zero free.
Exit status 1 when a file has invalid rows (each listed: file, row, line, column, reason) or a night
cannot be reduced; 2 on a usage error.`;

interface Options {
  site: string; stars: string; clock: string | null; night: number | null; instrument: string | null;
  format: 'text' | 'json' | 'csv'; log: string; settings: Map<NightConstantName, ConstantSetting>;
}

function constantName(text: string): NightConstantName {
  if (!(NIGHT_CONSTANT_NAMES as readonly string[]).includes(text)) throw new UsageError(`unknown constant "${text}"; use one of ${NIGHT_CONSTANT_NAMES.join(', ')}`);
  return text as NightConstantName;
}

function parseArgs(args: readonly string[]): Options {
  const values = new Map<string, string>();
  const settings = new Map<NightConstantName, ConstantSetting>();
  const files: string[] = [];
  let format: Options['format'] = 'text';
  for (let i = 0; i < args.length; i++) {
    const a = args[i];
    if (a === '--json' || a === '--csv') {
      if (format !== 'text') throw new UsageError('give at most one of --json and --csv');
      format = a === '--json' ? 'json' : 'csv';
    } else if (['--site', '--stars', '--clock', '--night', '--instrument', '--fix', '--free'].includes(a)) {
      const v = args[++i];
      if (v === undefined || v.startsWith('--')) throw new UsageError(`${a} needs a value`);
      if (a === '--fix') {
        const [name, value] = v.split('=');
        const number = Number(value);
        if (value === undefined || value.trim() === '' || !Number.isFinite(number)) throw new UsageError(`--fix ${v}: write NAME=NUMBER, e.g. --fix levelArcsec=1.2`);
        settings.set(constantName(name), { mode: 'fixed', value: number });
      } else if (a === '--free') settings.set(constantName(v), { mode: 'free' });
      else values.set(a, v);
    } else if (a.startsWith('-')) throw new UsageError(`unknown option "${a}"`);
    else files.push(a);
  }
  if (!values.has('--site')) throw new UsageError('--site SITE.json is required');
  if (!values.has('--stars')) throw new UsageError('--stars STARS.csv is required');
  if (files.length !== 1) throw new UsageError(`give exactly one transit log (got ${files.length})`);
  let night: number | null = null;
  if (values.has('--night')) {
    const d = parseDateCell(values.get('--night')!);
    if (!d.ok) throw new UsageError(`--night: ${d.reason}`);
    night = d.value;
  }
  return { site: values.get('--site')!, stars: values.get('--stars')!, clock: values.get('--clock') ?? null, night, instrument: values.get('--instrument') ?? null, format, log: files[0], settings };
}

async function readBytes(file: string, errors: string[]): Promise<Uint8Array | null> {
  try {
    return new Uint8Array(await readFile(file));
  } catch (error) {
    errors.push(`${file}: cannot read (${(error as NodeJS.ErrnoException).code ?? (error as Error).message})`);
    return null;
  }
}

export const nightCommand: Command = {
  name: 'night',
  summary: 'reduce a night\'s transit log to clock terms, instrument constants and O−C residuals',
  usage: USAGE,
  async run(args, io) {
    const o = parseArgs(args);
    const errors: string[] = [];
    const [siteBytes, starBytes, logBytes, clockBytes] = await Promise.all([readBytes(o.site, errors), readBytes(o.stars, errors), readBytes(o.log, errors), o.clock === null ? null : readBytes(o.clock, errors)]);
    if (errors.length > 0) return fail(io, errors);
    const site = parseSiteDescription(siteBytes!, o.site);
    const stars = parseStarList(starBytes!, o.stars);
    const log = parseTransitLog(logBytes!, { fileName: o.log, knownStarIds: new Set(stars.rows.map((s) => s.id)) });
    const clock = clockBytes === null ? null : parseClockComparisons(clockBytes, o.clock!);
    errors.push(...describeRejections(o.site, site.rejected), ...describeRejections(o.stars, stars.rejected), ...describeRejections(o.log, log.rejected));
    if (clock !== null) errors.push(...describeRejections(o.clock!, clock.rejected));
    for (const w of [...site.warnings, ...stars.warnings, ...log.warnings, ...(clock?.warnings ?? [])]) if (!/not checked/.test(w)) io.stderr.write(`warning: ${w}\n`);
    if (errors.length > 0 || site.rows.length === 0) return fail(io, errors);
    const description = site.rows[0];
    if (o.instrument === null && description.instruments.length !== 1) throw new UsageError(`the site has ${description.instruments.length} instruments; choose one with --instrument`);
    const instrument = o.instrument === null ? description.instruments[0] : description.instruments.find((i) => i.id === o.instrument);
    if (instrument === undefined) throw new UsageError(`--instrument ${o.instrument}: not in ${o.site} (has ${description.instruments.map((i) => i.id).join(', ')})`);
    const grouped = groupNights(log.rows, description.site.longitudeDeg, instrument.id);
    if (grouped.rejected.length > 0) return fail(io, describeRejections(o.log, grouped.rejected));
    const nights = grouped.nights.filter((n) => n.instrumentId === instrument.id && (o.night === null || n.nightDateMjd === o.night));
    if (nights.length === 0) return fail(io, [`${o.log}: no transits of instrument ${instrument.id}${o.night === null ? '' : ` on the night ${isoDateOfMjd(o.night)}`}`]);
    const timeScale = new TimeScale(BUNDLED_LEAP_SECONDS, bundledEarthOrientationTable());
    const results: NightReductionResult[] = [];
    let previous: NightConstants | null = null;
    for (const night of nights) {
      const comparisons: ClockComparisonRow[] = (clock?.rows ?? []).filter((c) => c.nightDateMjd === night.nightDateMjd && (c.instrumentId ?? instrument.id) === instrument.id);
      const isClockLog = night.rows.some((r) => r.times.kind === 'clock');
      const base = defaultNightConfiguration(isClockLog && comparisons.length > 0, false);
      const configuration = Object.fromEntries(NIGHT_CONSTANT_NAMES.map((n) => [n, o.settings.get(n) ?? base[n]])) as unknown as NightConfiguration;
      const outcome = await reduceObservingNight({
        site: description.site, instrument, nightDateMjd: night.nightDateMjd, stars: stars.rows, transits: night.rows, clockComparisons: comparisons,
        levelReadings: null, collimatorReadings: null, weather: null, configuration, previous, flexureArcsec: 0, instantFromUtc: (utc) => timeScale.fromUtc(utc),
      }, UNCONTROLLED);
      if (!outcome.ok) return fail(io, [...describeRejections(o.log, outcome.rejected), ...outcome.problems.map((p) => `night ${isoDateOfMjd(night.nightDateMjd)}: ${p}`)]);
      results.push(outcome.result);
      previous = outcome.result.carry;
    }
    if (o.format === 'json') io.stdout.write(`${JSON.stringify(results.map((r) => ({ nightDate: isoDateOfMjd(r.nightDateMjd), ...r })), null, 1)}\n`);
    else if (o.format === 'csv') io.stdout.write(formatNightCsv(results));
    else io.stdout.write(results.map(formatNightText).join('\n'));
    return EXIT_OK;
  },
};

function fail(io: CliIo, errors: readonly string[]): number {
  for (const e of errors) io.stderr.write(`${e}\n`);
  io.stderr.write(`meridian-ledger night: ${errors.length} problem(s); nothing was reduced\n`);
  return EXIT_FAILED;
}
