// The overview's worker task as the worker protocol carries it (renderer/worker/protocol.ts, dispatcher.ts).
import { describe, expect, test } from 'vitest';
import { parseToWorker } from '../../renderer/worker/protocol.ts';
import { TASKS } from '../../renderer/worker/dispatcher.ts';

describe("parseToWorker({ type: 'start', request: { kind: 'night-quality' } })", () => {
  test('passes the database name on and drops any other field', () => {
    const parsed = parseToWorker({ type: 'start', jobId: 'j-1', request: { kind: 'night-quality', databaseName: 'archive-x', extra: 1 } });
    expect(parsed).toEqual({ type: 'start', jobId: 'j-1', request: { kind: 'night-quality', databaseName: 'archive-x' } });
  });
  test('refuses a request without a database name, saying what is missing', () => {
    expect(parseToWorker({ type: 'start', jobId: 'j-2', request: { kind: 'night-quality' } })).toBe("start message for job j-2: night-quality needs the archive's databaseName as a string");
  });
  test('the dispatcher has a runner for it', () => {
    expect(typeof TASKS['night-quality']).toBe('function');
  });
});
