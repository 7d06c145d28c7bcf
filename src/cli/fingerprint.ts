import { createHash } from 'node:crypto';
import type { Design } from '../design/types.js';
import type { MeasuredPoint } from '../measured/index.js';
import { TOOL_VERSION } from '../version.js';

/** JSON with object keys sorted at every level, so equal content gives equal text. */
export function stableJson(v: unknown): string {
  if (Array.isArray(v)) return `[${v.map((x) => (x === undefined ? 'null' : stableJson(x))).join(',')}]`;
  if (v && typeof v === 'object') {
    const keys = Object.keys(v).filter((k) => (v as Record<string, unknown>)[k] !== undefined).sort();
    return `{${keys.map((k) => `${JSON.stringify(k)}:${stableJson((v as Record<string, unknown>)[k])}`).join(',')}}`;
  }
  return JSON.stringify(v) ?? 'null';
}

/**
 * Fingerprint of a study for shards (hex SHA-256): the validated design content (without the file
 * name, so a design copied elsewhere is the same study), the engine name and version, the tool
 * version and the settings that shape the plan (--only, the measured points). Parts of one study
 * carry the same fingerprint; `merge` refuses parts whose fingerprints differ.
 */
export function studyFingerprint(design: Design, engine: { name: string; version: string },
  settings: { only?: string; measured?: readonly MeasuredPoint[] }): string {
  const { file: _file, ...content } = design as Design & { file?: string };
  return createHash('sha256').update(stableJson({
    design: content, engine, tool: TOOL_VERSION, only: settings.only ?? null, measured: settings.measured ?? null,
  })).digest('hex');
}
