import type { BridgeResult, OpenFileRequest, OpenedFile } from '../../core/bridge.ts';

/** The `accept` attribute for a file input: ".csv,.txt" from the request's filters. */
export function acceptAttribute(request: OpenFileRequest): string {
  return request.filters.flatMap((filter) => filter.extensions.map((extension) => `.${extension}`)).join(',');
}

/**
 * Lets the user choose files with a hidden `<input type="file">` and reads their bytes. Resolves
 * `cancelled` when the picker is dismissed (the input's `cancel` event, Chromium 113+).
 */
export function pickFiles(request: OpenFileRequest): Promise<BridgeResult<readonly OpenedFile[]>> {
  return new Promise((resolve) => {
    const input = document.createElement('input');
    input.type = 'file';
    input.multiple = request.multiple;
    input.accept = acceptAttribute(request);
    input.hidden = true;
    input.setAttribute('aria-label', request.title);
    input.dataset.meridianPicker = 'open';
    const finish = (result: BridgeResult<readonly OpenedFile[]>) => {
      input.remove();
      resolve(result);
    };
    input.addEventListener('cancel', () => finish({ kind: 'cancelled' }), { once: true });
    input.addEventListener('change', () => {
      const files = Array.from(input.files ?? []);
      if (files.length === 0) return finish({ kind: 'cancelled' });
      Promise.all(files.map(async (file) => ({ name: file.name, bytes: new Uint8Array(await file.arrayBuffer()) })))
        .then((opened) => finish({ kind: 'ok', value: opened }))
        .catch((error: unknown) =>
          finish({ kind: 'failed', message: `Could not read the chosen file: ${String(error)}. Choose it again.` }),
        );
    }, { once: true });
    document.body.append(input);
    input.click();
  });
}
