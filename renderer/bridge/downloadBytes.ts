/**
 * Offers bytes to the user as a download named `fileName`, through an object URL that is revoked
 * once the browser has taken it. The browser decides the folder (usually Downloads) and may ask.
 */
export function downloadBytes(bytes: Uint8Array, fileName: string, mimeType = 'application/octet-stream'): void {
  // Copy into a plain ArrayBuffer: a view may sit on a SharedArrayBuffer, which Blob refuses.
  const copy = new Uint8Array(bytes.byteLength);
  copy.set(bytes);
  const url = URL.createObjectURL(new Blob([copy.buffer], { type: mimeType }));
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
