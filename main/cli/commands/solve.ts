import { readFile, stat } from 'node:fs/promises';
import { DEFAULT_JOINT_MODEL, parseJointModel, type JointModel } from '../../../core/joint/joint-model.ts';
import { COMPARABLE_TERMS, compareTerm, type ComparableTerm, type TermComparison } from '../../../core/joint/compare-term.ts';
import { crossValidateYears, type CrossValidation } from '../../../core/joint/cross-validate.ts';
import { prepareArchive } from '../../../core/joint/prepare-archive.ts';
import { JointSolveRefused, solveArchive, type ArchiveSolveResult } from '../../../core/joint/solve-archive.ts';
import { readSolveInputs } from '../../../core/joint/solve-inputs.ts';
import { solveResultJson } from '../../../core/joint/solve-result-json.ts';
import { bundledEarthOrientationTable } from '../../../core/time/bundled-earth-orientation.ts';
import { BUNDLED_LEAP_SECONDS } from '../../../core/time/bundled-leap-seconds.ts';
import { TimeScale } from '../../../core/time/timescale.ts';
import { readArchiveFolderFiles } from '../../archive/archive-folder-files.ts';
import { type CliIo, type Command, EXIT_FAILED, EXIT_OK, UsageError } from '../command.ts';

const USAGE = `Usage: meridian-ledger solve DIR [--model FILE] [--json [--residuals]] [--compare TERM | --cross-validate]

Solves every star, global and per-night term of the archive folder DIR (as 'meridian-ledger
simulate' writes it) at once: each night is first reduced (clock from its comparisons, b from its
level readings), then parallaxes, proper motions, position corrections, Δκ, flexure and the
per-night clock, a, b, c and zero points (or per segment between instrument events) are fitted
together, with temperature coefficients when the archive records temperatures (core/joint/SOLVE.md).

  --model FILE   model file (JSON): which terms are free, fixed or absent, stated precisions,
                 catalogue σ (SOLVE.md lists every key); default: the practitioner defaults
  --json         print the result as JSON (absolute parallax and proper motion per star, the
                 correlation matrix, per-night instrument terms, the diagnostics' signatures)
  --residuals    with --json: add every transit's residuals, weights and flags (large)
  --compare TERM solve with TERM free and absent (plain least squares) and print the nested
                 F-test and BIC instead of the solve; TERM: ${COMPARABLE_TERMS.join(', ')}
  --cross-validate solve again with each calendar year (of 10 nights or more) left out and
                 print per star the parallax of each fold, their spread, the largest shift in σ,
                 and a flag when a shift exceeds 3σ (one year imitating parallax)
Progress goes to stderr. Exit 1 for an unreadable archive or model file (every problem listed),
2 for a usage error.`;

interface SolveArguments { dir: string; modelFile: string | null; json: boolean; residuals: boolean; compare: ComparableTerm | null; crossValidate: boolean }

function parseArguments(args: readonly string[]): SolveArguments {
  let dir: string | null = null, modelFile: string | null = null, json = false, residuals = false, compare: ComparableTerm | null = null, crossValidate = false;
  for (let i = 0; i < args.length; i++) {
    const a = args[i];
    if (a === '--json') json = true;
    else if (a === '--cross-validate') crossValidate = true;
    else if (a === '--residuals') residuals = true;
    else if (a === '--compare') {
      const v = args[++i];
      if (!(COMPARABLE_TERMS as readonly string[]).includes(v ?? '')) throw new UsageError(`--compare needs one of ${COMPARABLE_TERMS.join(', ')} (got ${v === undefined ? 'nothing' : `"${v}"`})`);
      compare = v as ComparableTerm;
    }
    else if (a === '--model') {
      const v = args[++i];
      if (v === undefined || v.startsWith('--')) throw new UsageError('--model needs a file name');
      modelFile = v;
    } else if (a.startsWith('--')) throw new UsageError(`unknown argument "${a}"`);
    else if (dir === null) dir = a;
    else throw new UsageError(`only one archive folder may be given (got "${dir}" and "${a}")`);
  }
  if (dir === null) throw new UsageError('the archive folder DIR is required');
  if (residuals && !json) throw new UsageError('--residuals needs --json (the residuals are only written as JSON)');
  if (crossValidate && (compare !== null || residuals)) throw new UsageError('--cross-validate cannot be combined with --compare or --residuals');
  return { dir, modelFile, json, residuals, compare, crossValidate };
}

