import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parse } from 'yaml';
import { parseDesign } from './parse.js';
import { formatProblem, type Problem } from './problem.js';

const demo = readFileSync(new URL('../../examples/demo.yaml', import.meta.url), 'utf8');

const problems = (text: string): Problem[] => {
  const r = parseDesign(text, 'd.yaml');
  if (r.ok) throw new Error('expected problems');
  return r.problems;
};
const lines = (text: string): string[] => problems(text).map((p) => formatProblem(p, 'd.yaml'));

describe('demo.yaml', () => {
  it('parses to the exact SI values (SI prefix definitions)', () => {
    const r = parseDesign(demo, 'examples/demo.yaml');
    if (!r.ok) throw new Error(r.problems.map((p) => formatProblem(p, 'demo')).join('\n'));
    const d = r.design;
    expect(r.warnings).toEqual([]);
    expect(d.name).toBe('kiosk-aux-240w');
    expect(d.file).toBe('examples/demo.yaml');
    expect(d.topology).toEqual({ inverter: 'half-bridge', rectifier: 'center-tapped' });
    expect(d.tank).toEqual({ lr: 60e-6, cr: 42e-9, lm: 300e-6, turnsRatio: 8, integrated: false });
    expect(d.switches).toEqual({ deadTime: 200e-9, coss: 150e-12, rdsOn: 0.12 });
    expect(d.rectifier).toEqual({ forwardVoltage: 0.5, resistance: 5e-3 });
    expect(d.output).toEqual({ voltage: 24, capacitance: 470e-6, esr: 20e-3 });
    expect(d.operating).toEqual({
      vin: [340, 390, 410],
      load: [{ kind: 'percent', value: 0.25 }, { kind: 'percent', value: 1 }],
      ratedPower: 240,
      frequency: 'regulate',
      corners: [],
    });
    expect(d.tolerances).toEqual({ lr: 0.05, cr: 0.05, lm: 0.1, turnsRatio: 0, corners: 'nominal', samples: 100, seed: 1, distribution: 'uniform' });
    expect(d.compare).toEqual({ vout: 0.03, fs: 0.05, gain: 0.03, currents: 0.1, voltages: 0.1, measured: 0.05 });
    expect(d.simulation).toEqual({ accuracy: 'normal', settleTolerance: 0.001, chargeBalanceTolerance: 0.01, periodicityTolerance: 0.01, maxCycles: 2000, zvsThreshold: 0.05, confirm: 20 });
    expect(d.devices).toEqual({});
  });
});

describe('problem reports', () => {
  it('formats a problem as file:line:column: path: message', () => {
    const [p] = problems(demo.replace('lm: 300 uH', 'lm: abc'));
    expect(formatProblem(p, 'demo.yaml')).toBe('demo.yaml:11:7: tank.lm: expected an inductance > 0 H such as "310 uH", got "abc"');
    expect(p).toMatchObject({ code: 'value', path: 'tank.lm', line: 11, column: 7, expected: 'an inductance > 0 H such as "310 uH"', received: '"abc"' });
  });

  it('reports every mistake of a file at once, in file order, with path, line and column', () => {
    const bad = demo
      .replace('name: kiosk-aux-240w', 'name: "kiosk\\naux"')
      .replace('inverter: half-bridge', 'inverter: halfbridge')
      .replace('cr: 42 nF', 'cr: 42 uH')
      .replace('  rdsOn: 120 mohm', '  rdsOn: 22M\n  rdson: 3')
      .replace('esr: 20 mohm', 'esr: .inf')
      .replace('vin: [340 V, 390 V, 410 V]', 'vin: [340 V, -390 V, NaN]')
      .replace('lr: 5%', 'lr: 60%')
      .replace('currents: 10%', 'currents: ten');
    expect(lines(bad)).toEqual([
      'd.yaml:4:7: name: expected a name of 1 to 80 characters from letters, digits, space, "_", "." and "-", got "kiosk\\u000aaux": contains a line break',
      'd.yaml:6:13: topology.inverter: expected "half-bridge" or "full-bridge", got "halfbridge": did you mean "half-bridge"?',
      'd.yaml:10:7: tank.cr: expected a capacitance > 0 F such as "42 nF", got "42 uH": has the unit of inductance (H), not F',
      'd.yaml:16:10: switches.rdsOn: expected a resistance > 0 ohm such as "120 mohm", got "22M": is ambiguous: a bare "M" is milli in SPICE but mega in SI; write "22m" for milli or "22meg" for mega',
      'd.yaml:17:3: switches.rdson: unknown key "rdson"; did you mean "rdsOn"?',
      'd.yaml:24:8: output.esr: expected a resistance >= 0 ohm such as "20 mohm", got ".inf"',
      'd.yaml:26:16: operating.vin[1]: expected a voltage > 0 V such as "390 V", got "-390 V"',
      'd.yaml:26:24: operating.vin[2]: expected a voltage > 0 V such as "390 V", got "NaN"',
      'd.yaml:31:7: tolerances.lr: expected a fraction >= 0 and < 50% such as "5%", got "60%": must be below 50%',
      'd.yaml:38:13: compare.currents: expected a fraction > 0 and <= 100% such as "10%", got "ten"',
    ]);
  });

  it('reports missing sections and keys at the parent, and unknown top-level keys', () => {
    const out = lines('name: x\ntank:\n  lr: 1 uH\nswitchs: {}\n');
    expect(out).toContain('d.yaml:2:1: tank.cr: missing required key "cr"');
    expect(out).toContain('d.yaml:4:1: switchs: unknown key "switchs"; did you mean "switches"?');
    expect(out).toContain('d.yaml:1:1: topology: missing required section "topology"');
    expect(out).toContain('d.yaml:1:1: operating: missing required section "operating"');
  });

  it('reports wrong YAML types without crashing', () => {
    const out = lines(demo.replace('lr: 60 uH', 'lr: [60 uH]').replace('  turnsRatio: 8', '  turnsRatio: 8\n  integrated: "yes"').replace(/^tolerances:[\s\S]*?(?=compare:)/m, 'tolerances: 5%\n'));
    expect(out).toContain('d.yaml:9:7: tank.lr: expected an inductance > 0 H such as "60 uH", got a list');
    expect(out).toContain('d.yaml:13:15: tank.integrated: expected true or false, got "yes"');
    expect(out).toContain('d.yaml:30:13: tolerances: expected a mapping with keys lr, cr, lm, turnsRatio, corners, samples, seed, distribution, got "5%"');
    expect(lines('- a\n- b\n')).toEqual(['d.yaml:1:1: expected a mapping of design sections, got a list']);
    expect(lines('')).toEqual(['d.yaml:1:1: the design file is empty']);
    expect(lines('just text')).toEqual(['d.yaml:1:1: expected a mapping of design sections, got "just text"']);
  });

  it('rejects duplicate keys with their path', () => {
    const out = lines(demo.replace('  lm: 300 uH', '  lm: 300 uH\n  lm: 310 uH'));
    expect(out).toEqual(['d.yaml:12:3: tank.lm: duplicate key "lm"; a key may appear only once']);
  });

  it('reports YAML syntax errors with position and stops there', () => {
    const out = problems('name: x\ntank: [1, 2\n');
    expect(out.length).toBeGreaterThan(0);
    expect(out.every((p) => p.code === 'yaml' && p.line > 0)).toBe(true);
    expect(problems('tank:\n\tlr: 1\n').map((p) => [p.code, p.line, p.column])).toEqual([['yaml', 2, 1]]);
    expect(lines('name: a\n---\nname: b\n')).toEqual(['d.yaml:2:1: a design file holds one YAML document; remove the second "---" and what follows or merge it']);
  });
});

