/**
 * Runs one design file through `tankcheck fha` and `tankcheck run` in-process and checks the
 * contract for a file that must be refused: exit code 2, every problem as `file:line:column: path:
 * message`, the "nothing was written" trailer, no output file or folder created, bounded time and
 * bounded message size.
 */
import { existsSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { expect } from 'vitest';
import { runCli } from '../../support/cli.js';

export interface Targets {
  json: string;
  csv: string;
  out: string;
  html: string;
  cache: string;
  decks: string;
}

export function targetsIn(dir: string): Targets {
  return { json: join(dir, 'r.json'), csv: join(dir, 'r.csv'), out: join(dir, 'out'), html: join(dir, 'r.html'), cache: join(dir, 'cache'), decks: join(dir, 'decks') };
}

/** Upper bound on one CLI call for a refused file, ms (parse only; generous for a loaded CI machine). */
export const CASE_LIMIT_MS = 3000;

export interface Refusal {
  stderr: string;
  ms: number;
}

/** Writes `content` to `file`, runs fha and run on it, asserts the refusal contract; returns fha's stderr. */
export async function expectRefused(file: string, content: string | Uint8Array, t: Targets, opts: { alsoRun?: boolean } = {}): Promise<Refusal> {
  writeFileSync(file, content);
  const t0 = performance.now();
  const fha = await runCli(['fha', file, '--json', t.json, '--csv', t.csv]);
  const ms = performance.now() - t0;
  expect(fha.code, fha.stderr.slice(0, 2000)).toBe(2);
  expect(fha.stdout).toBe('');
  expect(fha.stderr).toContain(`${file}: `);
  expect(fha.stderr).toMatch(/problem\(s\); nothing was written\.\n$/);
  // messages quote at most a short excerpt of what was written, however long the input
  expect(fha.stderr.length).toBeLessThan(40_000);
  expect(existsSync(t.json) || existsSync(t.csv)).toBe(false);
  if (opts.alsoRun !== false) {
    const run = await runCli(['run', file, '--engine', 'ngspice', '--out', t.out, '--html', t.html, '--cache-dir', t.cache]);
    expect(run.code).toBe(2);
    expect(run.stderr).toBe(fha.stderr);
    expect(existsSync(t.out) || existsSync(t.html) || existsSync(t.cache)).toBe(false);
  }
  expect(ms).toBeLessThan(CASE_LIMIT_MS);
  return { stderr: fha.stderr, ms };
}

/** Lines of stderr that carry a position: `file:line:column: ...` with line >= 1. */
export function positioned(stderr: string, file: string): string[] {
  return stderr.split('\n').filter((l) => l.startsWith(`${file}:`) && /^:[1-9]\d*:\d+: /.test(l.slice(file.length)));
}

export function cleanTargets(t: Targets): void {
  for (const p of Object.values(t)) rmSync(p, { recursive: true, force: true });
}

export const escapeRe = (s: string): string => s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
