/**
 * Byte arrays cross between the window and the worker by transfer, not by copy. Chromium's
 * structured clone of a large Uint8Array costs the sending thread far more than a plain copy
 * (measured in headless Chromium on the 2-core build machine: 40 MiB 20 ms, 160 MiB 473 ms to
 * post; transferring either under 1 ms), and a million-transit log or bundle is that size: posted
 * by clone, it held the window's thread for 300–470 ms.
 */

/** How deep into a message byte arrays are looked for (request → file → bytes is three levels). */
const SEARCH_DEPTH = 4;

function isBytes(value: unknown): value is ArrayBufferView<ArrayBuffer> {
  return ArrayBuffer.isView(value) && value.buffer instanceof ArrayBuffer;
}

/** The `bytes` field of a task's result, when it has one (what the window saves as a file). */
export function resultBytesOf(result: unknown): unknown {
  return result !== null && typeof result === 'object' && 'bytes' in result ? result.bytes : undefined;
}

/** The buffers of the byte arrays in `message` (to transfer what the sender no longer needs). */
export function buffersIn(message: unknown, depth: number = SEARCH_DEPTH): ArrayBuffer[] {
  const found = new Set<ArrayBuffer>();
  const visit = (value: unknown, left: number): void => {
    if (isBytes(value)) found.add(value.buffer);
    else if (left > 0 && value !== null && typeof value === 'object') for (const inner of Object.values(value)) visit(inner, left - 1);
  };
  visit(message, depth);
  return [...found];
}

/**
 * A copy of `message` whose byte arrays are fresh copies, with their buffers to transfer: the
 * sender keeps its own bytes (a file chosen once is checked, then imported) and pays one memory
 * copy instead of a structured clone. Only the plain objects on the way to a byte array are rebuilt;
 * every other value is the sender's own (postMessage clones it).
 */
export function withTransferableBytes<T>(message: T, depth: number = SEARCH_DEPTH): { message: T; transfer: ArrayBuffer[] } {
  return withBytesReplaced(message, depth, (view) => new Uint8Array(view.buffer, view.byteOffset, view.byteLength).slice());
}

/**
 * `message` with each byte array replaced by `copyOf(it)` (same content, a buffer of its own) and
 * those buffers listed to transfer. Only the plain objects on the way to a byte array are rebuilt.
 */
function withBytesReplaced<T>(message: T, depth: number, copyOf: (view: ArrayBufferView<ArrayBuffer>) => Uint8Array<ArrayBuffer>): { message: T; transfer: ArrayBuffer[] } {
  const transfer: ArrayBuffer[] = [];
  const rebuild = (value: unknown, left: number): unknown => {
    if (isBytes(value)) {
      const bytes = copyOf(value);
      transfer.push(bytes.buffer);
      return value instanceof Uint8Array ? bytes : new (value.constructor as new (buffer: ArrayBuffer) => ArrayBufferView)(bytes.buffer);
    }
    if (left === 0 || value === null || typeof value !== 'object' || Array.isArray(value)) return value;
    if (Object.getPrototypeOf(value) !== Object.prototype || buffersIn(value, left).length === 0) return value;
    return Object.fromEntries(Object.entries(value).map(([key, inner]) => [key, rebuild(inner, left - 1)]));
  };
  return { message: rebuild(message, depth) as T, transfer };
}

/** Bytes copied per step by withTransferableBytesInSteps: one step is a few milliseconds. */
export const COPY_STEP_BYTES = 8 << 20;

/** Total bytes of the byte arrays in `message`. */
export function bytesIn(message: unknown, depth: number = SEARCH_DEPTH): number {
  let total = 0;
  const visit = (value: unknown, left: number): void => {
    if (isBytes(value)) total += value.byteLength;
    else if (left > 0 && value !== null && typeof value === 'object') for (const inner of Object.values(value)) visit(inner, left - 1);
  };
  visit(message, depth);
  return total;
}

/**
 * withTransferableBytes for large messages: each byte array is copied COPY_STEP_BYTES at a time
 * with `yieldToHost` between steps, so no step holds the window's thread long (a 150 MiB file
 * copied at once took about 280 ms, with its fresh pages touched for the first time).
 */
export async function withTransferableBytesInSteps<T>(message: T, yieldToHost: () => Promise<void>, depth: number = SEARCH_DEPTH): Promise<{ message: T; transfer: ArrayBuffer[] }> {
  const copies = new Map<ArrayBufferView, Uint8Array<ArrayBuffer>>();
  const gather = (value: unknown, left: number): void => {
    if (isBytes(value)) copies.set(value, new Uint8Array(value.byteLength));
    else if (left > 0 && value !== null && typeof value === 'object') for (const inner of Object.values(value)) gather(inner, left - 1);
  };
  gather(message, depth);
  for (const [original, copy] of copies) {
    const source = new Uint8Array(original.buffer, original.byteOffset, original.byteLength);
    for (let start = 0; start < source.length; start += COPY_STEP_BYTES) {
      copy.set(source.subarray(start, start + COPY_STEP_BYTES), start);
      if (start + COPY_STEP_BYTES < source.length) await yieldToHost();
    }
  }
  return withBytesReplaced(message, depth, (view) => copies.get(view) as Uint8Array<ArrayBuffer>);
}
