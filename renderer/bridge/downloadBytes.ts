/** Bytes put into the download's Blob per step: one step copies a few milliseconds' worth. */
export const DOWNLOAD_STEP_BYTES = 8 << 20;

/**
 * Offers bytes to the user as a download named `fileName`, through an object URL that is revoked
 * once the browser has taken it. The browser decides the folder (usually Downloads) and may ask.
 *
 * The Blob is built from parts of DOWNLOAD_STEP_BYTES, one part per turn of the event loop (a
 * Blob of Blobs copies no bytes): a million-transit bundle copied into one Blob at once held the
 * window's thread 300–400 ms. Each part is a sliced copy, so a view on a SharedArrayBuffer (which
 * Blob refuses) is accepted too.
 */
export async function downloadBytes(bytes: Uint8Array, fileName: string, mimeType = 'application/octet-stream'): Promise<void> {
  const parts: Blob[] = [];
  for (let start = 0; start < bytes.byteLength || start === 0; start += DOWNLOAD_STEP_BYTES) {
    parts.push(new Blob([bytes.slice(start, start + DOWNLOAD_STEP_BYTES)]));
    if (start + DOWNLOAD_STEP_BYTES < bytes.byteLength) await new Promise<void>((resolve) => setTimeout(resolve, 0));
  }
  const url = URL.createObjectURL(new Blob(parts, { type: mimeType }));
  const anchor = document.createElement('a');
  anchor.href = url;
  anchor.download = fileName;
  anchor.hidden = true;
  document.body.append(anchor);
  anchor.click();
  anchor.remove();
  // Revoke on a later turn: Chromium starts the download asynchronously after click().
  setTimeout(() => URL.revokeObjectURL(url), 60_000);
}
