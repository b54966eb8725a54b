import { TaskCancelledError, type TaskControl } from '../../core/task/task-control.ts';
import { parseToWorker, type FromWorker, type TaskKind, type TaskRequest, type TaskResult } from './protocol.ts';
import { runEclipticField, type EclipticFieldRequest } from './tasks/eclipticField.ts';
import { EXCHANGE_KINDS, runExchangeTask, type ExchangeRequest } from './tasks/exchangeTasks.ts';
import { runTonightProgramme, type TonightProgrammeRequest } from './tasks/tonightProgramme.ts';
import { runNightQuality, type NightQualityRequest } from './tasks/nightQuality.ts';
import { runJointSolve, runSolveFingerprint, type JointSolveRequest, type SolveFingerprintRequest } from './tasks/jointSolve.ts';

/** Runs one request under a control; one entry per task kind. */
export type TaskRunner = (request: TaskRequest, control: TaskControl) => Promise<TaskResult>;
export type TaskTable = Readonly<Record<TaskKind, TaskRunner>>;

export const TASKS: TaskTable = {
  'ecliptic-field': (request, control) => runEclipticField(request as EclipticFieldRequest, control),
  'tonight-programme': (request, control) => runTonightProgramme(request as TonightProgrammeRequest, control),
  'joint-solve': (request, control) => runJointSolve(request as JointSolveRequest, control),
  'solve-fingerprint': (request) => runSolveFingerprint(request as SolveFingerprintRequest),
  'night-quality': (request, control) => runNightQuality(request as NightQualityRequest, control),
  ...(Object.fromEntries(EXCHANGE_KINDS.map((kind) => [kind, (request: TaskRequest, control: TaskControl) => runExchangeTask(request as ExchangeRequest, control)])) as Record<ExchangeRequest['kind'], TaskRunner>),
};

interface RunningJob {
  isCancelled: boolean;
  lastDone: number;
}

/**
 * The worker's side of the protocol, free of any Worker API so that it runs under test in Node:
 * `post` sends a message to the renderer, `yieldToHost` lets pending messages (a cancel) in.
 */
export class WorkerDispatcher {
  readonly #jobs = new Map<string, RunningJob>();
  readonly #post: (message: FromWorker) => void;
  readonly #tasks: TaskTable;
  readonly #yieldToHost: () => Promise<void>;

  constructor(post: (message: FromWorker) => void, yieldToHost: () => Promise<void>, tasks: TaskTable = TASKS) {
    this.#post = post;
    this.#yieldToHost = yieldToHost;
    this.#tasks = tasks;
  }

  /** Number of jobs started and not yet finished, cancelled or failed. */
  get runningJobCount(): number {
    return this.#jobs.size;
  }

  /** Handles one received message; a malformed one is answered with `failed`, never dropped. */
  handle(raw: unknown): void {
    const message = parseToWorker(raw);
    if (typeof message === 'string') {
      const jobId = typeof raw === 'object' && raw !== null && 'jobId' in raw ? String(raw.jobId) : '';
      this.#post({ type: 'failed', jobId, message });
      return;
    }
    if (message.type === 'cancel') {
      // A cancel for a job that already ended is the ordinary race with its last message: ignore.
      const job = this.#jobs.get(message.jobId);
      if (job !== undefined) job.isCancelled = true;
      return;
    }
    if (this.#jobs.has(message.jobId)) {
      this.#post({ type: 'failed', jobId: message.jobId, message: `job ${message.jobId} is already running; use a new jobId` });
      return;
    }
    void this.#run(message.jobId, message.request);
  }

  async #run(jobId: string, request: TaskRequest): Promise<void> {
    const job: RunningJob = { isCancelled: false, lastDone: 0 };
    this.#jobs.set(jobId, job);
    const control: TaskControl = {
      cancellation: job,
      reportProgress: (done, total) => {
        job.lastDone = done;
        this.#post({ type: 'progress', jobId, done, total });
      },
      yieldToHost: this.#yieldToHost,
    };
    try {
      const result = await this.#tasks[request.kind](request, control);
      this.#post({ type: 'finished', jobId, result });
    } catch (error) {
      if (error instanceof TaskCancelledError) {
        this.#post({ type: 'cancelled', jobId, done: error.done });
      } else {
        const text = error instanceof Error ? error.message : String(error);
        this.#post({ type: 'failed', jobId, message: text });
      }
    } finally {
      this.#jobs.delete(jobId);
    }
  }
}
