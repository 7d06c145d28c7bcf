import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parse } from 'yaml';
import { parseQuantity } from '../units/index.js';
import { SECTION_FIELDS } from './fields.js';
import { designJsonSchema } from './jsonSchema.js';
import { DEVICE_KEYS } from './names.js';
import { COMPARE_KEYS } from './compareSection.js';
import { LIMIT_KEYS } from './limits.js';
import { CORNER_KEYS, OPERATING_KEYS } from './operating.js';
import { ROOT_KEYS, parseDesign } from './parse.js';

type S = Record<string, any>;
const demoText = readFileSync(new URL('../../examples/demo.yaml', import.meta.url), 'utf8');

/** Minimal validator for the JSON Schema 2020-12 keywords the design schema uses (a consistency check, not a reference). */
function valid(s: S, v: unknown): boolean {
  const isObj = (x: unknown): x is S => typeof x === 'object' && x !== null && !Array.isArray(x);
  const types: Record<string, (x: unknown) => boolean> = {
    object: isObj, array: Array.isArray, string: (x) => typeof x === 'string', boolean: (x) => typeof x === 'boolean',
    number: (x) => typeof x === 'number', integer: (x) => Number.isInteger(x),
  };
  if (s.type && !types[s.type](v)) return false;
  if (s.const !== undefined && v !== s.const) return false;
  if (s.enum && !s.enum.includes(v)) return false;
  if (s.anyOf && !s.anyOf.some((sub: S) => valid(sub, v))) return false;
  if (typeof v === 'string') {
    if (s.pattern && !new RegExp(s.pattern, 'u').test(v)) return false;
    if (s.minLength !== undefined && v.length < s.minLength) return false;
    if (s.maxLength !== undefined && v.length > s.maxLength) return false;
  }
  if (typeof v === 'number') {
    if (s.minimum !== undefined && v < s.minimum) return false;
    if (s.exclusiveMinimum !== undefined && v <= s.exclusiveMinimum) return false;
    if (s.maximum !== undefined && v > s.maximum) return false;
    if (s.exclusiveMaximum !== undefined && v >= s.exclusiveMaximum) return false;
  }
  if (Array.isArray(v)) {
    if (s.minItems !== undefined && v.length < s.minItems) return false;
    if (s.maxItems !== undefined && v.length > s.maxItems) return false;
    if (s.items && !v.every((x) => valid(s.items, x))) return false;
  }
  if (isObj(v)) {
    if (s.required && !s.required.every((k: string) => k in v)) return false;
    if (s.additionalProperties === false && !Object.keys(v).every((k) => k in (s.properties ?? {}))) return false;
    for (const [k, deps] of Object.entries(s.dependentRequired ?? {})) if (k in v && !(deps as string[]).every((d) => d in v)) return false;
    for (const [k, sub] of Object.entries(s.properties ?? {})) if (k in v && !valid(sub as S, v[k])) return false;
  }
  return true;
}

describe('designJsonSchema', () => {
  // Regenerate after a schema change with:
  // npx tsx -e "import { designJsonSchema as s } from './src/design/jsonSchema.ts'; import { writeFileSync } from 'node:fs'; writeFileSync('schema/design.schema.json', JSON.stringify(s, null, 2) + '\n');"
  it('equals schema/design.schema.json', () => {
    const file = readFileSync(new URL('../../schema/design.schema.json', import.meta.url), 'utf8');
    expect(JSON.parse(file)).toEqual(JSON.parse(JSON.stringify(designJsonSchema)));
  });
  it('accepts demo.yaml and refuses the mistakes the parser refuses', () => {
    const demo = parse(demoText);
    expect(valid(designJsonSchema, demo)).toBe(true);
    expect(valid(designJsonSchema, { ...demo, tank: { ...demo.tank, lm: '22M' } })).toBe(false);
    expect(valid(designJsonSchema, { ...demo, tank: { ...demo.tank, lm: '27 nF' } })).toBe(false);
    expect(valid(designJsonSchema, { ...demo, tank: { ...demo.tank, Lm: '300 uH' } })).toBe(false);
    expect(valid(designJsonSchema, { ...demo, operating: { ...demo.operating, load: ['12'] } })).toBe(false);
    expect(valid(designJsonSchema, { ...demo, operating: { ...demo.operating, frequency: ['regulate'] } })).toBe(false);
    expect(valid(designJsonSchema, { ...demo, name: 'a\nb' })).toBe(false);
    const { tank: _t, ...noTank } = demo;
    expect(valid(designJsonSchema, noTank)).toBe(false);
    const explicit = { ...demo, operating: { ratedPower: '240 W', corners: [{ vin: '390 V', load: '5 A', frequency: '90 kHz', lm: '280 uH' }] } };
    expect(valid(designJsonSchema, explicit)).toBe(true);
    expect(parseDesign(JSON.stringify(explicit), 'x').ok).toBe(true);
  });
  it('lists exactly the keys the parser knows', () => {
    const p = designJsonSchema.properties as S;
    expect(Object.keys(p).sort()).toEqual([...ROOT_KEYS].sort());
    for (const [name, fields] of Object.entries(SECTION_FIELDS)) if (name !== 'compare') expect(Object.keys(p[name].properties)).toEqual(Object.keys(fields));
    expect(Object.keys(p.compare.properties)).toEqual([...COMPARE_KEYS]);
    expect(Object.keys(p.limits.properties)).toEqual([...LIMIT_KEYS]);
    expect(Object.keys(p.limits.properties.frequency.properties)).toEqual(['min', 'max']);
    expect(Object.keys(p.operating.properties)).toEqual([...OPERATING_KEYS]);
    expect(Object.keys(p.operating.properties.corners.items.properties)).toEqual([...CORNER_KEYS]);
    expect(Object.keys(p.devices.properties)).toEqual([...DEVICE_KEYS]);
  });
  it('states the defaults the parser applies', () => {
    const r = parseDesign(demoText.replace(/^compare:[\s\S]*$/m, ''), 'x');
    if (!r.ok) throw new Error('demo without compare must parse');
    const p = designJsonSchema.properties as S;
    for (const section of ['compare', 'simulation'] as const) {
      for (const [key, sub] of Object.entries(p[section].properties as Record<string, S>)) {
        const d = typeof sub.default === 'string' && /^\d/.test(sub.default) ? (parseQuantity(sub.default, 'ratio') as { value: number }).value : sub.default;
        expect([section, key, r.design[section][key as never]]).toEqual([section, key, d]);
      }
    }
    expect(p.tank.properties.integrated.default).toBe(r.design.tank.integrated);
  });
});

describe('docs/design-file.md', () => {
  it('documents every key of the schema', () => {
    const doc = readFileSync(new URL('../../docs/design-file.md', import.meta.url), 'utf8');
    const walk = (s: S, out: string[]): string[] => {
      for (const [k, sub] of Object.entries((s.properties ?? {}) as Record<string, S>)) {
        out.push(k);
        walk(sub, out);
        if (sub.items) walk(sub.items, out);
      }
      return out;
    };
    const missing = walk(designJsonSchema, []).filter((k) => !doc.includes(`\`${k}\``) && !doc.includes(`\`${k}.`) && !doc.includes(`.${k}\``));
    expect(missing).toEqual([]);
  });
});
