// The meridian-ledger command as a user runs it: the real bin through Node, no build step.
import { spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';

function run(args: string[], input = '') {
  const result = spawnSync(process.execPath, ['main/cli/bin.mjs', ...args], { input, encoding: 'utf8' });
  return { code: result.status, stdout: result.stdout, stderr: result.stderr };
}

describe('meridian-ledger', () => {
  it('--version prints the package version', () => {
    const { version } = JSON.parse(readFileSync('package.json', 'utf8')) as { version: string };
    expect(run(['--version'])).toMatchObject({ code: 0, stdout: `${version}\n` });
  });
  it('--help lists the usage', () => {
    const result = run(['--help']);
    expect(result.code).toBe(0);
    expect(result.stdout).toMatch(/Usage: meridian-ledger <command>/);
  });
  it('an unknown command exits 2 with a message naming it', () => {
    const result = run(['frobnicate']);
    expect(result.code).toBe(2);
    expect(result.stderr).toMatch(/unknown command "frobnicate"/);
  });
  it('an unknown option exits 2', () => {
    const result = run(['--frob']);
    expect(result.code).toBe(2);
    expect(result.stderr).toMatch(/unknown option "--frob"/);
  });
});
