import { readdir, readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { FILES } from '../../../core/archive-folder/archive-folder.ts';
import { readNightFiles } from '../../../core/archive-folder/night-files.ts';
import { parseClockComparisons } from '../../../core/formats/clock-comparisons.ts';
import type { ClockComparisonRow } from '../../../core/formats/clock-comparisons.ts';
import { parseDateCell } from '../../../core/formats/cells.ts';
import { describeRejections } from '../../../core/formats/parse-result.ts';
import { parseSiteDescription } from '../../../core/formats/site-description.ts';
import { parseStarList } from '../../../core/formats/star-list.ts';
import { parseTransitLog } from '../../../core/formats/transit-log.ts';
import { groupNights } from '../../../core/reduction/group-nights.ts';
import { defaultNightConfiguration, NIGHT_CONSTANT_NAMES } from '../../../core/reduction/night-inputs.ts';
import type { ConstantSetting, NightConfiguration, NightConstantName, NightConstants, NightWeather } from '../../../core/reduction/night-inputs.ts';
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
       meridian-ledger night --archive DIR [--night YYYY-MM-DD] [--instrument ID] [...same options]

With --archive, DIR is an archive folder (FOLDER.md, as simulate writes it): the site, stars, clock
comparisons and every transits/YYYY.csv are read from it, and so are each night's weather
(nights.csv, the fallback for transits without their own) and level readings (level-readings.csv:
their mean fixes b unless --fix or --free says otherwise).

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
  format: 'text' | 'json' | 'csv'; logs: string[]; settings: Map<NightConstantName, ConstantSetting>;
  archive: string | null;
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
    } else if (['--site', '--stars', '--clock', '--night', '--instrument', '--fix', '--free', '--archive'].includes(a)) {
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
  const archive = values.get('--archive') ?? null;
  if (archive !== null) {
    for (const option of ['--site', '--stars', '--clock']) if (values.has(option)) throw new UsageError(`${option} goes with a transit log, not with --archive (the folder holds it)`);
    if (files.length > 0) throw new UsageError('--archive reads the transit logs from the folder; give no LOG.csv');
  } else {
    if (!values.has('--site')) throw new UsageError('--site SITE.json is required (or --archive DIR)');
    if (!values.has('--stars')) throw new UsageError('--stars STARS.csv is required');
    if (files.length !== 1) throw new UsageError(`give exactly one transit log (got ${files.length})`);
  }
  let night: number | null = null;
  if (values.has('--night')) {
    const d = parseDateCell(values.get('--night')!);
    if (!d.ok) throw new UsageError(`--night: ${d.reason}`);
    night = d.value;
  }
  if (archive !== null) {
    return { site: join(archive, FILES.site), stars: join(archive, FILES.stars), clock: join(archive, FILES.clock), night, instrument: values.get('--instrument') ?? null, format, logs: [], settings, archive };
  }
  return { site: values.get('--site')!, stars: values.get('--stars')!, clock: values.get('--clock') ?? null, night, instrument: values.get('--instrument') ?? null, format, logs: files, settings, archive };
}

/** What an archive folder adds for each night: its weather and the mean of its level readings. */
interface FolderNight {
  readonly weather: NightWeather | null;
  readonly levelArcsec: number | null;
}

async function readFolderNights(dir: string, errors: string[]): Promise<Map<string, FolderNight>> {
  const names = { nights: join(dir, FILES.nights), clock: join(dir, FILES.clock), level: join(dir, FILES.level), collimation: join(dir, FILES.collimation) };
  const nightBytes = await readBytes(names.nights, errors);
  const levelBytes = await readBytes(names.level, []);
  const byKey = new Map<string, FolderNight>();
  if (nightBytes === null) return byKey;
  const read = readNightFiles({ nights: nightBytes, level: levelBytes ?? undefined }, names, { createdUtc: '2000-01-01T00:00:00.000Z' });
  for (const r of read.rejected) errors.push(`${r.file}: row ${r.row} (line ${r.line})${r.column ? `, column ${r.column}` : ''}: ${r.reason}`);
  for (const night of read.nights) {
    const levels = night.levelReadings.map((l) => l.levelArcsec);
    byKey.set(`${night.instrumentId}\u0000${night.localDate}`, {
      weather: night.weather === null ? null : { temperatureC: night.weather.temperatureC, pressureHpa: night.weather.pressureHpa, humidityPercent: night.weather.relativeHumidityPercent },
      levelArcsec: levels.length === 0 ? null : levels.reduce((a, b) => a + b, 0) / levels.length,
    });
  }
  return byKey;
}

async function transitLogFiles(dir: string, errors: string[]): Promise<string[]> {
  try {
    const names = (await readdir(join(dir, 'transits'))).filter((name) => /^\d{4}\.csv$/.test(name)).sort();
    if (names.length === 0) errors.push(`${join(dir, 'transits')}: no transits/YYYY.csv files`);
    return names.map((name) => join(dir, 'transits', name));
  } catch (error) {
    errors.push(`${join(dir, 'transits')}: cannot read (${(error as NodeJS.ErrnoException).code ?? (error as Error).message})`);
    return [];
  }
}

