/**
 * Case 6: peak resident memory of the embedded engine. Each measurement runs in a fresh child
 * process (bench/memory-child.ts): the process RSS (worker threads included) is sampled every
 * 50 ms while runStudy runs the design on a new wasm engine with 1 worker, then with 2 workers when
 * free memory allows; the figure is (peak - RSS just before the engine is created) / workers.
 */
import { spawn } from 'node:child_process';
import { freemem } from 'node:os';
import { fileURLToPath } from 'node:url';
import type { BenchDesign } from './settling.js';
import { log, MB } from './util.js';

export interface MemoryRow {
  workers: number;
  preMB: number;
  peakMB: number;
  perWorkerMB: number;
  /** Wall time of the study, worker start included, ms. */
  wallMs: number;
  corners: number;
  failed: number;
}

export interface MemoryCase {
  design: string;
  rows: MemoryRow[];
  /** Why the 2-worker run was skipped, if it was. */
  skipped?: string;
}

/** Free memory needed before the 2-worker run, bytes. */
const TWO_WORKER_FREE = 2 * 1024 ** 3;
const ROOT = fileURLToPath(new URL('..', import.meta.url));
const CHILD = fileURLToPath(new URL('./memory-child.ts', import.meta.url));

function runChild(workers: number, designFile: string): Promise<MemoryRow> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, ['--import', 'tsx', CHILD, String(workers), designFile],
      { cwd: ROOT, stdio: ['ignore', 'pipe', 'inherit'] });
    let out = '';
    child.stdout.setEncoding('utf8').on('data', (s: string) => { out += s; });
    child.on('error', reject);
    child.on('close', (code) => {
      if (code !== 0) return reject(new Error(`memory child (${workers} workers) exited with ${code}`));
      try {
        resolve(JSON.parse(out.trim().split('\n').pop()!) as MemoryRow);
      } catch (e) {
        reject(new Error(`memory child printed no result: ${out.slice(0, 200)} (${String(e)})`));
      }
    });
  });
}

async function measureWorkers(d: BenchDesign, workers: number): Promise<MemoryRow> {
  const row = await runChild(workers, fileURLToPath(new URL(`../${d.file}`, import.meta.url)));
  log(`memory ${d.key}, ${workers} wasm worker(s): RSS ${row.preMB.toFixed(0)} -> peak ${row.peakMB.toFixed(0)} MB, ` +
    `${row.perWorkerMB.toFixed(0)} MB per worker, ${row.wallMs.toFixed(0)} ms, ${row.failed} failed corners`);
  return row;
}

export async function measureMemory(d: BenchDesign): Promise<MemoryCase> {
  const rows = [await measureWorkers(d, 1)];
  const free = freemem();
  if (free < TWO_WORKER_FREE) {
    return { design: d.key, rows, skipped: `free memory ${(free / MB).toFixed(0)} MB < ${(TWO_WORKER_FREE / MB).toFixed(0)} MB` };
  }
  rows.push(await measureWorkers(d, 2));
  return { design: d.key, rows };
}
