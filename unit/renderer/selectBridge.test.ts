import { describe, expect, test } from 'vitest';
import { selectBridge } from '../../renderer/bridge/selectBridge.ts';
import { acceptAttribute } from '../../renderer/bridge/pickFiles.ts';
import { BROWSER_HAS_NO_BACKUP_FOLDER } from '../../renderer/bridge/browserBridge.ts';
import { BRIDGE_GLOBAL_NAME, type ShellBridge } from '../../core/bridge.ts';

function fakeElectronBridge(): ShellBridge {
  const cancelled = async () => ({ kind: 'cancelled' as const });
  return {
    info: async () => ({ shell: 'electron', appVersion: '9.9.9', automaticBackups: true }),
    openFiles: cancelled, saveFile: cancelled, writeBackup: cancelled,
    listBackups: async () => ({ kind: 'ok', value: [] }), readBackup: cancelled, printReport: cancelled,
  };
}

describe('selectBridge(host, appVersion)', () => {
  test('without the preload object it returns the browser bridge', async () => {
    const bridge = selectBridge({}, '0.1.0');
    expect(await bridge.info()).toEqual({ shell: 'browser', appVersion: '0.1.0', automaticBackups: false });
    expect(await bridge.listBackups()).toEqual({ kind: 'failed', message: BROWSER_HAS_NO_BACKUP_FOLDER });
    expect(await bridge.readBackup('x.mlbundle')).toEqual({ kind: 'failed', message: BROWSER_HAS_NO_BACKUP_FOLDER });
  });

  test(`with a complete window.${BRIDGE_GLOBAL_NAME} it returns that object`, () => {
    const electron = fakeElectronBridge();
    expect(selectBridge({ [BRIDGE_GLOBAL_NAME]: electron }, '0.1.0')).toBe(electron);
  });

  test('a partial preload object is refused with the missing methods named', () => {
    const { printReport: _dropped, ...partial } = fakeElectronBridge();
    expect(() => selectBridge({ [BRIDGE_GLOBAL_NAME]: partial }, '0.1.0')).toThrow(/lacks printReport: the preload/);
  });
});

describe('acceptAttribute(request)', () => {
  test('joins every filter extension with a leading dot', () => {
    const request = {
      title: 'Open', multiple: false,
      filters: [{ label: 'Tables', extensions: ['csv', 'tsv'] }, { label: 'Bundles', extensions: ['mlbundle'] }],
    };
    expect(acceptAttribute(request)).toBe('.csv,.tsv,.mlbundle');
  });
});
