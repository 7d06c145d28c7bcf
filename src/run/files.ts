import { constants } from 'node:fs';
import { mkdir, open, rename, writeFile, rm } from 'node:fs/promises';
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

/**
 * Read a regular file as UTF-8 text, at most `maxBytes`. Anything else (a FIFO, a device, a folder) is
 * refused without blocking on it: the open is non-blocking, and the type is checked before reading.
 */
export async function readRegularFile(path: string, maxBytes: number): Promise<{ text: string } | { error: string }> {
  let handle;
  try {
    handle = await open(path, constants.O_RDONLY | (constants.O_NONBLOCK ?? 0));
    const st = await handle.stat();
    if (st.isDirectory()) return { error: 'is a folder, not a file' };
    if (!st.isFile()) return { error: 'is not a regular file (a pipe, device or socket cannot be read here)' };
    if (st.size > maxBytes) return { error: `is larger than ${maxBytes} bytes` };
    return { text: await handle.readFile('utf8') };
  } catch (err) {
    return { error: fsReason(err) };
  } finally {
    await handle?.close();
  }
}

/** A file-system error in words, with its code (ENOENT, EACCES, ...). */
export function fsReason(err: unknown): string {
  const code = (err as NodeJS.ErrnoException).code;
  const words: Record<string, string> = {
    ENOENT: 'does not exist', EACCES: 'permission denied', EPERM: 'operation not permitted', EISDIR: 'is a folder, not a file',
    ENOTDIR: 'a part of the path is a file, not a folder', EROFS: 'read-only file system', ENOSPC: 'no space left on the device',
    EEXIST: 'already exists', ELOOP: 'too many symbolic links',
  };
  return code && words[code] ? `${words[code]} (${code})` : err instanceof Error ? err.message : String(err);
}