function fixed(v: number | null, digits: number): string {
  return v === null ? '—' : v.toFixed(digits);
}

function textReport(r: ArchiveSolveResult): string {
  const lines = [`joint solve: ${r.observations.length} transits, ${r.nights.length} nights, ${r.stars.length} stars; unit-weight error ${r.unitWeightError.toFixed(3)}, χ² ${r.chiSquare.toFixed(1)} on ${r.degreesOfFreedom} degrees of freedom`, ''];
  lines.push('star           n  parallax mas      μα* mas/yr          μδ mas/yr');
  for (const s of r.stars) {
    lines.push(`${s.id.padEnd(12)}${String(s.observations).padStart(4)}  ${fixed(s.parallaxMas, 2).padStart(8)} ± ${fixed(s.parallaxSigmaMas, 2).padEnd(6)}  ${fixed(s.pmRaMasYr, 2).padStart(8)} ± ${fixed(s.pmRaSigmaMasYr, 2).padEnd(6)}  ${fixed(s.pmDecMasYr, 2).padStart(8)} ± ${fixed(s.pmDecSigmaMasYr, 2)}`);
  }
  lines.push('', `Δκ ${fixed(r.global.deltaKappaArcsec, 4)} ± ${fixed(r.global.deltaKappaSigmaArcsec, 4)}″   flexure ${fixed(r.global.flexureArcsec, 3)} ± ${fixed(r.global.flexureSigmaArcsec, 3)}″`);
  lines.push(...termLines(r));
  if (r.degeneracies.length > 0) lines.push('', 'What the data cannot separate well:', ...r.degeneracies.map((d) => `  - ${d}`));
  if (r.notes.length > 0) lines.push('', 'Notes:', ...r.notes.map((n) => `  - ${n}`));
  return `${lines.join('\n')}\n`;
}

