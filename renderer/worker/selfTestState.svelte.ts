import type { ComputeClient, JobHandle } from './computeClient.ts';
import type { EclipticFieldResult } from './tasks/eclipticField.ts';

export type SelfTestPhase = 'idle' | 'running' | 'finished' | 'cancelled' | 'failed';

/** The worker self-test as the Solve view shows it. */
export class SelfTestState {
  phase = $state<SelfTestPhase>('idle');
  done = $state(0);
  total = $state(0);
  result = $state.raw<EclipticFieldResult | null>(null);
  message = $state('');
  #job: JobHandle | null = null;
  readonly #compute: ComputeClient;

  constructor(compute: ComputeClient) {
    this.#compute = compute;
  }

  async start(starCount: number): Promise<void> {
    this.phase = 'running';
    this.done = 0;
    this.total = starCount;
    this.result = null;
    this.message = '';
    const job = this.#compute.run({ kind: 'ecliptic-field', starCount, seed: 20_261_201 }, (done, total) => {
      this.done = done;
      this.total = total;
    });
    this.#job = job;
    const outcome = await job.outcome;
    this.#job = null;
    if (outcome.kind === 'finished') {
      const result = outcome.result;
      if (result.kind !== 'ecliptic-field') throw new Error(`self-test: the worker answered a ${result.kind} job with the wrong result`);
      this.phase = 'finished';
      this.done = result.starCount;
      this.result = result;
    } else if (outcome.kind === 'cancelled') {
      this.phase = 'cancelled';
      this.done = outcome.done;
    } else {
      this.phase = 'failed';
      this.message = outcome.message;
    }
  }

  cancel(): void {
    this.#job?.cancel();
  }
}
