import { chmodSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { spawnSync } from 'node:child_process';
import { afterAll, describe, expect, it } from 'vitest';
import { findCommand, missingLine, missingPackages } from '../../scripts/system-packages.mjs';
import { REPO_ROOT } from '../support/shared.js';

const dir = mkdtempSync(join(tmpdir(), 'tankcheck-syspkg-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
function fakeCommand(name: string): void {
  writeFileSync(join(dir, name), '#!/bin/sh\nexit 0\n');
  chmodSync(join(dir, name), 0o755);
}

describe('system packages the engine tier needs', () => {
  it('finds executables on PATH only', () => {
    expect(findCommand('ngspice', dir)).toBeNull();
    fakeCommand('ngspice');
    expect(findCommand('ngspice', `/nonexistent:${dir}`)).toBe(join(dir, 'ngspice'));
    expect(missingPackages(dir).map((m) => m.pkg)).toEqual(['chromium']);
    fakeCommand('chromium');
    expect(missingPackages(dir)).toEqual([]);
    expect(missingLine([])).toBe('');
  });

  it('names the Debian packages to install in one line', () => {
    const line = missingLine(missingPackages('/nonexistent'));
    expect(line).toContain('apt-get install -y ngspice chromium');
    expect(line).not.toContain('\n');
  });

  it('--check fails with exactly one line when a package is missing', () => {
    const r = spawnSync(process.execPath, [join(REPO_ROOT, 'scripts', 'system-packages.mjs'), '--check'], { env: { PATH: '/nonexistent' }, encoding: 'utf8' });
    expect(r.status).toBe(1);
    expect(r.stdout).toBe('');
    expect(r.stderr.trimEnd().split('\n')).toHaveLength(1);
    expect(r.stderr).toMatch(/apt-get install -y ngspice chromium/);
  });
});

describe('the one test command', () => {
  it('README and .ci/run run the same line, and npm test covers typecheck, unit and engine tiers', () => {
    const line = 'npm run system-packages && npm ci && npm test';
    expect(readFileSync(join(REPO_ROOT, 'README.md'), 'utf8').split('\n')).toContain(line);
    expect(readFileSync(join(REPO_ROOT, '.ci', 'run'), 'utf8').split('\n')).toContain(line);
    const scripts = (JSON.parse(readFileSync(join(REPO_ROOT, 'package.json'), 'utf8')) as { scripts: Record<string, string> }).scripts;
    expect(scripts['test']).toBe('npm run typecheck && vitest run --project unit --project engine');
    expect(Object.keys(scripts)).toEqual(expect.arrayContaining(['test:unit', 'test:engine', 'test:heavy', 'system-packages']));
  });
});
