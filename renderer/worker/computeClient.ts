import type { FromWorker, TaskRequest, TaskResult, ToWorker } from './protocol.ts';
import { bytesIn, COPY_STEP_BYTES, withTransferableBytes, withTransferableBytesInSteps } from './transferBytes.ts';

/** The part of a Worker the client uses; tests connect it to a WorkerDispatcher directly. */
export interface WorkerPort {
  /** `transfer`: buffers handed over to the worker (transferBytes.ts), not copied. */
  postMessage(message: ToWorker, transfer?: Transferable[]): void;
  addEventListener(type: 'message', listener: (event: { readonly data: unknown }) => void): void;
  addEventListener(type: 'error', listener: (event: { readonly message?: string }) => void): void;
}

export type JobOutcome =
  | { readonly kind: 'finished'; readonly result: TaskResult }
  | { readonly kind: 'cancelled'; readonly done: number }
  | { readonly kind: 'failed'; readonly message: string };

export interface JobHandle {
  readonly jobId: string;
  /** Resolves once with how the job ended; never rejects. */
  readonly outcome: Promise<JobOutcome>;
  /** Asks the worker to stop; the outcome becomes `cancelled` when it has. */
  cancel(): void;
}

interface PendingJob {
  readonly onProgress: (done: number, total: number) => void;
  readonly settle: (outcome: JobOutcome) => void;
}

/** The renderer's side of the worker protocol: starts jobs, routes progress, settles outcomes. */
export class ComputeClient {
  readonly #port: WorkerPort;
  readonly #pending = new Map<string, PendingJob>();
  #nextJob = 1;

  constructor(port: WorkerPort) {
    this.#port = port;
    port.addEventListener('message', (event) => this.#receive(event.data as FromWorker));
    port.addEventListener('error', (event) => {
      const reason = event.message ?? 'the worker script failed to load or threw at top level';
      this.#failAll(`The compute worker stopped: ${reason}. Reload the app to start it again.`);
    });
  }

  run(request: TaskRequest, onProgress: (done: number, total: number) => void = () => {}): JobHandle {
    const jobId = `job-${this.#nextJob++}`;
    const outcome = new Promise<JobOutcome>((settle) => this.#pending.set(jobId, { onProgress, settle }));
    // Byte arrays go over as transferred copies: the caller keeps its bytes, and the window's thread
    // pays a memory copy, not a structured clone of a file that may be hundreds of megabytes. A
    // large one is copied in steps first; a cancel meanwhile ends the job before it starts.
    const start = { type: 'start', jobId, request } as ToWorker;
    if (bytesIn(start) <= COPY_STEP_BYTES) {
      const { message, transfer } = withTransferableBytes(start);
      this.#port.postMessage(message, transfer);
      return { jobId, outcome, cancel: () => this.#port.postMessage({ type: 'cancel', jobId }) };
    }
    let state: 'copying' | 'started' | 'cancelled' = 'copying';
    void withTransferableBytesInSteps(start, () => new Promise<void>((resolve) => setTimeout(resolve, 0))).then(({ message, transfer }) => {
      if (state === 'cancelled') return;
      state = 'started';
      this.#port.postMessage(message, transfer);
    });
    const cancel = (): void => {
      if (state === 'started') this.#port.postMessage({ type: 'cancel', jobId });
      else if (state === 'copying') {
        state = 'cancelled';
        this.#pending.get(jobId)?.settle({ kind: 'cancelled', done: 0 });
        this.#pending.delete(jobId);
      }
    };
    return { jobId, outcome, cancel };
  }

  #receive(message: FromWorker): void {
    const job = this.#pending.get(message.jobId);
    if (job === undefined) {
      // A message without a known job can only be a protocol error; surface it on every job.
      if (message.type === 'failed') this.#failAll(`The compute worker refused a message: ${message.message}`);
      return;
    }
    if (message.type === 'progress') {
      job.onProgress(message.done, message.total);
      return;
    }
    this.#pending.delete(message.jobId);
    if (message.type === 'finished') job.settle({ kind: 'finished', result: message.result });
    else if (message.type === 'cancelled') job.settle({ kind: 'cancelled', done: message.done });
    else job.settle({ kind: 'failed', message: message.message });
  }

  #failAll(message: string): void {
    for (const job of this.#pending.values()) job.settle({ kind: 'failed', message });
    this.#pending.clear();
  }
}
