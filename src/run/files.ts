import { mkdir, rename, writeFile, rm } from 'node:fs/promises';
import { dirname, resolve, relative, isAbsolute, join } from 'node:path';

/**
 * Write files atomically: each goes to a temporary sibling first and is renamed into place, so a
 * reader never sees a half-written file. All are written before any is renamed; on error the
 * temporaries are removed and no target is touched.
 */
export async function writeFilesAtomic(files: { path: string; text: string }[]): Promise<void> {
  const temps: string[] = [];
  try {
    for (const f of files) {
      await mkdir(dirname(f.path), { recursive: true });
      const tmp = `${f.path}.tmp-${process.pid}-${temps.length}`;
      temps.push(tmp);
      await writeFile(tmp, f.text);
    }
    for (const [i, f] of files.entries()) await rename(temps[i]!, f.path);
  } catch (e) {
    await Promise.all(temps.map((t) => rm(t, { force: true })));
    throw e;
  }
}

/** Path of `name` inside `dir`; refuses names that would escape it (corner ids are already safe). */
export function insideDir(dir: string, name: string): string {
  const p = resolve(dir, name);
  const rel = relative(resolve(dir), p);
  if (rel.startsWith('..') || isAbsolute(rel) || rel === '') throw new Error(`refusing to write outside ${dir}: ${name}`);
  return join(dir, rel);
}
