import type { ReductionRecord } from '../../../core/archive/records.ts';
import { encodeFolderFiles, writeArchiveFolder } from '../../../core/archive-folder/archive-folder.ts';
import type { JointModel } from '../../../core/joint/joint-model.ts';
import { prepareArchive } from '../../../core/joint/prepare-archive.ts';
import { solvePrepared, type ArchiveSolveResult } from '../../../core/joint/solve-archive.ts';
import { SolveCancelled } from '../../../core/solver/index.ts';
import { readSolveInputs } from '../../../core/joint/solve-inputs.ts';
import { observationResiduals } from '../../../core/joint/solve-outputs.ts';
import { TaskCancelledError, type TaskControl } from '../../../core/task/task-control.ts';
import { folderFingerprint } from '../../solve/folderFingerprint.ts';
import { archiveContentFromStore, type SolveSelection } from '../../solve/solveSelection.ts';
import { solveResultJson } from '../../../core/joint/solve-result-json.ts';
import { ArchiveDatabase } from '../../store/database.ts';
import { archiveTimeScale } from './archiveTimeScale.ts';
import { nowUtcIso } from '../../store/nowUtcIso.ts';

export interface JointSolveRequest {
  readonly kind: 'joint-solve';
  readonly databaseName: string;
  readonly label: string;
  readonly model: JointModel;
  readonly selection: SolveSelection;
  /** The app version that runs the solve (the renderer's __APP_VERSION__). */
  readonly codeVersion: string;
}

export interface JointSolveResult {
  readonly kind: 'joint-solve';
  /** The saved reduction, as written to the `reductions` table. */
  readonly reduction: ReductionRecord;
}

/** Progress is reported in thousandths: the nightly reductions fill the first 700, the joint passes the rest. */
export const SOLVE_PROGRESS_TOTAL = 1000;
const NIGHTLY_SHARE = 700;

/** The records→solve bridge: store records → archive folder files → SolveInputs, with the files' fingerprint. */
export async function solveInputsFromStore(database: ArchiveDatabase, selection: SolveSelection) {
  const files = encodeFolderFiles(writeArchiveFolder(await archiveContentFromStore(database, selection)));
  const { inputs, problems } = readSolveInputs(files);
  if (inputs === null) throw new Error(`The archive cannot be solved as stored: ${problems.slice(0, 5).join('; ')}${problems.length > 5 ? ` (and ${problems.length - 5} more)` : ''}`);
  return { inputs, files, fingerprint: folderFingerprint(files) };
}

async function honourCancel(control: TaskControl, done: number): Promise<void> {
  await control.yieldToHost();
  if (control.cancellation.isCancelled) throw new TaskCancelledError('the joint solve', done);
}

/**
 * The joint solve of the stored archive in the worker (core/joint/solve-archive.ts with the
 * archive's leap seconds and Earth orientation: the bundled tables with whatever IERS files were
 * imported, as Tonight and the overview use them), saved as a ReductionRecord whose results have the
 * shape of `solve --json` and whose residuals are one row per transit. Cancel is seen between
 * nights of the nightly reductions; the joint passes are synchronous, so a cancel sent while they
 * run is honoured when they end, before anything is saved.
 */
export async function runJointSolve(request: JointSolveRequest, control: TaskControl): Promise<JointSolveResult> {
  const database = new ArchiveDatabase(request.databaseName);
  try {
    const { inputs, fingerprint } = await solveInputsFromStore(database, request.selection);
    const nightly: TaskControl = {
      ...control,
      reportProgress: (done, total) => control.reportProgress(Math.round((NIGHTLY_SHARE * done) / Math.max(total, 1)), SOLVE_PROGRESS_TOTAL),
    };
    const { scale } = await archiveTimeScale(database);
    const prepared = await prepareArchive(inputs, request.model, scale, nightly);
    await honourCancel(control, NIGHTLY_SHARE);
    let result: ArchiveSolveResult;
    try {
      result = solvePrepared(prepared, request.model, control, (p) => {
        const share = Math.min(1, (p.iteration - 1 + p.fraction) / Math.max(p.iterationLimit, 1));
        control.reportProgress(NIGHTLY_SHARE + Math.round((SOLVE_PROGRESS_TOTAL - NIGHTLY_SHARE) * share), SOLVE_PROGRESS_TOTAL);
      });
    } catch (error) {
      if (error instanceof SolveCancelled) throw new TaskCancelledError('the joint solve', NIGHTLY_SHARE);
      throw error;
    }
    // A cancel sent during the synchronous joint passes is only read now: honour it, save nothing.
    await honourCancel(control, SOLVE_PROGRESS_TOTAL);
    const now = nowUtcIso();
    const reduction: ReductionRecord = {
      id: crypto.randomUUID(), label: request.label,
      modelConfiguration: { model: request.model, selection: request.selection },
      inputFingerprint: fingerprint, codeVersion: request.codeVersion,
      results: solveResultJson(result, inputs.stars),
      residuals: observationResiduals(result.solution, result.layout, inputs.stars, result.nights, result.observations) as unknown as ReductionRecord['residuals'],
      createdUtc: now, updatedUtc: now,
    };
    await database.reductions.put(reduction);
    control.reportProgress(SOLVE_PROGRESS_TOTAL, SOLVE_PROGRESS_TOTAL);
    return { kind: 'joint-solve', reduction };
  } finally {
    database.close();
  }
}

/**
 * The fingerprint of what a solve with `selection` would read now, for telling whether a saved
 * solve's inputs changed since (no solve is run).
 */
export interface SolveFingerprintRequest {
  readonly kind: 'solve-fingerprint';
  readonly databaseName: string;
  readonly selection: SolveSelection;
}

export interface SolveFingerprintResult {
  readonly kind: 'solve-fingerprint';
  readonly fingerprint: string;
}

export async function runSolveFingerprint(request: SolveFingerprintRequest): Promise<SolveFingerprintResult> {
  const database = new ArchiveDatabase(request.databaseName);
  try {
    return { kind: 'solve-fingerprint', fingerprint: (await solveInputsFromStore(database, request.selection)).fingerprint };
  } finally {
    database.close();
  }
}
