import { constants } from 'node:fs';
import { open } from 'node:fs/promises';
import { dirname, isAbsolute, join, resolve } from 'node:path';
import type { Design, DeviceModel } from './types.js';
import { filterModelText } from './filterModel.js';
import { parseDesign, type ParseDesignResult } from './parse.js';
import { formatProblem, type Problem } from './problem.js';
import type { Loc } from './reader.js';
import { decodeUtf8 } from './utf8.js';

/** Largest design or model file read, in bytes. @default 1 MB */
export const MAX_FILE_BYTES = 1_000_000;

/** Thrown by `loadDesignOrThrow`; `message` lists every problem as `file:line:column: path: message`. */
export class DesignError extends Error {
  override readonly name = 'DesignError';
  constructor(
    readonly file: string,
    readonly problems: Problem[],
  ) {
    super(problems.map((p) => formatProblem(p, file)).join('\n'));
  }
}

const problem = (code: Problem['code'], path: string, message: string, extra: Partial<Problem> = {}): Problem =>
  ({ code, path, line: 0, column: 0, expected: '', received: '', message, ...extra });

/**
 * Read at most `max` bytes (one more to detect oversize) without trusting the reported file size.
 * Only a regular file is read. The open is non-blocking so that a FIFO (given as the design file, or
 * named by a design as a model file) cannot stall the loader waiting for a writer.
 */
async function readCapped(path: string, max: number, what: 'design' | 'model'): Promise<{ bytes: Uint8Array } | { error: string }> {
  let handle;
  try {
    handle = await open(path, constants.O_RDONLY | (constants.O_NONBLOCK ?? 0));
    const st = await handle.stat();
    if (what === 'design' && st.isDirectory()) return { error: 'this is a directory, not a file' };
    if (!st.isFile()) return { error: 'is not a regular file (a device, pipe or socket cannot be read as a design or model file)' };
    const buf = new Uint8Array(max + 1);
    let n = 0;
    while (n < buf.length) {
      const { bytesRead } = await handle.read(buf, n, buf.length - n, null);
      if (bytesRead === 0) break;
      n += bytesRead;
    }
    if (n > max) return { error: `the file is larger than ${max} bytes` };
    return { bytes: buf.subarray(0, n) };
  } catch (err) {
    const code = (err as NodeJS.ErrnoException).code;
    return { error: code === 'ENOENT' ? 'the file does not exist' : code === 'EISDIR' ? 'this is a directory, not a file' : `cannot be read (${code ?? String(err)})` };
  } finally {
    await handle?.close();
  }
}

/** Read one device model file relative to the design file and pass it through the line filter. */
async function loadModel(designPath: string, key: string, model: DeviceModel, at?: Loc): Promise<{ model?: DeviceModel; problems: Problem[] }> {
  const path = `devices.${key}.file`;
  // shown in problems: relative to where the design path is relative to (usually the working directory)
  const shown = isAbsolute(model.file) ? model.file : join(dirname(designPath), model.file);
  const read = await readCapped(resolve(shown), MAX_FILE_BYTES, 'model');
  // an unreadable model file is a problem of the design file's line that names it
  if ('error' in read) {
    const where = shown === model.file ? '' : ` (looked for ${shown})`;
    return { problems: [problem('io', path, `model file "${model.file}"${where}: ${read.error}`, at ?? {})] };
  }
  // latin1 keeps one character per byte, so the filter can name any non-ASCII byte exactly
  const filtered = filterModelText(Buffer.from(read.bytes).toString('latin1'), shown, path);
  if (!filtered.ok) return { problems: filtered.problems };
  if (!filtered.names.some((n) => n.toLowerCase() === model.name.toLowerCase())) {
    return { problems: [problem('model', `devices.${key}.name`, `"${model.name}" is not defined by a .model or .subckt line in "${model.file}" (found: ${filtered.names.join(', ')})`, { file: shown })] };
  }
  return { model: { ...model, text: filtered.text }, problems: [] };
}

/**
 * Load a design file: the only place that reads the file system for designs. Reads at most
 * 1 MB, refuses non-UTF-8 bytes (with line and column), parses with `parseDesign`, then reads
 * each device model file (relative to the design file) through `filterModelText` and attaches
 * its text. Never throws for problems in the files; they come back as `problems`.
 */
export async function loadDesign(path: string): Promise<ParseDesignResult> {
  const read = await readCapped(path, MAX_FILE_BYTES, 'design');
  if ('error' in read) return { ok: false, problems: [problem(read.error.includes('larger') ? 'too-large' : 'io', '', read.error)] };
  const decoded = decodeUtf8(read.bytes);
  if (!decoded.ok) {
    const hex = decoded.byte.toString(16).toUpperCase().padStart(2, '0');
    return { ok: false, problems: [problem('encoding', '', `byte 0x${hex} is not valid UTF-8; save the design file as UTF-8`, { line: decoded.line, column: decoded.column, expected: 'UTF-8 text', received: `0x${hex}` })] };
  }
  const parsed = parseDesign(decoded.text, path);
  if (!parsed.ok) return parsed;
  const devices: Design['devices'] = {};
  const problems: Problem[] = [];
  for (const key of ['diodeModel', 'switchModel'] as const) {
    const model = parsed.design.devices[key];
    if (!model) continue;
    const got = await loadModel(path, key, model, parsed.modelFileAt?.[key]);
    problems.push(...got.problems);
    if (got.model) devices[key] = got.model;
  }
  if (problems.length > 0) return { ok: false, problems };
  return { ok: true, design: { ...parsed.design, devices }, warnings: parsed.warnings, modelFileAt: parsed.modelFileAt };
}

/** `loadDesign`, throwing a DesignError (with every problem) instead of returning them. */
export async function loadDesignOrThrow(path: string): Promise<{ design: Design; warnings: Problem[] }> {
  const result = await loadDesign(path);
  if (!result.ok) throw new DesignError(path, result.problems);
  return { design: result.design, warnings: result.warnings };
}