describe('hostile input', () => {
  it('rejects an alias bomb quickly', () => {
    let text = 'a: &a ["lol","lol","lol","lol","lol","lol","lol","lol","lol"]\n';
    for (let i = 0, prev = 'a'; i < 9; i++, prev = `b${i - 1}`) text += `b${i}: &b${i} [${Array(9).fill(`*${prev}`).join(',')}]\n`;
    const t0 = performance.now();
    const out = problems(text);
    expect(performance.now() - t0).toBeLessThan(1000);
    expect(out.map((p) => p.code)).toEqual(['alias']);
    expect(out[0].line).toBe(2);
  });
  it('accepts plain aliases, even one anchor reused across 60 corners', () => {
    const corners = Array.from({ length: 60 }, (_, i) => `    - {vin: *v, load: ${i + 1}%}`).join('\n');
    const text = demo.replace('vin: [340 V, 390 V, 410 V]', 'vin: &v 390 V').replace('ratedPower: 240 W', `ratedPower: 240 W\n  corners:\n${corners}`);
    const r = parseDesign(text, 'd.yaml');
    expect(r.ok && r.design.operating.corners.map((c) => c.vin)).toEqual(Array(60).fill(390));
  });
  it('rejects deep nesting before the YAML composer sees it', () => {
    for (const text of ['x: ' + '['.repeat(100_000) + ']'.repeat(100_000), 'x:\n' + '- '.repeat(50_000) + '1\n', 'a:\n' + ' '.repeat(500) + 'b: 1\n']) {
      const t0 = performance.now();
      const out = problems(text);
      expect(performance.now() - t0).toBeLessThan(1000);
      expect(out.map((p) => p.code)).toEqual(['too-deep']);
    }
  });
  it('accepts the demo written as one-line JSON (JSON is YAML; flow colons are not nesting)', () => {
    const r = parseDesign(JSON.stringify(parse(demo)), 'd.json');
    expect(r.ok && r.design.tank).toEqual({ lr: 60e-6, cr: 42e-9, lm: 300e-6, turnsRatio: 8, integrated: false });
  });
  it('rejects oversize text, very long strings, huge and tiny numbers with clear problems', () => {
    expect(problems('#'.repeat(1_000_001)).map((p) => p.code)).toEqual(['too-large']);
    const out = lines(demo.replace('name: kiosk-aux-240w', `name: ${'n'.repeat(5000)}`).replace('lr: 60 uH', `lr: ${'9'.repeat(400)}`).replace('cr: 42 nF', 'cr: 1e-400'));
    expect(out[0]).toMatch(/^d\.yaml:4:7: name: expected a name of 1 to 80 characters .*, got "n{40}\.\.\.": is 5000 characters long$/);
    expect(out[1]).toMatch(/tank\.lr: .*is too long \(400 characters\)/);
    expect(out[2]).toMatch(/tank\.cr: .*got "1e-400": is too small to represent/);
  });
  it('refuses control characters in the name', () => {
    expect(lines(demo.replace('name: kiosk-aux-240w', 'name: "a\\u0007b"'))[0]).toContain('contains control character U+0007');
    expect(lines(demo.replace('name: kiosk-aux-240w', 'name: "a/b"'))[0]).toContain('contains the character "/"');
  });
});
