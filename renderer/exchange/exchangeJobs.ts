import type { ComputeClient, JobHandle } from '../worker/computeClient.ts';
import type { ExchangeRequest, ExchangeResult, ExchangeTestHooks } from '../worker/tasks/exchangeTasks.ts';

export type ExchangeOutcome<K extends ExchangeResult['kind']> =
  | { readonly kind: 'finished'; readonly result: Extract<ExchangeResult, { kind: K }> }
  | { readonly kind: 'cancelled' }
  | { readonly kind: 'failed'; readonly message: string };

/** Exchange jobs of this window still running, by kind (the hourly backup skips imports and restores). */
const runningJobs = new Map<ExchangeRequest['kind'], number>();

/** Whether an Exchange job of one of `kinds` is running in this window. */
export function isExchangeJobRunning(kinds: readonly ExchangeRequest['kind'][]): boolean {
  return kinds.some((kind) => (runningJobs.get(kind) ?? 0) > 0);
}

/** Starts an Exchange job in the worker; `outcome` resolves once, typed by the request's kind. */
export function startExchangeJob<R extends ExchangeRequest>(
  compute: ComputeClient, request: R, onProgress: (done: number, total: number) => void,
): { handle: JobHandle; outcome: Promise<ExchangeOutcome<R['kind']>> } {
  const handle = compute.run(request, onProgress);
  runningJobs.set(request.kind, (runningJobs.get(request.kind) ?? 0) + 1);
  const settled = handle.outcome.finally(() => runningJobs.set(request.kind, (runningJobs.get(request.kind) ?? 1) - 1));
  const outcome = settled.then((o): ExchangeOutcome<R['kind']> => {
    if (o.kind === 'cancelled') return { kind: 'cancelled' };
    if (o.kind === 'failed') return o;
    if (o.result.kind !== request.kind) return { kind: 'failed', message: `the worker answered a ${request.kind} job with a ${o.result.kind} result` };
    return { kind: 'finished', result: o.result as Extract<ExchangeResult, { kind: R['kind'] }> };
  });
  return { handle, outcome };
}

/**
 * Test hooks from the page address, only when it carries `?test-hooks` (the end-to-end tests):
 * `quota-on-transit-write=N`, `chunk-delay-ms=M` and `chunk-rows=R`. Null in normal use.
 */
export function testHooksFromLocation(search: string): ExchangeTestHooks | null {
  const query = new URLSearchParams(search);
  if (!query.has('test-hooks')) return null;
  const number = (name: string) => (query.has(name) ? Number(query.get(name)) : undefined);
  return { quotaOnTransitWrite: number('quota-on-transit-write'), chunkDelayMs: number('chunk-delay-ms'), chunkRows: number('chunk-rows') };
}

/** Today's UTC date as an MJD (whole day), for the staleness lines. */
export function todayUtcMjd(): number {
  return Math.floor(Date.now() / 86_400_000) + 40_587; // 1970-01-01 is MJD 40587
}