/** The optional terms' lines of the readable report: temperature, diurnal-aberration scale, latitude variation, segments, variance components. */
function termLines(r: ArchiveSolveResult): string[] {
  const g = r.global, out: string[] = [];
  if (g.temperatureRaArcsecPerC !== null) out.push(`temperature ${fixed(g.temperatureRaArcsecPerC, 4)} ± ${fixed(g.temperatureRaSigmaArcsecPerC, 4)}″/°C (α cos δ), ${fixed(g.temperatureDecArcsecPerC, 4)} ± ${fixed(g.temperatureDecSigmaArcsecPerC, 4)}″/°C (δ)`);
  if (g.diurnalAberrationScale !== null) out.push(`diurnal-aberration scale correction ${fixed(g.diurnalAberrationScale, 3)} ± ${fixed(g.diurnalAberrationScaleSigma, 3)}`);
  for (const l of r.latitudeVariation) out.push(`latitude variation ${l.periodDays} d: cos ${l.cosArcsec.toFixed(3)} ± ${l.cosSigmaArcsec.toFixed(3)}″, sin ${l.sinArcsec.toFixed(3)} ± ${l.sinSigmaArcsec.toFixed(3)}″ (amplitude ${l.amplitudeArcsec.toFixed(3)} ± ${l.amplitudeSigmaArcsec.toFixed(3)}″)`);
  if (r.segments.length > 0) {
    out.push('', 'Instrument terms per segment between events (s/day for the clock rate, ″ otherwise; drift per year):');
    for (const s of r.segments) {
      const span = `${s.fromUtcMjd === null ? 'start' : `MJD ${s.fromUtcMjd.toFixed(2)}`} – ${s.toUtcMjd === null ? 'end' : `MJD ${s.toUtcMjd.toFixed(2)}`}`;
      out.push(`  ${s.instrumentId} ${s.term} ${s.number} (${span}, ${s.nights} nights): ${s.value.toFixed(4)} ± ${s.valueSigma.toFixed(4)}${s.driftPerYear === null ? '' : `, drift ${s.driftPerYear.toFixed(4)} ± ${s.driftSigmaPerYear!.toFixed(4)}/yr`}`);
    }
  }
  const vc = r.varianceComponents;
  if (vc !== null) {
    const far = vc.stars.filter((s) => Math.max(s.raFactor, s.zenithFactor, 1 / s.raFactor, 1 / s.zenithFactor) > 1.5);
    out.push('', `Variance components (${vc.iterations} passes${vc.converged ? '' : ', not converged'}): factor on the stated σ per star (α, z)${far.length === 0 ? ': none beyond 1.5×' : ':'}`,
      ...far.map((s) => `  ${s.id}: ${s.raFactor.toFixed(2)}, ${s.zenithFactor.toFixed(2)}`));
    const nights = vc.nights.map((n) => n.factor).sort((a, b) => a - b);
    if (nights.length > 0) out.push(`  nights: factor ${nights[0].toFixed(2)}–${nights[nights.length - 1].toFixed(2)} (median ${nights[Math.floor(nights.length / 2)].toFixed(2)})`);
  }
  return out;
}

function comparisonReport(c: TermComparison): string {
  const verdict = c.fTest.pValue < 0.01 ? 'the term is significant (p < 0.01)' : 'the term is not significant (p ≥ 0.01)';
  return `${[`model comparison for "${c.term}" on ${c.observations} observations (plain least squares):`,
    `  without: χ² ${c.without.chiSquare.toFixed(1)}, ${c.without.rank} parameters, BIC ${c.without.bic.toFixed(1)}`,
    `  with:    χ² ${c.with.chiSquare.toFixed(1)}, ${c.with.rank} parameters, BIC ${c.with.bic.toFixed(1)}`,
    `  F(${c.fTest.numeratorDegrees}, ${c.fTest.denominatorDegrees}) = ${c.fTest.f.toFixed(2)}, p = ${c.fTest.pValue.toExponential(2)}: ${verdict}; BIC prefers the model ${c.with.bic < c.without.bic ? 'with' : 'without'} it`].join('\n')}\n`;
}

function crossValidationReport(cv: CrossValidation): string {
  const shift = (v: number | null) => (v === null ? '—' : v.toFixed(1));
  const lines = [`leave-one-year-out cross-validation of the parallaxes: folds without ${cv.years.join(', ')}; flag when a shift exceeds ${cv.flagSigma}σ of its expected scatter`, '',
    `star         parallax mas       ${cv.years.map((y) => `−${y}`.padStart(9)).join('')}  spread  max shift σ_full / σ_d`];
  for (const s of cv.stars) {
    const folds = cv.years.map((y) => fixed(s.folds.find((f) => f.year === y)?.parallaxMas ?? null, 2).padStart(9)).join('');
    lines.push(`${s.id.padEnd(12)}${fixed(s.fullParallaxMas, 2).padStart(8)} ± ${fixed(s.fullParallaxSigmaMas, 2).padEnd(6)}  ${folds}  ${fixed(s.spreadMas, 2).padStart(6)}  ${shift(s.maxShiftFullSigma).padStart(5)} / ${shift(s.maxShiftDifferenceSigma).padEnd(5)}${s.flagged ? ` FLAGGED (${s.worstYear})` : ''}`);
  }
  const flagged = cv.stars.filter((s) => s.flagged);
  lines.push('', flagged.length === 0 ? 'No star flagged: every parallax survives leaving out any one year.'
    : `${flagged.length} star(s) flagged: one year pulls their parallax; look for a season-locked instrument term or a bad year (${flagged.map((s) => `${s.id}: ${s.worstYear}`).join(', ')}).`);
  if (cv.notes.length > 0) lines.push('', 'Notes:', ...cv.notes.map((n) => `  - ${n}`));
  return `${lines.join('\n')}\n`;
}

