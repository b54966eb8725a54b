// The layering rule (eslint.layering.js) must fire on planted bad imports and stay quiet on good ones.
import { ESLint } from 'eslint';
import { describe, expect, it } from 'vitest';

const eslint = new ESLint({ cwd: process.cwd() });

async function layeringMessages(filePath: string, code: string): Promise<string[]> {
  const [result] = await eslint.lintText(code, { filePath });
  return result.messages.filter((m) => m.ruleId === 'meridian/layering').map((m) => m.message);
}

describe('layering rule', () => {
  it('core/ may not import Node, Dexie, Svelte, Electron or another layer', async () => {
    const code = [
      "import { readFileSync } from 'node:fs';",
      "import Dexie from 'dexie';",
      "import { mount } from 'svelte';",
      "import { app } from 'electron';",
      "import { x } from '../../renderer/x.ts';",
      "import { y } from '../../unit/y.ts';",
      "export const all = [readFileSync, Dexie, mount, app, x, y];",
    ].join('\n');
    const messages = await layeringMessages('core/planted/bad.ts', code);
    expect(messages).toHaveLength(6);
    expect(messages[0]).toMatch(/^Bad layering: core\/ must stay pure TypeScript and may not import "node:fs"/);
    expect(messages[4]).toMatch(/resolves to renderer\/x\.ts/);
  });
  it('core/ may import core/ and astronomy-engine', async () => {
    const code = "import { DEG } from '../units.ts';\nimport * as Astronomy from 'astronomy-engine';\nexport const z = [DEG, Astronomy];\n";
    expect(await layeringMessages('core/planted/good.ts', code)).toEqual([]);
  });
  it('a dynamic import and require() are checked too', async () => {
    const code = "export const a = () => import('node:path');\n";
    expect(await layeringMessages('core/planted/dynamic.ts', code)).toHaveLength(1);
  });
  it('renderer/ and main/ never import each other', async () => {
    expect(await layeringMessages('renderer/x.ts', "import { a } from '../main/cli/cli.ts';\nexport const b = a;\n")).toHaveLength(1);
    expect(await layeringMessages('main/x.ts', "import { a } from '../renderer/app.ts';\nexport const b = a;\n")).toHaveLength(1);
    expect(await layeringMessages('renderer/x.ts', "import fs from 'node:fs';\nexport const b = fs;\n")).toHaveLength(1);
  });
  it('the preload may import only electron and types from core/', async () => {
    expect(await layeringMessages('main/preload.ts', "import type { ShellBridge } from '../core/bridge.ts';\nimport { ipcRenderer } from 'electron';\nexport type B = ShellBridge;\nexport const r = ipcRenderer;\n")).toEqual([]);
    expect(await layeringMessages('main/preload.ts', "import { BRIDGE_CHANNELS } from '../core/bridge.ts';\nexport const c = BRIDGE_CHANNELS;\n")).toHaveLength(1);
    expect(await layeringMessages('main/preload.ts', "import fs from 'node:fs';\nexport const c = fs;\n")).toHaveLength(1);
  });
});
