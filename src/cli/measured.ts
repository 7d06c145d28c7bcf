import { readFile, stat } from 'node:fs/promises';
import { parseMeasured, type MeasuredPoint } from '../measured/index.js';
import { UsageError } from './exit.js';

/** Largest measured-points file read, bytes: far above any bench log, it bounds a wrong file. */
export const MAX_MEASURED_BYTES = 32 * 1024 * 1024;

/**
 * Read and check a measured-points file (`run --measured`). Every bad cell goes to stderr as
 * `file:line:column: column name: message`; any problem ends the command with exit 2 before
 * anything is simulated or written.
 */
export async function loadMeasured(file: string): Promise<{ file: string; points: MeasuredPoint[] }> {
  const st = await stat(file).catch((e: NodeJS.ErrnoException) => {
    throw new UsageError(`${file}: cannot read the measured-points file (${e.code ?? e.message})`);
  });
  if (!st.isFile()) throw new UsageError(`${file}: the measured-points file must be a regular file`);
  if (st.size > MAX_MEASURED_BYTES) throw new UsageError(`${file}: larger than ${MAX_MEASURED_BYTES / 1024 / 1024} MiB; not a measured-points file`);
  const r = parseMeasured(await readFile(file, 'utf8'));
  if (!r.ok) {
    for (const p of r.problems) process.stderr.write(`${file}:${p.line}:${p.column}: ${p.field ? `${p.field}: ` : ''}${p.message}\n`);
    throw new UsageError(`${file}: ${r.problems.length} problem(s) in the measured points; nothing was simulated or written`);
  }
  return { file, points: r.points };
}
