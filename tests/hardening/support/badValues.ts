/**
 * fast-check arbitraries for values a design field must refuse, per kind of field (see LEAVES), and
 * for structured mutations of a valid design with the key path and line the parser must report.
 */
import fc from 'fast-check';
import { LEAVES, OPTIONAL_SECTIONS, SECTIONS, baseTree, dq, emit, getAt, setAt, type Leaf, type Tree } from './designText.js';

const UNITS = ['H', 'F', 's', 'ohm', 'V', 'W', 'Hz', 'A'];

/** Long runs of letters (never a number), up to 100k characters. */
const longText = fc.integer({ min: 65, max: 100_000 }).map((n) => 'x'.repeat(n));

/** Values wrong for every quantity field: wrong YAML type, NaN/Infinity spellings, overflow, sign, units, text. */
const alwaysBadQuantity: fc.Arbitrary<string> = fc.oneof(
  fc.constantFrom('[]', '{a: 1}', '{}', 'null', '~', 'true', '""', "''"),
  fc.constantFrom('.nan', '.NaN', 'NaN', dq('NaN'), '.inf', '-.inf', '+.inf', 'Infinity', '-Infinity', '1e400', '-1e400', '1e99999'),
  fc.constantFrom('1e300', '-5', '-1e-3', '0x10', '0o17', '4k7', '1,5', '5 kg', '5 furlong', '12 mph', '60 μΗ', '５', '💥', '1e3e3'),
  fc.double({ min: 1e60, max: 1e300, noNaN: true }).map((x) => x.toExponential()),
  fc.double({ min: -1e300, max: -1e-300, noNaN: true }).map((x) => x.toExponential()),
  longText,
  // free text that does not start like a number (and is not the word "regulate")
  fc.string({ unit: 'grapheme', minLength: 1, maxLength: 30 }).filter((s) => !/^\s*[-+.0-9]/.test(s) && s.trim() !== 'regulate').map(dq),
  fc.constantFrom('60 uH\n.control', '5\u0000', '5\u202e', '6\r\nshell ls').map(dq),
);

function wrongUnit(leaf: Leaf): fc.Arbitrary<string> {
  const others = UNITS.filter((u) => u !== leaf.unit);
  return fc.tuple(fc.integer({ min: 1, max: 999 }), fc.constantFrom(...others)).map(([n, u]) => `${n} ${u}`);
}

/** A value that the given field must refuse. */
export function badValueFor(leaf: Leaf): fc.Arbitrary<string> {
  switch (leaf.kind) {
    case 'name':
      return fc.oneof(
        fc.constantFrom('[]', '{a: 1}', 'null', '""', dq('a/b'), dq('..\\..'), dq('naïve'), dq('tab\there'), dq('x\n.control\nshell touch /tmp/x')),
        fc.integer({ min: 81, max: 100_000 }).map((n) => 'n'.repeat(n)),
        fc.string({ minLength: 1, maxLength: 20 }).filter((s) => s.trim() === '' || /[^A-Za-z0-9 _.-]/.test(s.trim())).map(dq),
      );
    case 'enum':
      return fc.oneof(fc.constantFrom('half-brige', 'HALF-BRIDGE', 'extreme', 'Fast', '[]', '{a: 1}', 'null', '""', '1', '.nan'), longText);
    case 'bool':
      return fc.constantFrom('"true"', 'yes', 'no', 'on', '1', '0', '[]', '{}', 'null', 'True!', '.nan');
    case 'quantity': {
      const arbs = [alwaysBadQuantity, wrongUnit(leaf)];
      if (leaf.tinyIsError) arbs.push(fc.constantFrom('1e-320', '5e-324', '1e-300'));
      return fc.oneof(...arbs);
    }
    case 'list':
      return fc.oneof(
        alwaysBadQuantity,
        // inside a flow list: no commas or brackets that would split or nest the item
        alwaysBadQuantity.filter((v) => !/[,[\]{}]/.test(v)).map((v) => `[390 V, ${v}]`),
        wrongUnit(leaf).map((v) => `[${v}]`),
        fc.constantFrom('[1e-320]', `[${Array.from({ length: 101 }, () => '390 V').join(', ')}]`),
      );
    case 'load-list':
      return fc.oneof(
        fc.constantFrom('[]', '{a: 1}', '[50 H]', '[-5%]', '[0%]', '[0 ohm]', '[.nan]', '[1e300 W]', '[5 V]', '[50]', '[fifty]', 'null', '[[1]]'),
        longText,
      );
  }
}

/** One change to a valid design and the problem it must produce. */
export interface Mutation {
  /** Key path the problem must name (list items may add `[i]`). */
  path: string;
  /** How to find the line: the line of this key in the emitted text, plus `offset`. */
  lineKey: string;
  offset: number;
  label: string;
  /** Paths touched, for keeping combined mutations apart. */
  touches: string;
  apply(tree: Tree, extra: Map<string, string[]>): void;
}

