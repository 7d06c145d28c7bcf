import type { DeviceModel } from './types.js';
import { quote } from './problem.js';
import type { Entry, Reader } from './reader.js';

export const NAME_MAX = 80;
export const NAME_PATTERN = '^[A-Za-z0-9 _.-]{1,80}$';
export const MODEL_NAME_PATTERN = '^[A-Za-z0-9_]{1,64}$';
export const MODEL_FILE_MAX = 1024;
export const DEVICE_KEYS = ['diodeModel', 'switchModel'] as const;

/** Describe the first character a name may not contain, e.g. `a line break`, `control character U+0007`. */
function offender(text: string, allowed: RegExp): string | undefined {
  for (const ch of text) {
    if (allowed.test(ch)) continue;
    const code = ch.codePointAt(0) ?? 0;
    const u = `U+${code.toString(16).toUpperCase().padStart(4, '0')}`;
    if (ch === '\n' || ch === '\r') return 'a line break';
    if (code < 0x20 || (code >= 0x7f && code <= 0x9f)) return `control character ${u}`;
    return `the character "${ch}" (${u})`;
  }
  return undefined;
}

/**
 * Read the design name: 1 to 80 characters from [A-Za-z0-9 _.-], surrounding spaces trimmed.
 * It ends up in report titles and file names, so anything else is refused rather than rewritten.
 */
export function readName(r: Reader, e: Entry | undefined, at: Entry): string | undefined {
  const expected = `a name of 1 to ${NAME_MAX} characters from letters, digits, space, "_", "." and "-"`;
  if (!e) {
    r.problem('error', 'missing', 'name', at.keyLoc, 'missing required key "name"', { expected: 'name' });
    return undefined;
  }
  const raw = r.text(e.node);
  if (raw === undefined) {
    r.expected('type', 'name', e.loc, expected, r.describe(e.node));
    return undefined;
  }
  const text = raw.trim();
  const bad = offender(text, /[A-Za-z0-9 _.-]/);
  if (text === '' || text.length > NAME_MAX || bad) {
    const detail = bad ? `contains ${bad}` : text === '' ? 'is empty' : `is ${text.length} characters long`;
    r.expected('value', 'name', e.loc, expected, quote(raw), detail);
    return undefined;
  }
  return text;
}

/** Read `devices` (optional): each entry names a model file and the model or subcircuit to use. */
export function readDevices(r: Reader, root: Map<string, Entry>): { diodeModel?: DeviceModel; switchModel?: DeviceModel } {
  const e = root.get('devices');
  const out: { diodeModel?: DeviceModel; switchModel?: DeviceModel } = {};
  if (!e) return out;
  const map = r.map(e.node, 'devices', e.loc, DEVICE_KEYS);
  if (!map) return out;
  for (const key of DEVICE_KEYS) {
    const d = map.get(key);
    if (!d) continue;
    const path = `devices.${key}`;
    const m = r.map(d.node, path, d.loc, ['file', 'name'], 'a mapping with keys file, name');
    if (!m) continue;
    const file = readText(r, m.get('file'), `${path}.file`, d, 'a file path', /[^\u0000-\u001f\u007f]/, MODEL_FILE_MAX);
    const name = readText(r, m.get('name'), `${path}.name`, d, 'a model or subcircuit name from letters, digits and "_"', /[A-Za-z0-9_]/, 64);
    // text is attached by the loader after the line filter; designs built in code set it directly
    if (file !== undefined && name !== undefined) out[key] = { file, name, text: '' };
  }
  return out;
}

function readText(r: Reader, e: Entry | undefined, path: string, parent: Entry, expected: string, allowed: RegExp, max: number): string | undefined {
  if (!e) {
    r.problem('error', 'missing', path, parent.keyLoc, `missing required key "${path.split('.').pop()}"`, { expected: path });
    return undefined;
  }
  const raw = r.text(e.node);
  if (raw === undefined) {
    r.expected('type', path, e.loc, expected, r.describe(e.node));
    return undefined;
  }
  const text = raw.trim();
  const bad = offender(text, allowed);
  if (text === '' || text.length > max || bad) {
    r.expected('value', path, e.loc, expected, quote(raw), bad ? `contains ${bad}` : text === '' ? 'is empty' : `is longer than ${max} characters`);
    return undefined;
  }
  r.seen.set(path, { ...e.loc, text });
  return text;
}
