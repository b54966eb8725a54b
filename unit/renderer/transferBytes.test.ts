import { describe, expect, test } from 'vitest';
import { buffersIn, bytesIn, COPY_STEP_BYTES, resultBytesOf, withTransferableBytes, withTransferableBytesInSteps } from '../../renderer/worker/transferBytes.ts';

// What is checked: the window keeps its bytes and sends transferable copies of the same content;
// nothing but byte arrays is copied; only a result's own `bytes` is handed over by the worker.
describe('byte arrays between the window and the worker', () => {
  test('withTransferableBytes copies each byte array (a view of part of a buffer too) and lists the copies to transfer', () => {
    const whole = new Uint8Array([9, 1, 2, 3, 9]);
    const file = { fileName: 'log.csv', bytes: whole.subarray(1, 4), columnMapping: { a: 'b' } };
    const request = { type: 'start', jobId: 'job-1', request: { kind: 'exchange-import', file } };
    const { message, transfer } = withTransferableBytes(request);
    const sent = message.request.file.bytes;
    expect([...sent]).toEqual([1, 2, 3]);
    expect(sent.buffer).not.toBe(whole.buffer);
    expect(transfer).toEqual([sent.buffer]);
    expect(sent.buffer.byteLength).toBe(3);
    expect(message.request.file.columnMapping).toBe(file.columnMapping);
    // Transferring the copy leaves the sender's bytes whole.
    structuredClone(message, { transfer });
    expect(sent.byteLength).toBe(0);
    expect([...whole]).toEqual([9, 1, 2, 3, 9]);
  });

  test('a message without bytes is sent as it is, with nothing to transfer', () => {
    const request = { type: 'cancel', jobId: 'job-2' };
    expect(withTransferableBytes(request)).toEqual({ message: request, transfer: [] });
  });

  test('the worker hands over only the result\'s own bytes', () => {
    const bytes = new Uint8Array(4);
    const kept = new Float64Array(2);
    expect(buffersIn(resultBytesOf({ kind: 'bundle-export', bytes, series: kept }), 0)).toEqual([bytes.buffer]);
    expect(buffersIn(resultBytesOf({ kind: 'solve', series: kept }), 0)).toEqual([]);
    expect(buffersIn({ a: { b: kept } })).toEqual([kept.buffer]);
    expect(buffersIn({ a: { b: kept } }, 1)).toEqual([]);
  });
});

describe('large byte arrays are copied in steps', () => {
  test('withTransferableBytesInSteps gives the same content as a copy at once, yielding between steps', async () => {
    const n = COPY_STEP_BYTES * 2 + 5;
    const bytes = new Uint8Array(n);
    for (let i = 0; i < n; i += 4099) bytes[i] = (i % 251) + 1;
    let yields = 0;
    const { message, transfer } = await withTransferableBytesInSteps({ request: { bytes, label: 'x' } }, async () => void yields++);
    // ⌈n / step⌉ = 3 steps, so 2 yields between them.
    expect(yields).toBe(2);
    // Compared by hand: a deep equality walks 16 million keys (the test runner ran out of memory).
    const sent = message.request.bytes;
    let firstDifference = -1;
    for (let i = 0; i < n && firstDifference < 0; i++) if (sent[i] !== bytes[i]) firstDifference = i;
    expect([sent.length, firstDifference]).toEqual([n, -1]);
    expect(message.request.bytes.buffer).not.toBe(bytes.buffer);
    expect(transfer).toEqual([message.request.bytes.buffer]);
    expect(bytesIn(message)).toBe(n);
  });
});
