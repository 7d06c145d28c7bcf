/** The file-reading edge of the results reader: `results/read.ts` checks what these read. */
import type { Results, WaveformExcerpt } from '../results/types.js';
import { readResults, readWaveforms, type ReadResult } from '../results/read.js';
import { readRegularFile } from './files.js';

/** Largest results or waveforms file read, bytes (far above any study a machine can simulate). @default 512 MB */
export const MAX_RESULTS_BYTES = 512 * 1024 * 1024;

async function load<T>(path: string, read: (text: string, file: string) => ReadResult<T>): Promise<ReadResult<T>> {
  const r = await readRegularFile(path, MAX_RESULTS_BYTES);
  if ('error' in r) return { ok: false, problems: [{ code: 'io', path: '', line: 0, column: 0, expected: '', received: '', message: r.error, file: path }] };
  return read(r.text, path);
}

/** Read and check a results file (results.json, a baseline); never throws for a bad or missing file. */
export function loadResultsFile(path: string): Promise<ReadResult<Results>> {
  return load(path, readResults);
}

/** Read and check a waveforms file (waveforms.json); never throws for a bad or missing file. */
export function loadWaveformsFile(path: string): Promise<ReadResult<WaveformExcerpt[]>> {
  return load(path, readWaveforms);
}
