import { parseMeasured, type MeasuredPoint } from '../measured/index.js';
import { UsageError } from './exit.js';
import { readRegularFile } from '../run/files.js';

/** Largest measured-points file read, bytes: far above any bench log, it bounds a wrong file. */
export const MAX_MEASURED_BYTES = 32 * 1024 * 1024;

/**
 * Read and check a measured-points file (`run --measured`). Every bad cell goes to stderr as
 * `file:line:column: column name: message`; any problem ends the command with exit 2 before
 * anything is simulated or written.
 */
export async function loadMeasured(file: string): Promise<{ file: string; points: MeasuredPoint[] }> {
  // one non-blocking open, type and size checked on the handle: a pipe or a swapped file is refused
  const read = await readRegularFile(file, MAX_MEASURED_BYTES);
  if ('error' in read) throw new UsageError(`${file}: cannot read the measured-points file: ${read.error}`);
  const r = parseMeasured(read.text);
  if (!r.ok) {
    for (const p of r.problems) process.stderr.write(`${file}:${p.line}:${p.column}: ${p.field ? `${p.field}: ` : ''}${p.message}\n`);
    throw new UsageError(`${file}: ${r.problems.length} problem(s) in the measured points; nothing was simulated or written`);
  }
  return { file, points: r.points };
}
