/// <reference lib="webworker" />
import { WorkerDispatcher } from './dispatcher.ts';
import type { FromWorker } from './protocol.ts';

// Module worker entry: wires the dispatcher to this worker's message port. A zero timeout lets
// the event loop deliver a pending cancel between chunks of work.
const scope = self as unknown as DedicatedWorkerGlobalScope;
const dispatcher = new WorkerDispatcher(
  (message: FromWorker) => scope.postMessage(message),
  () => new Promise<void>((resolve) => setTimeout(resolve, 0)),
);
scope.addEventListener('message', (event: MessageEvent<unknown>) => dispatcher.handle(event.data));