/** Warnings about the keys and columns only an archive folder has (FOLDER.md) are expected there. */
function folderOnlyWarning(warning: string): boolean {
  return /unknown key\(s\) ignored: (note|id|utc|recordKind)(, (id|utc|recordKind))*$/.test(warning) || /unknown column\(s\) ignored: transitId, meanWireClockS, outlier$/.test(warning);
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
    const logFiles = o.archive === null ? o.logs : await transitLogFiles(o.archive, errors);
    const folderNights = o.archive === null ? new Map<string, FolderNight>() : await readFolderNights(o.archive, errors);
    const [siteBytes, starBytes, clockBytes, ...logBytes] = await Promise.all([readBytes(o.site, errors), readBytes(o.stars, errors), o.clock === null ? null : readBytes(o.clock, errors), ...logFiles.map((f) => readBytes(f, errors))]);
    if (errors.length > 0) return fail(io, errors);
    const site = parseSiteDescription(siteBytes!, o.site);
    const stars = parseStarList(starBytes!, o.stars);
    const knownStarIds = new Set(stars.rows.map((s) => s.id));
    const logs = logFiles.map((file, k) => ({ file, parsed: parseTransitLog(logBytes[k]!, { fileName: file, knownStarIds }) }));
    const clock = clockBytes === null ? null : parseClockComparisons(clockBytes, o.clock!);
    errors.push(...describeRejections(o.site, site.rejected), ...describeRejections(o.stars, stars.rejected), ...logs.flatMap((l) => describeRejections(l.file, l.parsed.rejected)));
    if (clock !== null) errors.push(...describeRejections(o.clock!, clock.rejected));
    for (const w of [...site.warnings, ...stars.warnings, ...logs.flatMap((l) => l.parsed.warnings), ...(clock?.warnings ?? [])]) {
      if (!/not checked/.test(w) && !(o.archive !== null && folderOnlyWarning(w))) io.stderr.write(`warning: ${w}\n`);
    }
    const logName = o.archive === null ? o.logs[0] : join(o.archive, 'transits');
    const log = { rows: logs.flatMap((l) => l.parsed.rows) };
    if (errors.length > 0 || site.rows.length === 0) return fail(io, errors);
    const description = site.rows[0];
    if (o.instrument === null && description.instruments.length !== 1) throw new UsageError(`the site has ${description.instruments.length} instruments; choose one with --instrument`);
    const instrument = o.instrument === null ? description.instruments[0] : description.instruments.find((i) => i.id === o.instrument);
    if (instrument === undefined) throw new UsageError(`--instrument ${o.instrument}: not in ${o.site} (has ${description.instruments.map((i) => i.id).join(', ')})`);
    const grouped = groupNights(log.rows, description.site.longitudeDeg, instrument.id);
    if (grouped.rejected.length > 0) return fail(io, describeRejections(logName, grouped.rejected));
    const nights = grouped.nights.filter((n) => n.instrumentId === instrument.id && (o.night === null || n.nightDateMjd === o.night));
    if (nights.length === 0) return fail(io, [`${logName}: no transits of instrument ${instrument.id}${o.night === null ? '' : ` on the night ${isoDateOfMjd(o.night)}`}`]);
    const timeScale = new TimeScale(BUNDLED_LEAP_SECONDS, bundledEarthOrientationTable());
    const results: NightReductionResult[] = [];
    let previous: NightConstants | null = null;
    for (const night of nights) {
      const comparisons: ClockComparisonRow[] = (clock?.rows ?? []).filter((c) => c.nightDateMjd === night.nightDateMjd && (c.instrumentId ?? instrument.id) === instrument.id);
      const isClockLog = night.rows.some((r) => r.times.kind === 'clock');
      const base = defaultNightConfiguration(isClockLog && comparisons.length > 0, false);
      const fromFolder = folderNights.get(`${instrument.id}\u0000${isoDateOfMjd(night.nightDateMjd)}`);
      const folderLevel: Partial<Record<NightConstantName, ConstantSetting>> =
        fromFolder?.levelArcsec == null ? {} : { levelArcsec: { mode: 'fixed', value: fromFolder.levelArcsec } };
      const configuration = Object.fromEntries(NIGHT_CONSTANT_NAMES.map((n) => [n, o.settings.get(n) ?? folderLevel[n] ?? base[n]])) as unknown as NightConfiguration;
      const outcome = await reduceObservingNight({
        site: description.site, instrument, nightDateMjd: night.nightDateMjd, stars: stars.rows, transits: night.rows, clockComparisons: comparisons,
        levelReadings: null, collimatorReadings: null, weather: fromFolder?.weather ?? null, configuration, previous, flexureArcsec: 0, instantFromUtc: (utc) => timeScale.fromUtc(utc),
      }, UNCONTROLLED);
      if (!outcome.ok) return fail(io, [...describeRejections(logName, outcome.rejected), ...outcome.problems.map((p) => `night ${isoDateOfMjd(night.nightDateMjd)}: ${p}`)]);
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
