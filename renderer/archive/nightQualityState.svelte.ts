import type { ComputeClient, JobHandle } from '../worker/computeClient.ts';
import type { NightQuality } from './nightQuality.ts';

/**
 * The nights' unit-weight errors for the overview: runs the worker's `night-quality` task (which
 * reduces only nights changed since its last pass and caches the rest for the session), with
 * progress and cancel. A new pass cancels one still running.
 */
export class NightQualityState {
  // Replaced whole after each pass ($state.raw) and never mutated, so a plain Map is enough.
  // eslint-disable-next-line svelte/prefer-svelte-reactivity
  byNight = $state.raw<ReadonlyMap<string, NightQuality>>(new Map());
  /** Nights reduced so far of those to reduce in this pass; null when no pass is running. */
  progress = $state.raw<{ readonly done: number; readonly total: number } | null>(null);
  status = $state('');
  readonly #compute: ComputeClient;
  readonly #databaseName: string;
  #job: JobHandle | null = null;

  constructor(compute: ComputeClient, databaseName: string) {
    this.#compute = compute;
    this.#databaseName = databaseName;
  }

  /** Starts a pass over every night; resolves when it ends (finished, cancelled or failed). */
  async refresh(): Promise<void> {
    this.#job?.cancel();
    const job = this.#compute.run({ kind: 'night-quality', databaseName: this.#databaseName }, (done, total) => {
      if (this.#job === job) this.progress = { done, total };
    });
    this.#job = job;
    this.progress = { done: 0, total: 0 };
    const outcome = await job.outcome;
    if (this.#job !== job) return;
    this.#job = null;
    this.progress = null;
    if (outcome.kind === 'finished' && outcome.result.kind === 'night-quality') {
      // eslint-disable-next-line svelte/prefer-svelte-reactivity -- replaced whole, never mutated
      this.byNight = new Map(outcome.result.nights.map((q) => [q.nightId, q]));
      const r = outcome.result;
      this.status = r.reduced === 0 ? `Unit-weight errors of ${r.reused} nights, unchanged since their last reduction.` : `Reduced ${r.reduced} night${r.reduced === 1 ? '' : 's'}; ${r.reused} unchanged from the last pass.`;
    } else if (outcome.kind === 'cancelled') {
      this.status = `Stopped after ${outcome.done} nights; the nights reduced so far are kept for the next pass. Reduce again to finish.`;
    } else if (outcome.kind === 'failed') {
      this.status = `The nightly reductions failed: ${outcome.message}`;
    }
  }

  cancel(): void {
    this.#job?.cancel();
  }
}
