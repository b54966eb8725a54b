// Payload validation and the app-scheme file server: what the renderer sends is untrusted.
import { mkdtemp, writeFile } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { resolveAppFile, serveAppRequest } from '../../main/electron/app-protocol.ts';
import { CONTENT_SECURITY_POLICY } from '../../main/electron/security-policy.ts';
import { PayloadError, parseBackupRequest, parseOpenFileRequest, parseSaveFileRequest, safeFileName } from '../../main/electron/validate-payload.ts';

describe('payload validation', () => {
  it('parseOpenFileRequest(valid) returns the request', () => {
    const request = parseOpenFileRequest({ title: 'Open log', filters: [{ label: 'CSV', extensions: ['csv'] }], multiple: false });
    expect(request.filters[0].extensions).toEqual(['csv']);
  });
  it('parseOpenFileRequest names the bad field', () => {
    expect(() => parseOpenFileRequest({ title: 'x', filters: [], multiple: 'yes' })).toThrow(/openFiles\.multiple/);
    expect(() => parseOpenFileRequest({ title: 'x', filters: [{ label: 'a', extensions: ['c/sv'] }], multiple: true })).toThrow(/extensions\[0\]/);
  });
  it('safeFileName refuses paths and parent references', () => {
    for (const bad of ['../x.csv', '/etc/passwd', 'a/b', 'a\\b', '', '.hidden', 'x..y']) {
      expect(() => safeFileName(bad, 'name'), bad).toThrow(PayloadError);
    }
    expect(safeFileName('archive 2026-12-01.mlbundle', 'name')).toBe('archive 2026-12-01.mlbundle');
  });
  it('parseSaveFileRequest requires bytes', () => {
    expect(() => parseSaveFileRequest({ title: 't', suggestedName: 'a.csv', filters: [], bytes: 'text' })).toThrow(/saveFile\.bytes/);
  });
  it('parseBackupRequest bounds keepNewest', () => {
    const base = { fileName: 'a.mlbundle', bytes: new Uint8Array(2) };
    expect(parseBackupRequest({ ...base, keepNewest: 7 }).keepNewest).toBe(7);
    expect(() => parseBackupRequest({ ...base, keepNewest: 0 })).toThrow(/keepNewest/);
    expect(() => parseBackupRequest({ ...base, keepNewest: 2.5 })).toThrow(/keepNewest/);
  });
});

describe('app scheme', () => {
  it('resolveAppFile keeps requests inside the renderer folder', () => {
    const root = '/srv/renderer';
    expect(resolveAppFile('ledger://app/index.html', root)).toBe('/srv/renderer/index.html');
    expect(resolveAppFile('ledger://app/', root)).toBe('/srv/renderer/index.html');
    expect(resolveAppFile('ledger://app/assets/a.js', root)).toBe('/srv/renderer/assets/a.js');
    // The URL parser folds "%2e%2e" segments itself, so this stays inside the root.
    expect(resolveAppFile('ledger://app/%2e%2e/%2e%2e/etc/passwd', root)).toBe('/srv/renderer/etc/passwd');
    expect(resolveAppFile('ledger://app/..%2F..%2Fetc%2Fpasswd', root)).toBeNull();
    expect(resolveAppFile('ledger://other/index.html', root)).toBeNull();
    expect(resolveAppFile('https://app/index.html', root)).toBeNull();
  });
  it('serveAppRequest sends the strict CSP with every file', async () => {
    const root = await mkdtemp(path.join(os.tmpdir(), 'ml-proto-'));
    await writeFile(path.join(root, 'index.html'), '<!doctype html><title>t</title>');
    const foreign = await serveAppRequest(new Request('http://placeholder/index.html'), root);
    expect(foreign.status).toBe(404);
    const ok = await serveAppRequest({ url: 'ledger://app/index.html' } as Request, root);
    expect(ok.status).toBe(200);
    expect(ok.headers.get('Content-Security-Policy')).toBe(CONTENT_SECURITY_POLICY);
    expect(ok.headers.get('Content-Type')).toMatch(/text\/html/);
    expect(CONTENT_SECURITY_POLICY).toMatch(/script-src 'self'(;|$)/);
    expect(CONTENT_SECURITY_POLICY).not.toMatch(/https?:|\*|unsafe-eval/);
  });
});
