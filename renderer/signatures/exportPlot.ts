import type { ShellBridge } from '../../core/bridge.ts';

/** Saves an SVG document through the shell bridge (a save dialog in the desktop app, a download in the browser); returns what to tell the user. */
export async function saveSvg(bridge: ShellBridge, baseName: string, svg: string): Promise<string> {
  const result = await bridge.saveFile({
    title: 'Export plot as SVG', suggestedName: `${baseName}.svg`, filters: [{ label: 'SVG image', extensions: ['svg'] }],
    bytes: new TextEncoder().encode(svg),
  });
  return describe(result, 'SVG');
}

/** Renders the SVG document at 2× onto a canvas and saves it as PNG through the bridge. */
export async function savePng(bridge: ShellBridge, baseName: string, svg: string): Promise<string> {
  const size = /width="(\d+)" height="(\d+)"/.exec(svg);
  if (size === null) throw new Error('savePng: the SVG has no width and height; export it through plotSvg or heatMapSvg.');
  const [width, height] = [Number(size[1]), Number(size[2])];
  const url = URL.createObjectURL(new Blob([svg], { type: 'image/svg+xml' }));
  try {
    const image = new Image();
    image.src = url;
    await image.decode();
    const canvas = document.createElement('canvas');
    canvas.width = width * 2;
    canvas.height = height * 2;
    const context = canvas.getContext('2d');
    if (context === null) throw new Error('savePng: this browser gives no 2D canvas; export as SVG instead.');
    context.drawImage(image, 0, 0, canvas.width, canvas.height);
    const blob = await new Promise<Blob | null>((done) => canvas.toBlob(done, 'image/png'));
    if (blob === null) throw new Error('savePng: the canvas could not be encoded as PNG; export as SVG instead.');
    const result = await bridge.saveFile({
      title: 'Export plot as PNG', suggestedName: `${baseName}.png`, filters: [{ label: 'PNG image', extensions: ['png'] }],
      bytes: new Uint8Array(await blob.arrayBuffer()),
    });
    return describe(result, 'PNG');
  } finally {
    URL.revokeObjectURL(url);
  }
}

function describe(result: Awaited<ReturnType<ShellBridge['saveFile']>>, kind: string): string {
  if (result.kind === 'ok') return `Saved ${kind} as ${result.value.savedAs}.`;
  if (result.kind === 'cancelled') return `${kind} export cancelled.`;
  return `${kind} export failed: ${result.message}`;
}