async function loadModel(file: string | null, io: CliIo): Promise<JointModel | null> {
  if (file === null) return DEFAULT_JOINT_MODEL;
  let text: string;
  try { text = await readFile(file, 'utf8'); } catch (error) { io.stderr.write(`solve: cannot read the model file ${file}: ${(error as Error).message}\n`); return null; }
  const { model, problems } = parseJointModel(text);
  for (const p of problems) io.stderr.write(`solve: ${file}: ${p}\n`);
  return model;
}

export const solveCommand: Command = {
  name: 'solve',
  summary: 'joint solve of an archive folder: parallaxes, proper motions, Δκ and per-night instrument terms at once',
  usage: USAGE,
  async run(args, io) {
    const { dir, modelFile, json, residuals, compare, crossValidate } = parseArguments(args);
    const isDir = await stat(dir).then((s) => s.isDirectory(), () => false);
    if (!isDir) { io.stderr.write(`solve: ${dir} is not a folder; give the archive folder 'meridian-ledger simulate --out' wrote\n`); return EXIT_FAILED; }
    const model = await loadModel(modelFile, io);
    if (model === null) return EXIT_FAILED;
    const { inputs, problems } = readSolveInputs(await readArchiveFolderFiles(dir));
    if (inputs === null) { for (const p of problems) io.stderr.write(`solve: ${p}\n`); return EXIT_FAILED; }
    // The bundled leap seconds and IERS C04 Earth orientation, as `night` and `predict` use them.
    const timeScale = new TimeScale(BUNDLED_LEAP_SECONDS, bundledEarthOrientationTable());
    const started = performance.now();
    const control = {
      cancellation: { isCancelled: false },
      reportProgress: (done: number, total: number) => { if (done % 100 === 0 || done === total) io.stderr.write(`solve: nightly reduction ${done} of ${total} nights\n`); },
      yieldToHost: () => Promise.resolve(),
    };
    let result: ArchiveSolveResult;
    try {
      if (compare !== null) {
        const comparison = compareTerm(await prepareArchive(inputs, model, timeScale, control), model, compare, control);
        io.stdout.write(json ? `${JSON.stringify(comparison, null, 2)}\n` : comparisonReport(comparison));
        return EXIT_OK;
      }
      if (crossValidate) {
        const prepared = await prepareArchive(inputs, model, timeScale, control);
        const cv = crossValidateYears(prepared, model, control, { onFold: (year, done, total) => io.stderr.write(`solve: fold ${done} of ${total} (without ${year}) solved\n`) });
        io.stdout.write(json ? `${JSON.stringify(cv, null, 2)}\n` : crossValidationReport(cv));
        return EXIT_OK;
      }
      result = await solveArchive(inputs, model, timeScale, control, (p) => { if (p.fraction === 1 && p.phase === 'solve') io.stderr.write(`solve: joint pass ${p.iteration} of at most ${p.iterationLimit}\n`); });
    } catch (error) {
      if (error instanceof JointSolveRefused) { io.stderr.write(`solve: ${error.message}\n`); return EXIT_FAILED; }
      throw error;
    }
    io.stderr.write(`solve: done in ${((performance.now() - started) / 1000).toFixed(1)} s\n`);
    io.stdout.write(json ? `${JSON.stringify(solveResultJson(result, inputs.stars, { residuals }), null, 2)}\n` : textReport(result));
    return EXIT_OK;
  },
};
