import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseDesign } from './parse.js';
import { formatProblem } from './problem.js';

const demo = readFileSync(new URL('../../examples/demo.yaml', import.meta.url), 'utf8');

function run(edits: [string | RegExp, string][]): { errors: string[]; warnings: string[] } {
  let text = demo;
  for (const [from, to] of edits) {
    const next = text.replace(from, to);
    if (next === text) throw new Error(`edit did not apply: ${from}`);
    text = next;
  }
  const r = parseDesign(text, 'd.yaml');
  return r.ok
    ? { errors: [], warnings: r.warnings.map((p) => formatProblem(p, 'd.yaml')) }
    : { errors: r.problems.map((p) => formatProblem(p, 'd.yaml')), warnings: [] };
}

describe('tank plausibility', () => {
  it('refuses Lm < Lr as physically implausible', () => {
    const { errors } = run([['lm: 300 uH', 'lm: 50 uH']]);
    expect(errors).toEqual([
      'd.yaml:11:7: tank.lm: physically implausible: Lm (50 uH) must exceed Lr (60 uH) for an LLC tank (Ln = Lm/Lr = 0.833)',
    ]);
    expect(run([['lm: 300 uH', 'lm: 60 uH']]).errors).toHaveLength(1); // Ln = 1: Lm must exceed Lr
  });
  it('checks Lm > Lr in explicit corners with their own tank values', () => {
    const { errors } = run([['ratedPower: 240 W', 'ratedPower: 240 W\n  corners:\n    - {vin: 390 V, load: 50%, lr: 400 uH}']]);
    expect(errors).toEqual([
      'd.yaml:29:35: operating.corners[0].lr: physically implausible in this corner: Lm (300 uH) must exceed Lr (400 uH) for an LLC tank (Ln = Lm/Lr = 0.75)',
    ]);
  });
  it('flags unit-prefix slips at tank positions (common practice windows)', () => {
    expect(run([['lm: 300 uH', 'lm: 300 H']]).errors[0]).toBe(
      'd.yaml:11:7: tank.lm: implausible value "300 H" (300 H), outside 1 nH .. 1 H; check the unit prefix');
    expect(run([['cr: 42 nF', 'cr: 42 F']]).errors[0]).toContain('tank.cr: implausible value "42 F" (42 F), outside 1 pF .. 1 mF');
    expect(run([['cr: 42 nF', 'cr: 42 mF']]).errors[0]).toContain('tank.cr: implausible value "42 mF" (42 mF), outside 1 pF .. 1 mF');
    expect(run([['cr: 42 nF', 'cr: 420 uF']]).warnings).toContain(
      'd.yaml:10:7: tank.cr: unusual value "420 uF" (420 uF), usually 1 pF .. 100 uF; check the unit prefix');
    expect(run([['lr: 60 uH', 'lr: 60 MH']]).errors[0]).toContain('implausible value "60 MH" (60 MH)');
  });
  it('warns when the tolerance extremes bring Lm down to Lr', () => {
    const { warnings } = run([['lm: 300 uH', 'lm: 80 uH'], ['lr: 5%', 'lr: 40%'], ['lm: 10%', 'lm: 40%'], ['corners: nominal', 'corners: extremes']]);
    expect(warnings.some((w) => w.includes('tolerances.lm: at the tolerance extremes Lm (48 uH) falls to or below Lr (84 uH)'))).toBe(true);
  });
  it('refuses tolerances of 50 % or more and negative ones', () => {
    expect(run([['cr: 5%', 'cr: 50%']]).errors[0]).toContain('tolerances.cr: expected a fraction >= 0 and < 50%');
    expect(run([['cr: 5%', 'cr: -1%']]).errors[0]).toContain('got "-1%"');
  });
});

describe('dead time and switching frequency', () => {
  // fr = 1/(2 pi sqrt(60 uH * 42 nF)) = 100.25 kHz, fp = 1/(2 pi sqrt(360 uH * 42 nF)) = 40.93 kHz
  // (docs/method.md#normalised; values computed by hand from the demo tank).
  it('refuses a dead time of half the shortest switching period or more', () => {
    const { errors } = run([['deadTime: 200 ns', 'deadTime: 2.5 us'], ['frequency: regulate', 'frequency: [100 kHz, 200 kHz]']]);
    expect(errors).toEqual([
      'd.yaml:14:13: switches.deadTime: dead time 2.5 us is not shorter than half the switching period at 200 kHz (2.5 us, from operating.frequency[1])',
    ]);
  });
  it('also takes fixed frequencies of explicit corners into account', () => {
    const { errors } = run([['deadTime: 200 ns', 'deadTime: 3 us'], ['ratedPower: 240 W', 'ratedPower: 240 W\n  corners: [{vin: 390 V, load: 50%, frequency: 170 kHz}]']]);
    expect(errors[0]).toContain('at 170 kHz (2.941 us, from operating.corners[0].frequency)');
  });
  it('warns when the dead time is over 10 % of the period, with the FHA fundamental factor', () => {
    // sin(pi * 0.12) / (pi * 0.12) = 0.9765 (docs/method.md#fha-inverter)
    const { warnings } = run([['deadTime: 200 ns', 'deadTime: 600 ns'], ['frequency: regulate', 'frequency: 200 kHz']]);
    expect(warnings).toContain(
      'd.yaml:14:13: switches.deadTime: dead time 600 ns is 12% of the period at 200 kHz; FHA ignores it (the inverter fundamental shrinks by sin(pi fs td)/(pi fs td) = 0.976)');
  });
  it('warns about fixed frequencies below fp (capacitive at every load) or far above fr', () => {
    const { warnings } = run([['frequency: regulate', 'frequency: [30 kHz, 1.5 MHz]']]);
    expect(warnings).toEqual([
      'd.yaml:14:13: switches.deadTime: dead time 200 ns is 30% of the period at 1.5 MHz; FHA ignores it (the inverter fundamental shrinks by sin(pi fs td)/(pi fs td) = 0.858)',
      'd.yaml:28:15: operating.frequency[0]: 30 kHz is below fp = 1/(2 pi sqrt((Lr+Lm) Cr)) = 40.93 kHz: the tank input is capacitive at every load (no ZVS)',
      'd.yaml:28:23: operating.frequency[1]: 1.5 MHz is more than 10 times fr = 100.3 kHz; check the unit prefix',
    ]);
  });
});

describe('turns ratio sanity', () => {
  it('warns when regulation needs a tank gain far from 1', () => {
    // M = n (Vo + VF) / (Vin/2) = 0.8 * 24.5 / 170 = 0.1153 (docs/method.md#gain, half-bridge, center-tapped)
    const { warnings } = run([['turnsRatio: 8', 'turnsRatio: 0.8']]);
    expect(warnings).toEqual([
      'd.yaml:12:15: tank.turnsRatio: regulating to 24 V at vin = 340 V (operating.vin[0]) needs a tank gain M = n (Vo + drops) / Vin_eff = 0.115, far from 1; check turnsRatio, output.voltage and topology.inverter',
    ]);
  });
  it('stays quiet for the demo, whose gain is near 1', () => {
    // M at 340 V = 8 * 24.5 / 170 = 1.153, at 410 V = 0.956
    expect(run([]).warnings).toEqual([]);
  });
});
