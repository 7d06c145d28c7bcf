import { OPTIONAL_SECTIONS, SECTION_FIELDS, type FieldSpec, type SectionName } from './fields.js';
import type { Entry, Reader } from './reader.js';
import { readBool, readEnum, readQuantity } from './values.js';

/** A section's values as read; a field is undefined when it had a problem (already reported). */
export type SectionValues = Record<string, number | string | boolean | undefined>;

/** Read one field of a spec table; absent fields take their default or are reported missing. */
export function readField(r: Reader, fields: Map<string, Entry>, key: string, spec: FieldSpec, path: string, parent: Entry): number | string | boolean | undefined {
  const e = fields.get(key);
  if (!e) {
    if (spec.default !== undefined) return spec.default;
    r.problem('error', 'missing', path, parent.keyLoc, `missing required key "${key}"`, { expected: key });
    return undefined;
  }
  if (spec.kind === 'quantity') return readQuantity(r, e, path, spec);
  if (spec.kind === 'enum') return readEnum(r, e, path, spec);
  return readBool(r, e, path, spec);
}

/** Defaults of a section that was left out. */
function defaults(name: SectionName): SectionValues {
  const out: SectionValues = {};
  for (const [key, spec] of Object.entries(SECTION_FIELDS[name] as Record<string, FieldSpec>)) out[key] = spec.default;
  return out;
}

/**
 * Read a section made only of leaf fields (topology, tank, switches, rectifier, output,
 * tolerances, compare, simulation). Returns undefined when the section is unusable.
 */
export function readSection(r: Reader, root: Map<string, Entry>, name: SectionName, rootEntry: Entry): SectionValues | undefined {
  const fields = SECTION_FIELDS[name] as Record<string, FieldSpec>;
  const e = root.get(name);
  if (!e) {
    if (OPTIONAL_SECTIONS.includes(name)) return defaults(name);
    r.problem('error', 'missing', name, rootEntry.keyLoc, `missing required section "${name}"`, { expected: name });
    return undefined;
  }
  const map = r.map(e.node, name, e.loc, Object.keys(fields), `a mapping with keys ${Object.keys(fields).join(', ')}`);
  if (!map) return undefined;
  const out: SectionValues = {};
  for (const [key, spec] of Object.entries(fields)) out[key] = readField(r, map, key, spec, `${name}.${key}`, e);
  return out;
}
