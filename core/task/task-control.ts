/**
 * What a long-running core function (import, reduction, simulation) receives from whoever runs
 * it — the renderer's Web Worker, the CLI, a test — to report progress and notice cancellation.
 *
 * The function polls `cancellation.isCancelled` between chunks of work and throws
 * TaskCancelledError when it is set; it awaits `yieldToHost()` between chunks so that the host can
 * deliver a cancel message (a worker only reads its messages between tasks of its event loop).
 */

/** Set by the host when the user cancels; read-only to the task. */
export interface CancellationToken {
  readonly isCancelled: boolean;
}

export interface TaskControl {
  readonly cancellation: CancellationToken;
  /** Items finished so far and the total, both counts of the task's own unit (stars, rows, …). */
  reportProgress(done: number, total: number): void;
  /** Resolves after the host had a chance to handle pending messages. */
  yieldToHost(): Promise<void>;
}

/** Thrown by a task that saw its cancellation token set; hosts report it as "cancelled", not failed. */
export class TaskCancelledError extends Error {
  override readonly name = 'TaskCancelledError';
  /** Items finished when the task stopped. */
  readonly done: number;
  constructor(taskName: string, done: number) {
    super(`${taskName} was cancelled after ${done} items; nothing it computed was kept.`);
    this.done = done;
  }
}

/** A control for callers that neither cancel nor watch progress (CLI batch, tests). */
export const UNCONTROLLED: TaskControl = {
  cancellation: { isCancelled: false },
  reportProgress: () => {},
  yieldToHost: () => Promise.resolve(),
};
