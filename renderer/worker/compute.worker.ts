/// <reference lib="webworker" />
import { WorkerDispatcher } from './dispatcher.ts';
import type { FromWorker } from './protocol.ts';
import { buffersIn, resultBytesOf } from './transferBytes.ts';

// Module worker entry: wires the dispatcher to this worker's message port. A zero timeout lets
// the event loop deliver a pending cancel between chunks of work.
const scope = self as unknown as DedicatedWorkerGlobalScope;
const dispatcher = new WorkerDispatcher(
  // A result's own `bytes` (an exported bundle, a CSV file) is made for the window and kept by no
  // task: transferred (transferBytes.ts). Nothing else is, since a task may keep what it returns.
  (message: FromWorker) => scope.postMessage(message, message.type === 'finished' ? buffersIn(resultBytesOf(message.result), 0) : []),
  () => new Promise<void>((resolve) => setTimeout(resolve, 0)),
);
scope.addEventListener('message', (event: MessageEvent<unknown>) => dispatcher.handle(event.data));
