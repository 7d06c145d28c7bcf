import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import type { Design } from './types.js';
import { parseDesign } from './parse.js';
import { formatProblem } from './problem.js';

const demo = readFileSync(new URL('../../examples/demo.yaml', import.meta.url), 'utf8');
const operatingBlock = /^operating:[\s\S]*?(?=^tolerances:)/m;

function withOperating(block: string): { design?: Design; errors: string[] } {
  const r = parseDesign(demo.replace(operatingBlock, `operating:\n${block}\n`), 'd.yaml');
  return r.ok ? { design: r.design, errors: [] } : { errors: r.problems.map((p) => formatProblem(p, 'd.yaml')) };
}

describe('operating', () => {
  it('takes single values as one-element lists and fixed frequencies', () => {
    const { design } = withOperating('  vin: 390 V\n  load: 12 ohm\n  ratedPower: 240 W\n  frequency: 95 kHz');
    expect(design?.operating).toEqual({ vin: [390], load: [{ kind: 'ohm', value: 12 }], ratedPower: 240, frequency: [95e3], corners: [] });
  });
  it('takes lists of every load kind and frequency lists; frequency defaults to regulate', () => {
    const { design } = withOperating('  vin: [340, 410 V]\n  load: [10%, 12 ohm, 5 A, 120 W]\n  ratedPower: 0.24 kW\n  frequency: [90 kHz, 0.11 MHz]');
    expect(design?.operating.load).toEqual([
      { kind: 'percent', value: 0.1 }, { kind: 'ohm', value: 12 }, { kind: 'ampere', value: 5 }, { kind: 'watt', value: 120 },
    ]);
    expect(design?.operating.vin).toEqual([340, 410]);
    expect(design?.operating.frequency).toEqual([90e3, 110e3]);
    expect(withOperating('  vin: 390 V\n  load: 50%\n  ratedPower: 240 W').design?.operating.frequency).toBe('regulate');
  });
  it('reads explicit corners, alone or beside the grid', () => {
    const { design } = withOperating([
      '  ratedPower: 240 W',
      '  corners:',
      '    - vin: 390 V',
      '      load: 50%',
      '    - {vin: 340 V, load: 2 A, frequency: 80 kHz, lr: 63 uH, cr: 40 nF, lm: 280 uH}',
      '    - {vin: 410 V, load: 10 W, frequency: regulate}',
    ].join('\n'));
    expect(design?.operating).toEqual({
      vin: [], load: [], ratedPower: 240, frequency: 'regulate',
      corners: [
        { vin: 390, load: { kind: 'percent', value: 0.5 }, frequency: null },
        { vin: 340, load: { kind: 'ampere', value: 2 }, frequency: 80e3, lr: 63e-6, cr: 40e-9, lm: 280e-6 },
        { vin: 410, load: { kind: 'watt', value: 10 }, frequency: null },
      ],
    });
  });
  it('needs vin and load unless corners are given, and both together', () => {
    expect(withOperating('  ratedPower: 240 W').errors).toEqual([
      'd.yaml:24:1: operating.vin: missing required key "vin"',
      'd.yaml:24:1: operating.load: missing required key "load"',
    ]);
    expect(withOperating('  vin: 390 V\n  ratedPower: 240 W\n  corners: [{vin: 390 V, load: 50%}]').errors).toEqual([
      'd.yaml:24:1: operating.load: missing required key "load"',
    ]);
  });
  it('reports every bad corner entry with its path', () => {
    const { errors } = withOperating([
      '  ratedPower: 240 W',
      '  corners:',
      '    - {vin: 390 V}',
      '    - {vin: 340 V, load: 0%, frequency: regulated, lx: 1 uH}',
      '    - 5',
    ].join('\n'));
    expect(errors).toEqual([
      'd.yaml:27:7: operating.corners[0].load: missing required key "load"',
      'd.yaml:28:26: operating.corners[1].load: expected a load > 0 such as "50%", "12 ohm", "5 A" or "120 W", got "0%": for a very light load use a small share such as "1%"',
      'd.yaml:28:41: operating.corners[1].frequency: expected a frequency > 0 Hz such as "100 kHz", a list of them, or "regulate", got "regulated": did you mean "regulate"?',
      'd.yaml:28:52: operating.corners[1].lx: unknown key "lx"; did you mean "lr"?',
      'd.yaml:29:7: operating.corners[2]: expected a mapping with vin, load and optional frequency, lr, cr, lm, got "5"',
    ]);
  });
  it('refuses regulate inside a frequency list, empty lists and bare-number loads', () => {
    const { errors } = withOperating('  vin: []\n  load: [50%, 12]\n  ratedPower: 240 W\n  frequency: [100 kHz, regulate]');
    expect(errors).toEqual([
      'd.yaml:25:8: operating.vin: the list is empty; give at least one value',
      'd.yaml:26:15: operating.load[1]: expected a load > 0 such as "50%", "12 ohm", "5 A" or "120 W", got "12": has no unit; write "%", "ohm", "A" or "W" after the number',
      'd.yaml:28:24: operating.frequency[1]: expected a frequency > 0 Hz such as "100 kHz", got "regulate": write "frequency: regulate" alone, not inside a list of fixed frequencies',
    ]);
  });
  it('caps list lengths', () => {
    const many = Array.from({ length: 101 }, (_, i) => `${300 + i} V`).join(', ');
    expect(withOperating(`  vin: [${many}]\n  load: 50%\n  ratedPower: 240 W`).errors[0]).toContain('the list has 101 entries; at most 100 are accepted');
  });
  it('flags an implausible load (1000 % cap, common practice) and accepts 150 %', () => {
    expect(withOperating('  vin: 390 V\n  load: 2000%\n  ratedPower: 240 W').errors[0]).toContain('implausible value "2000%" (2000%), outside 0.0001% .. 1000%');
    expect(withOperating('  vin: 390 V\n  load: 150%\n  ratedPower: 240 W').errors).toEqual([]);
  });
});
