/**
 * Process checks for the hardening tests (Linux /proc). An ngspice process belongs to a test when its
 * working directory lies under the test's private temp root: the native engine runs every job with
 * cwd = a fresh folder under os.tmpdir(), and the tests point TMPDIR at their own root.
 */
import { readdirSync, readFileSync, readlinkSync } from 'node:fs';

export interface ProcInfo {
  pid: number;
  comm: string;
  cwd: string;
  state: string;
}

function info(pid: number): ProcInfo | undefined {
  try {
    const comm = readFileSync(`/proc/${pid}/comm`, 'utf8').trim();
    const state = /^State:\s+(\S)/m.exec(readFileSync(`/proc/${pid}/status`, 'utf8'))?.[1] ?? '?';
    let cwd = '';
    try {
      cwd = readlinkSync(`/proc/${pid}/cwd`);
    } catch {
      // zombie or gone
    }
    return { pid, comm, cwd, state };
  } catch {
    return undefined;
  }
}

/** Live (not zombie) processes named ngspice whose cwd is under `root`. */
export function ngspiceUnder(root: string): ProcInfo[] {
  const out: ProcInfo[] = [];
  for (const name of readdirSync('/proc')) {
    if (!/^\d+$/.test(name)) continue;
    const p = info(Number(name));
    if (p && p.comm === 'ngspice' && p.state !== 'Z' && p.cwd.startsWith(root)) out.push(p);
  }
  return out;
}

/** True while the pid names a live (not zombie) process. */
export function alive(pid: number): boolean {
  const p = info(pid);
  return p !== undefined && p.state !== 'Z';
}

/** Live direct children of `pid` (any name). */
export function childrenOf(pid: number): ProcInfo[] {
  const out: ProcInfo[] = [];
  for (const name of readdirSync('/proc')) {
    if (!/^\d+$/.test(name)) continue;
    try {
      const ppid = Number(/^PPid:\s+(\d+)/m.exec(readFileSync(`/proc/${name}/status`, 'utf8'))?.[1]);
      if (ppid !== pid) continue;
    } catch {
      continue;
    }
    const p = info(Number(name));
    if (p && p.state !== 'Z') out.push(p);
  }
  return out;
}

/** Waits until `check` returns true, polling every 50 ms, for at most `ms`; returns the last result. */
export async function waitFor(check: () => boolean, ms: number): Promise<boolean> {
  const t0 = Date.now();
  for (;;) {
    if (check()) return true;
    if (Date.now() - t0 > ms) return false;
    await new Promise((r) => setTimeout(r, 50));
  }
}
