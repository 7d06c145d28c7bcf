import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseDocument } from 'yaml';
import { KIND_NOUN, UNIT_SYMBOL } from '../units/index.js';
import { OPERATING_FIELDS, SECTION_FIELDS, type FieldSpec } from './fields.js';
import { parseDesign } from './parse.js';

const demo = readFileSync(new URL('../../examples/demo.yaml', import.meta.url), 'utf8');

/** The demo with one value replaced (sections that the demo leaves out are created). */
function withValue(path: string[], value: unknown): ReturnType<typeof parseDesign> {
  const doc = parseDocument(demo);
  doc.setIn(path, value);
  return parseDesign(doc.toString(), 'd.yaml');
}

const quantityFields = [
  ...Object.entries(SECTION_FIELDS).flatMap(([section, fields]) =>
    Object.entries(fields as Record<string, FieldSpec>).map(([key, spec]) => [section, key, spec] as const)),
  ...Object.entries(OPERATING_FIELDS).map(([key, spec]) => ['operating', key, spec] as const),
].filter(([, , spec]) => spec.kind === 'quantity') as [string, string, Extract<FieldSpec, { kind: 'quantity' }>][];

describe('every quantity field', () => {
  it.each(quantityFields)('%s.%s refuses a value with the wrong unit and names the expected one', (section, key, spec) => {
    const wrong = spec.unit === 'henry' ? '5 V' : '5 H';
    const r = withValue([section, key], wrong);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    const p = r.problems.find((x) => x.path === `${section}.${key}`);
    expect(p?.code).toBe('value');
    const noun = spec.unit === 'ratio' ? 'a fraction' : spec.unit === 'number' ? 'number' : `${KIND_NOUN[spec.unit]} > 0 ${UNIT_SYMBOL[spec.unit]}`;
    expect(p?.expected).toContain(noun.replace('> 0', spec.sign === 'positive' ? '> 0' : '>= 0'));
  });
  it.each(quantityFields)('%s.%s refuses NaN, Infinity and negative values', (section, key) => {
    for (const bad of ['NaN', '.inf', '-.inf', '-5']) {
      const r = withValue([section, key], parseDocument(`v: ${bad}`).get('v', true));
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r.problems.map((p) => p.path)).toContain(`${section}.${key}`);
    }
  });
  it.each(quantityFields.filter(([, , s]) => s.default !== undefined))('%s.%s defaults to its documented value', (section, key, spec) => {
    const doc = parseDocument(demo);
    if (doc.hasIn([section, key])) doc.deleteIn([section, key]);
    const r = parseDesign(doc.toString(), 'd.yaml');
    expect(r.ok && (r.design as unknown as Record<string, Record<string, number>>)[section][key]).toBe(spec.default);
  });
});
