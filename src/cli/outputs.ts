/**
 * Output paths are checked before any work starts, so that a typo or an unwritable folder costs
 * seconds, not a whole simulation. Nothing is created by the check: it finds the nearest folder that
 * exists on the way to the target and proves it writable by creating and removing a probe file there
 * (permission bits alone say nothing for root, or on a read-only mount).
 */
import { constants } from 'node:fs';
import { open, rm, stat } from 'node:fs/promises';
import { dirname, join, resolve } from 'node:path';
import { fsReason } from '../run/files.js';
import { UsageError } from './exit.js';

type Kind = 'file' | 'folder';

async function kindOf(path: string): Promise<Kind | 'other' | undefined> {
  try {
    const s = await stat(path);
    return s.isDirectory() ? 'folder' : s.isFile() ? 'file' : 'other';
  } catch (e) {
    // ENOTDIR: a file on the way; the walk up to the nearest existing path finds and names it
    if ((e as NodeJS.ErrnoException).code === 'ENOENT' || (e as NodeJS.ErrnoException).code === 'ENOTDIR') return undefined;
    throw e;
  }
}

/** Creates and removes a probe file in `dir`; returns the reason when that fails. */
async function probe(dir: string): Promise<string | undefined> {
  const p = join(dir, `.tankcheck-probe-${process.pid}-${Math.floor(Math.random() * 1e9)}`);
  try {
    const h = await open(p, constants.O_CREAT | constants.O_EXCL | constants.O_WRONLY);
    await h.close();
    await rm(p, { force: true });
    return undefined;
  } catch (e) {
    return fsReason(e);
  }
}

/** The nearest existing ancestor of `path` (itself included) and what it is. */
async function nearest(path: string): Promise<{ at: string; kind: Kind | 'other' }> {
  let at = resolve(path);
  for (;;) {
    const k = await kindOf(at);
    if (k !== undefined) return { at, kind: k };
    const up = dirname(at);
    if (up === at) return { at, kind: 'folder' };
    at = up;
  }
}

async function check(path: string, want: Kind, flag: string): Promise<void> {
  const what = `${flag} ${path}`;
  const target = await kindOf(path).catch((e: unknown) => { throw new UsageError(`${what}: ${fsReason(e)}`); });
  if (target !== undefined && target !== want) {
    const is = target === 'other' ? 'is not a regular file or folder' : `is a ${target}`;
    throw new UsageError(`${what}: ${is}; ${flag} takes a ${want}`);
  }
  const { at, kind } = await nearest(want === 'folder' && target === 'folder' ? path : dirname(resolve(path)));
  if (kind !== 'folder') throw new UsageError(`${what}: ${at} is a file, not a folder`);
  const why = await probe(at);
  if (why) throw new UsageError(`${what}: cannot write in ${at}: ${why}`);
}

/** Refuses (exit 2) an output folder that is a file, lies under a file, or cannot be written. */
export function checkOutputFolder(path: string, flag: string): Promise<void> {
  return check(path, 'folder', flag);
}

/** Refuses (exit 2) an output file that is a folder, lies under a file, or whose folder cannot be written. */
export function checkOutputFile(path: string, flag: string): Promise<void> {
  return check(path, 'file', flag);
}

/** Why a cache folder cannot be used, or undefined when it can (it may not exist yet). */
export async function cacheProblem(path: string): Promise<{ fatal: boolean; reason: string } | undefined> {
  const target = await kindOf(path).catch(() => 'other' as const);
  if (target !== undefined && target !== 'folder') return { fatal: true, reason: `--cache-dir ${path}: is a ${target === 'file' ? 'file' : 'special file'}, not a folder` };
  const { at, kind } = await nearest(target === 'folder' ? path : dirname(resolve(path)));
  if (kind !== 'folder') return { fatal: true, reason: `--cache-dir ${path}: ${at} is a file, not a folder` };
  const why = await probe(at);
  return why ? { fatal: false, reason: `cache ${path} cannot be written (${why}); corners are simulated without it` } : undefined;
}