const leafMutation: fc.Arbitrary<Mutation> = fc.constantFrom(...LEAVES).chain((leaf) =>
  badValueFor(leaf).map((v): Mutation => ({
    path: leaf.path, lineKey: leaf.path, offset: 0, touches: leaf.path, label: `${leaf.path} = ${v.slice(0, 40)}`,
    apply: (t) => setAt(t, leaf.path, v),
  })));

const required = LEAVES.filter((l) => !l.optional && !l.path.startsWith('tolerances') && !l.path.startsWith('compare') && !l.path.startsWith('simulation'));
const deleteMutation: fc.Arbitrary<Mutation> = fc.constantFrom(...required).map((leaf) => {
  const parent = leaf.path.includes('.') ? leaf.path.split('.')[0] : '';
  return { path: leaf.path, lineKey: parent === '' ? '<root>' : parent, offset: 0, touches: leaf.path, label: `delete ${leaf.path}`,
    apply: (t: Tree) => setAt(t, leaf.path, undefined) };
});

const deleteSection: fc.Arbitrary<Mutation> = fc.constantFrom(...SECTIONS.filter((s) => !OPTIONAL_SECTIONS.has(s))).map((s) =>
  ({ path: s, lineKey: '<root>', offset: 0, touches: s, label: `delete section ${s}`, apply: (t: Tree) => setAt(t, s, undefined) }));

const sectionType: fc.Arbitrary<Mutation> = fc.tuple(fc.constantFrom(...SECTIONS), fc.constantFrom('[1, 2]', '5', '""', 'true', '.nan', '[{a: 1}]'))
  .map(([s, v]) => ({ path: s, lineKey: s, offset: 0, touches: s, label: `section ${s} = ${v}`, apply: (t: Tree) => setAt(t, s, v) }));

const unknownKey: fc.Arbitrary<Mutation> = fc.tuple(fc.constantFrom(...LEAVES.filter((l) => l.path.includes('.'))), fc.stringMatching(/^[a-z][a-zA-Z0-9_]{0,30}$/))
  .filter(([leaf, k]) => !Object.keys(getAt(baseTree(), leaf.path.split('.')[0]) as Tree).includes(k))
  .map(([leaf, k]) => {
    const section = leaf.path.split('.')[0];
    return { path: `${section}.${k}`, lineKey: leaf.path, offset: 1, touches: leaf.path, label: `unknown key ${section}.${k}`,
      apply: (_t: Tree, extra: Map<string, string[]>) => extra.set(leaf.path, [`${k}: 1`]) };
  });

const duplicateKey: fc.Arbitrary<Mutation> = fc.constantFrom(...LEAVES).map((leaf) => {
  const key = leaf.path.split('.').pop()!;
  return { path: leaf.path, lineKey: leaf.path, offset: 1, touches: leaf.path, label: `duplicate ${leaf.path}`,
    apply: (t: Tree, extra: Map<string, string[]>) => extra.set(leaf.path, [`${key}: ${getAt(t, leaf.path) as string}`]) };
});

/** Any single structured mutation. */
export const mutation: fc.Arbitrary<Mutation> = fc.oneof(
  { weight: 8, arbitrary: leafMutation },
  { weight: 2, arbitrary: deleteMutation },
  { weight: 1, arbitrary: deleteSection },
  { weight: 1, arbitrary: sectionType },
  { weight: 2, arbitrary: unknownKey },
  { weight: 2, arbitrary: duplicateKey },
);

const related = (a: string, b: string): boolean => a === b || a.startsWith(`${b}.`) || b.startsWith(`${a}.`);

/** One to four mutations on unrelated keys (none inside another's section, no two on one key). */
export const mutations: fc.Arbitrary<Mutation[]> = fc.uniqueArray(mutation, {
  minLength: 1, maxLength: 4,
  comparator: (a, b) => related(a.touches, b.touches),
});

/** The mutated design text, with the expected line of each mutation's problem. */
export function applyMutations(ms: Mutation[]): { text: string; expected: { path: string; line: number; label: string }[] } {
  const tree = baseTree();
  const extra = new Map<string, string[]>();
  for (const m of ms) m.apply(tree, extra);
  const { text, lineOf } = emit(tree, extra);
  const expected = ms.map((m) => {
    // deleting every key of a section leaves it empty: then the section itself is reported
    const section = m.path.split('.')[0];
    const emptied = m.label.startsWith('delete ') && m.path.includes('.') && Object.keys(getAt(tree, section) as Tree).length === 0;
    if (emptied) return { path: section, label: m.label, line: lineOf.get(section)! };
    return { path: m.path, label: m.label, line: m.lineKey === '<root>' ? 1 : lineOf.get(m.lineKey)! + m.offset };
  });
  return { text, expected };
}
