/** The machine and tool versions the bench ran on (node:os, `ngspice -v`, the wasm engine package). */
import { spawnSync } from 'node:child_process';
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';
import { availableParallelism, arch, cpus, freemem, release, totalmem, type } from 'node:os';
import { MB } from './util.js';

export interface MachineInfo {
  os: string;
  cpu: string;
  cpus: number;
  parallelism: number;
  totalMemMB: number;
  freeMemMB: number;
  node: string;
  /** First non-decoration lines of `ngspice -v`. */
  ngspiceV: string[];
  /** Version field of node_modules/eecircuit-engine/package.json. */
  wasmPackage: string;
}

function ngspiceVersionLines(): string[] {
  const r = spawnSync('ngspice', ['-v'], { encoding: 'utf8', timeout: 15_000, stdio: ['ignore', 'pipe', 'pipe'] });
  if (r.error) return [`(ngspice -v failed: ${r.error.message})`];
  const lines = `${r.stdout}\n${r.stderr}`.split('\n').map((l) => l.replace(/^\*+\s?/, '').trim()).filter((l) => l.length > 0);
  const keep = lines.filter((l) => /^ngspice-|^Creation Date/i.test(l));
  const deb = spawnSync('dpkg-query', ['-W', '-f', '${Version}', 'ngspice'], { encoding: 'utf8', timeout: 15_000 });
  if (!deb.error && deb.status === 0 && deb.stdout) keep.push(`Debian package ${deb.stdout.trim()}`);
  return keep;
}

function wasmPackageVersion(): string {
  try {
    const url = new URL('../node_modules/eecircuit-engine/package.json', import.meta.url);
    return `eecircuit-engine ${(JSON.parse(readFileSync(url, 'utf8')) as { version: string }).version}`;
  } catch (e) {
    return `(eecircuit-engine package.json unreadable: ${e instanceof Error ? e.message : String(e)})`;
  }
}

export function describeMachine(): MachineInfo {
  const c = cpus();
  return {
    os: `${type()} ${release()} ${arch()}`,
    cpu: c[0]?.model ?? 'unknown',
    cpus: c.length,
    parallelism: availableParallelism(),
    totalMemMB: Math.round(totalmem() / MB),
    freeMemMB: Math.round(freemem() / MB),
    node: process.version,
    ngspiceV: ngspiceVersionLines(),
    wasmPackage: wasmPackageVersion(),
  };
}

/** Source files under src/ (tests aside) modified after `sinceMs` (epoch ms), relative paths. */
export function sourcesChangedSince(sinceMs: number): string[] {
  const root = fileURLToPath(new URL('../src/', import.meta.url));
  const out: string[] = [];
  const walk = (dir: string) => {
    for (const e of readdirSync(dir, { withFileTypes: true })) {
      const p = join(dir, e.name);
      if (e.isDirectory()) walk(p);
      else if (/\.(ts|mjs|js)$/.test(e.name) && !/\.test\.ts$|test-support/.test(e.name) && statSync(p).mtimeMs > sinceMs) out.push(relative(root, p));
    }
  };
  walk(root);
  return out.sort();
}
