import type { ReductionRecord } from '../../core/archive/records.ts';
import type { JointModel } from '../../core/joint/joint-model.ts';
import type { ArchiveDatabase } from '../store/database.ts';
import type { ComputeClient, JobHandle } from '../worker/computeClient.ts';
import type { SolveSelection } from './solveSelection.ts';

export type SolvePhase = 'idle' | 'running' | 'finished' | 'cancelled' | 'failed';

/**
 * The Solve view's state: saved reductions (newest first), the running solve with its progress,
 * and which saved solve is shown. Solves run in the compute worker, which also saves them.
 */
export class SolveState {
  readonly #database: ArchiveDatabase;
  readonly #compute: ComputeClient;
  #job: JobHandle | null = null;
  reductions = $state.raw<ReductionRecord[]>([]);
  phase = $state<SolvePhase>('idle');
  done = $state(0);
  total = $state(0);
  message = $state('');
  shownId = $state<string | null>(null);
  /** Whether the archive still holds what the shown solve read: checked in the worker on show. */
  shownInputs = $state<'checking' | 'unchanged' | 'changed' | 'unknown'>('unknown');
  /** Set after a re-run whose archive files differ from the saved solve's. */
  fingerprintWarning = $state('');

  constructor(database: ArchiveDatabase, compute: ComputeClient) {
    this.#database = database;
    this.#compute = compute;
  }

  get shown(): ReductionRecord | null {
    return this.reductions.find((r) => r.id === this.shownId) ?? null;
  }

  async refresh(): Promise<void> {
    this.reductions = (await this.#database.reductions.orderBy('createdUtc').reverse().toArray());
  }

  /** Runs a solve in the worker; `rerunOf` is the saved solve whose model and selection are repeated. */
  async run(label: string, model: JointModel, selection: SolveSelection, codeVersion: string, rerunOf: ReductionRecord | null = null): Promise<void> {
    this.phase = 'running';
    this.done = 0;
    this.total = 0;
    this.message = this.fingerprintWarning = '';
    // Plain copies: the worker's structured clone refuses Svelte's state proxies.
    const request = { kind: 'joint-solve', databaseName: this.#database.name, label, model: $state.snapshot(model) as JointModel, selection: $state.snapshot(selection) as SolveSelection, codeVersion } as const;
    this.#job = this.#compute.run(request, (done, total) => {
      this.done = done;
      this.total = total;
    });
    const outcome = await this.#job.outcome;
    this.#job = null;
    if (outcome.kind === 'cancelled') {
      this.phase = 'cancelled';
      this.message = 'The solve was cancelled; nothing was saved.';
      return;
    }
    if (outcome.kind === 'failed' || outcome.result.kind !== 'joint-solve') {
      this.phase = 'failed';
      this.message = outcome.kind === 'failed' ? outcome.message : `unexpected worker answer ${outcome.result.kind}`;
      return;
    }
    const saved = outcome.result.reduction;
    if (rerunOf !== null && rerunOf.inputFingerprint !== saved.inputFingerprint) {
      this.fingerprintWarning = `The archive changed since "${rerunOf.label}" was solved (input fingerprint ${rerunOf.inputFingerprint.slice(0, 12)}… then, ${saved.inputFingerprint.slice(0, 12)}… now): the two solves did not read the same transits.`;
    }
    this.phase = 'finished';
    await this.refresh();
    this.shownId = saved.id;
    this.shownInputs = 'unchanged';
  }

  /** Shows a saved solve and checks in the worker whether the archive files it read are unchanged. */
  async show(id: string): Promise<void> {
    this.shownId = id;
    const record = this.shown;
    if (record === null) return;
    this.shownInputs = 'checking';
    const selection = (record.modelConfiguration as { selection?: SolveSelection }).selection;
    if (selection === undefined) return void (this.shownInputs = 'unknown');
    const outcome = await this.#compute.run({ kind: 'solve-fingerprint', databaseName: this.#database.name, selection }).outcome;
    if (this.shownId !== id) return;
    this.shownInputs = outcome.kind === 'finished' && outcome.result.kind === 'solve-fingerprint'
      ? (outcome.result.fingerprint === record.inputFingerprint ? 'unchanged' : 'changed') : 'unknown';
  }

  cancel(): void {
    this.#job?.cancel();
  }

  async remove(id: string): Promise<void> {
    await this.#database.reductions.delete(id);
    if (this.shownId === id) this.shownId = null;
    await this.refresh();
  }
}
