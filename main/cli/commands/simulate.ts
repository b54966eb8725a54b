import { writeArchiveFolder } from '../../../core/archive-folder/archive-folder.ts';
import { simulateArchive } from '../../../core/simulate/simulate-archive.ts';
import { DEFAULT_SIMULATION_OPTIONS, resolveSimulationOptions, type SimulationRequest } from '../../../core/simulate/simulation-options.ts';
import { isEmptyOrMissing, writeArchiveFolderFiles } from '../../archive/archive-folder-files.ts';
import { type Command, EXIT_OK, UsageError } from '../command.ts';

const D = DEFAULT_SIMULATION_OPTIONS;
const USAGE = `Usage: meridian-ledger simulate --out DIR [--seed N] [--years Y] [--stars S] [options]

Writes a simulated archive with known truth to DIR, in the archive folder layout (FOLDER.md):
site.json, stars.csv (catalogue values with realistic errors), nights.csv, clock and level
readings, transits/YYYY.csv, and truth.json (the true star places, parallaxes, proper motions,
instrument series and every planted blunder). The same options always give the same files.

  --out DIR                 folder to write (must be empty or absent unless --force)
  --seed N                  integer seed (default ${D.seed})
  --years Y                 whole years of nights, 1–50 (default ${D.years})
  --stars S                 programme stars, 4–400 (default ${D.starCount})
  --start YYYY-MM-DD        first night (default ${D.startDate})
  --nights-per-year N       nights aimed at per year (default ${D.nightsPerYearTarget})
  --blunder-rate P          fraction of transits with a planted blunder (default ${D.blunderRate})
  --delta-kappa ARCSEC      injected change of the constant of aberration (default 0)
  --thermal ARCSEC_PER_C    thermal term in both coordinates, per °C from ${D.thermal.referenceTemperatureC} °C (default 0)
  --latitude-variation ARCSEC  amplitude of a 433-day latitude variation (default 0)
  --events-per-year N       instrument adjustments, relevellings … per year (default ${D.eventsPerYear})
  --zenith-camera-stars N   add a fixed zenith camera and N stars near the zenith (default 0: no camera)
  --force                   replace a non-empty DIR
Progress goes to stderr. Bad arguments exit 2 with the reason.`;

interface Parsed {
  readonly out: string;
  readonly force: boolean;
  readonly request: SimulationRequest;
}

const NUMBER_OPTIONS: Record<string, (value: number) => SimulationRequest> = {
  '--seed': (v) => ({ seed: v }),
  '--years': (v) => ({ years: v }),
  '--stars': (v) => ({ starCount: v }),
  '--nights-per-year': (v) => ({ nightsPerYearTarget: v }),
  '--blunder-rate': (v) => ({ blunderRate: v }),
  '--delta-kappa': (v) => ({ deltaKappaArcsec: v }),
  '--thermal': (v) => ({ thermal: { raArcsecPerC: v, decArcsecPerC: v } }),
  '--latitude-variation': (v) => ({ latitudeVariationArcsec: v }),
  '--events-per-year': (v) => ({ eventsPerYear: v }),
  '--zenith-camera-stars': (v) => ({ zenithCameraStarCount: v }),
};

function parseArguments(args: readonly string[]): Parsed {
  let out: string | null = null;
  let force = false;
  let request: SimulationRequest = {};
  for (let i = 0; i < args.length; i++) {
    const name = args[i];
    if (name === '--force') { force = true; continue; }
    const value = args[i + 1];
    if (name !== '--out' && name !== '--start' && !(name in NUMBER_OPTIONS)) throw new UsageError(`unknown argument "${name}"`);
    if (value === undefined || value.startsWith('--')) throw new UsageError(`${name} needs a value`);
    i++;
    if (name === '--out') out = value;
    else if (name === '--start') request = { ...request, startDate: value };
    else {
      const number = Number(value);
      if (value.trim() === '' || !Number.isFinite(number)) throw new UsageError(`${name} takes a number (got "${value}")`);
      request = { ...request, ...NUMBER_OPTIONS[name](number) };
    }
  }
  if (out === null) throw new UsageError('--out DIR is required: the folder to write the archive to');
  return { out, force, request };
}

export const simulateCommand: Command = {
  name: 'simulate',
  summary: 'write a simulated archive with known truth (site, stars, nights, transits, truth.json)',
  usage: USAGE,
  async run(args, io) {
    const { out, force, request } = parseArguments(args);
    try {
      resolveSimulationOptions(request);
    } catch (error) {
      if (error instanceof RangeError) throw new UsageError(error.message);
      throw error;
    }
    if (!force && !(await isEmptyOrMissing(out))) throw new UsageError(`${out} is not empty; choose an empty folder or pass --force to replace it`);
    const started = performance.now();
    const archive = await simulateArchive(request, {
        cancellation: { isCancelled: false },
        reportProgress: (done, total) => { if (done % 200 === 0 || done === total) io.stderr.write(`simulate: night ${done} of ${total} planned\n`); },
        yieldToHost: () => Promise.resolve(),
    }, new Date().toISOString());
    const files = writeArchiveFolder(archive, archive.truth);
    await writeArchiveFolderFiles(out, files, force);
    io.stderr.write(`simulate: wrote ${out}: ${archive.nights.length} nights, ${archive.transits.length} transits, ${archive.stars.length} stars, ${archive.truth.blunders.length} planted blunders in ${((performance.now() - started) / 1000).toFixed(1)} s\n`);
    return EXIT_OK;
  },
};
