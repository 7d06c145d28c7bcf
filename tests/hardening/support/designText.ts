/**
 * A small emitter for design files used by the hardening tests: a nested description of a design is
 * written as block YAML with every leaf on one line, and the emitter remembers the line of each key,
 * so a test knows exactly where the parser must point. Leaves are raw YAML text (so `.nan`, anchors
 * and broken values can be written as they are).
 */

/** A design as raw YAML leaves: `{ tank: { lr: '60 uH' } }`. */
export type Tree = { [key: string]: string | Tree };

/** A valid design (the demo's tank and converter with one fixed frequency): every field written. */
export function baseTree(): Tree {
  return {
    name: 'hardening-base',
    topology: { inverter: 'half-bridge', rectifier: 'center-tapped' },
    tank: { lr: '60 uH', cr: '42 nF', lm: '300 uH', turnsRatio: '8', integrated: 'false' },
    switches: { deadTime: '200 ns', coss: '150 pF', rdsOn: '120 mohm' },
    rectifier: { forwardVoltage: '0.5 V', resistance: '5 mohm' },
    output: { voltage: '24 V', capacitance: '470 uF', esr: '20 mohm' },
    operating: { vin: '[390 V]', load: '[100%]', ratedPower: '240 W', frequency: '110 kHz' },
    tolerances: { lr: '5%', cr: '5%', lm: '10%', corners: 'nominal' },
    compare: { vout: '3%', fs: '5%', gain: '3%', currents: '10%', voltages: '10%' },
    simulation: { accuracy: 'fast', settleTolerance: '0.1%', maxCycles: '2000', zvsThreshold: '5%' },
  };
}

export type LeafKind = 'name' | 'enum' | 'bool' | 'quantity' | 'list' | 'load-list';

/** A leaf of baseTree with what the parser requires of it. */
export interface Leaf {
  path: string;
  kind: LeafKind;
  /** The key may be left out (it has a default, or its section is optional). */
  optional: boolean;
  /** A positive value far below any sane one (1e-320) is an error here (the field has a lower plausibility bound). */
  tinyIsError: boolean;
  /** Unit symbol of the field, '' for ratios and plain numbers. */
  unit: string;
}

const L = (path: string, kind: LeafKind, unit = '', tinyIsError = true, optional = false): Leaf => ({ path, kind, optional, tinyIsError, unit });

/** Every leaf of baseTree. Limits from src/design/fields.ts, read as the specification under test. */
export const LEAVES: readonly Leaf[] = [
  L('name', 'name'),
  L('topology.inverter', 'enum'), L('topology.rectifier', 'enum'),
  L('tank.lr', 'quantity', 'H'), L('tank.cr', 'quantity', 'F'), L('tank.lm', 'quantity', 'H'), L('tank.turnsRatio', 'quantity'),
  L('tank.integrated', 'bool', '', true, true),
  L('switches.deadTime', 'quantity', 's'), L('switches.coss', 'quantity', 'F'), L('switches.rdsOn', 'quantity', 'ohm'),
  L('rectifier.forwardVoltage', 'quantity', 'V', false), L('rectifier.resistance', 'quantity', 'ohm', false),
  L('output.voltage', 'quantity', 'V'), L('output.capacitance', 'quantity', 'F'), L('output.esr', 'quantity', 'ohm', false),
  L('operating.vin', 'list', 'V'), L('operating.load', 'load-list'), L('operating.ratedPower', 'quantity', 'W'),
  L('operating.frequency', 'quantity', 'Hz', true, true),
  L('tolerances.lr', 'quantity', '', false, true), L('tolerances.cr', 'quantity', '', false, true),
  L('tolerances.lm', 'quantity', '', false, true), L('tolerances.corners', 'enum', '', true, true),
  ...['vout', 'fs', 'gain', 'currents', 'voltages'].map((k) => L(`compare.${k}`, 'quantity', '', false, true)),
  L('simulation.accuracy', 'enum', '', true, true), L('simulation.settleTolerance', 'quantity', '', false, true),
  L('simulation.maxCycles', 'quantity', '', true, true), L('simulation.zvsThreshold', 'quantity', '', false, true),
];

/** Sections of the root; the optional ones may be missing as a whole. */
export const SECTIONS = ['topology', 'tank', 'switches', 'rectifier', 'output', 'operating', 'tolerances', 'compare', 'simulation'] as const;
export const OPTIONAL_SECTIONS = new Set(['tolerances', 'compare', 'simulation']);

export function getAt(tree: Tree, path: string): string | Tree | undefined {
  let node: string | Tree | undefined = tree;
  for (const k of path.split('.')) node = typeof node === 'object' ? node[k] : undefined;
  return node;
}

/** Sets (or, with `undefined`, deletes) the value at a dotted path, in place. */
export function setAt(tree: Tree, path: string, value: string | Tree | undefined): void {
  const keys = path.split('.');
  let node = tree;
  for (const k of keys.slice(0, -1)) node = node[k] as Tree;
  const last = keys[keys.length - 1];
  if (value === undefined) delete node[last];
  else node[last] = value;
}

export interface Emitted {
  text: string;
  /** 1-based line of each key written, by dotted path ('tank', 'tank.lr', ...). */
  lineOf: Map<string, number>;
}

/**
 * Writes the tree as block YAML, two spaces per level. `extraLines` are appended after the key at a
 * path (used to write a duplicate key right after the original).
 */
export function emit(tree: Tree, extraLines: Map<string, string[]> = new Map()): Emitted {
  const out: string[] = [];
  const lineOf = new Map<string, number>();
  const walk = (node: Tree, prefix: string, indent: string): void => {
    for (const [key, value] of Object.entries(node)) {
      const path = prefix === '' ? key : `${prefix}.${key}`;
      lineOf.set(path, out.length + 1);
      if (typeof value === 'string') out.push(`${indent}${key}: ${value}`);
      else {
        out.push(`${indent}${key}:`);
        walk(value, path, `${indent}  `);
      }
      for (const extra of extraLines.get(path) ?? []) out.push(`${indent}${extra}`);
    }
  };
  walk(tree, '', '');
  return { text: `${out.join('\n')}\n`, lineOf };
}

/** A YAML double-quoted scalar for any JS string (JSON escapes are valid YAML escapes). */
export const dq = (s: string): string => JSON.stringify(s);
