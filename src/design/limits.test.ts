import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parse } from 'yaml';
import { parseDesign } from './parse.js';
import { formatProblem } from './problem.js';
import { designJsonSchema } from './jsonSchema.js';
import type { Design } from './types.js';

const demo = readFileSync(new URL('../../examples/demo.yaml', import.meta.url), 'utf8');
/** The demo with its own limits section replaced by `limits` (appended at the end, so lines are predictable). */
const base = demo.replace(/^limits:.*\n(?: .*\n)*/m, '').trimEnd();
const BASE_LINES = base.split('\n').length;
const withLimits = (limits: string): string => `${base}\nlimits:\n${limits}`;

const design = (text: string): Design => {
  const r = parseDesign(text, 'd.yaml');
  if (!r.ok) throw new Error(r.problems.map((p) => formatProblem(p, 'd.yaml')).join('\n'));
  return r.design;
};
const problems = (text: string): string[] => {
  const r = parseDesign(text, 'd.yaml');
  if (r.ok) throw new Error('expected problems');
  return r.problems.map((p) => formatProblem(p, 'd.yaml'));
};

describe('limits section', () => {
  it('absent: no limits', () => {
    expect(design(base).limits).toBeUndefined();
  });

  it('reads every key in engineering notation to SI (SI prefix definitions)', () => {
    const d = design(withLimits([
      '  frequency: { min: 60 kHz, max: 0.15meg }',
      '  zvs: required',
      '  zvsMargin: 20%',
      '  crVoltage: 0.45 kV',
      '  tankCurrentRms: 3 A',
      '  switchCurrentRms: 2500 mA',
      '  diodeReverseVoltage: 60',
      '  diodeCurrentRms: 15 A',
      '  outputRippleCurrentRms: 8 A',
      '  derating: 0.8',
    ].join('\n')));
    expect(d.limits).toEqual({
      frequency: { min: 60e3, max: 150e3 }, zvs: 'required', zvsMargin: 0.2, crVoltage: 450, tankCurrentRms: 3,
      switchCurrentRms: 2.5, diodeReverseVoltage: 60, diodeCurrentRms: 15, outputRippleCurrentRms: 8, derating: 0.8,
    });
  });

  it('defaults: zvs ignore, derating 100 %; a one-sided window', () => {
    expect(design(withLimits('  frequency: { max: 200 kHz }')).limits).toEqual({ frequency: { max: 200e3 }, zvs: 'ignore', derating: 1 });
  });

  it('reports each bad value at file:line:col with its path, all at once', () => {
    const L = BASE_LINES + 2; // first line inside limits
    expect(problems(withLimits([
      '  frequency: { min: 160 kHz, max: 150 kHz }',
      '  zvs: requried',
      '  zvsMargin: -5%',
      '  crVoltage: 450 A',
      '  tankCurrentRms: 3 kA',
      '  derating: 120%',
      '  diodeCurrentRms: 15M',
      '  switchCurrentRms: 5 GA',
    ].join('\n')))).toEqual([
      `d.yaml:${L}:35: limits.frequency.max: the window is empty: max (150 kHz) must be above min (160 kHz)`,
      `d.yaml:${L + 1}:8: limits.zvs: expected "required" or "ignore", got "requried": did you mean "required"?`,
      `d.yaml:${L + 2}:14: limits.zvsMargin: expected a fraction >= 0 and <= 1000% such as "20%", got "-5%"`,
      `d.yaml:${L + 3}:14: limits.crVoltage: expected a voltage > 0 V such as "450 V", got "450 A": has the unit of current (A), not V`,
      `d.yaml:${L + 5}:13: limits.derating: expected a fraction > 0 and <= 100% such as "80%", got "120%": must be at most 100%`,
      `d.yaml:${L + 6}:20: limits.diodeCurrentRms: expected a current > 0 A such as "15 A", got "15M": is ambiguous: a bare "M" is milli in SPICE but mega in SI; write "15m" for milli or "15meg" for mega`,
      `d.yaml:${L + 7}:21: limits.switchCurrentRms: implausible value "5 GA" (5 GA), outside 1 uA .. 100 kA; check the unit prefix`,
    ]);
  });

  it('unknown keys get "did you mean", inside limits and inside the window', () => {
    const L = BASE_LINES + 2;
    expect(problems(withLimits('  crVoltag: 450 V\n  frequency: { mn: 60 kHz }\n  deratng: 80%'))).toEqual([
      `d.yaml:${L}:3: limits.crVoltag: unknown key "crVoltag"; did you mean "crVoltage"?`,
      `d.yaml:${L + 1}:14: limits.frequency: give min, max or both, such as "{ min: 60 kHz, max: 150 kHz }"`,
      `d.yaml:${L + 1}:16: limits.frequency.mn: unknown key "mn"; did you mean "min"?`,
      `d.yaml:${L + 2}:3: limits.deratng: unknown key "deratng"; did you mean "derating"?`,
    ]);
  });

  it('a misspelt section name is caught at the root', () => {
    expect(problems(`${base}\nlimit:\n  crVoltage: 450 V`)).toEqual([`d.yaml:${BASE_LINES + 1}:1: limit: unknown key "limit"; did you mean "limits"?`]);
  });

  it('wrong shapes: a list, a scalar window, an empty section', () => {
    const L = BASE_LINES + 2;
    expect(problems(withLimits('  frequency: 60 kHz'))).toEqual([
      `d.yaml:${L}:14: limits.frequency: expected a mapping with keys min, max such as "{ min: 60 kHz, max: 150 kHz }", got "60 kHz"`,
    ]);
    expect(problems(`${base}\nlimits:`)[0]).toMatch(new RegExp(`^d\\.yaml:${BASE_LINES + 1}:1: limits: expected a mapping`));
  });

  it('the JSON Schema describes the section (every key, the zvs words, the derating default)', () => {
    const p = (designJsonSchema.properties as Record<string, any>).limits;
    expect(p.properties.zvs.enum).toEqual(['required', 'ignore']);
    expect(p.properties.derating.default).toBe('100%');
    expect(Object.keys(parse(withLimits('  crVoltage: 450 V')).limits)).toEqual(['crVoltage']);
  });
});

describe('compare by metric', () => {
  const withCompare = (lines: string): string => demo.replace(/^compare:\n(?: .*\n)*/m, `compare:\n${lines}\n`);
  it('keeps the group keys and accepts metrics by name and "off"', () => {
    const d = design(withCompare('  currents: 10%\n  magnetizingCurrentPeak: 30%\n  switchTurnOffCurrent: off\n  zvs: off'));
    expect(d.compare).toEqual({ vout: 0.03, fs: 0.05, gain: 0.03, currents: 0.1, voltages: 0.1, measured: 0.05,
      metrics: { magnetizingCurrentPeak: 0.3, switchTurnOffCurrent: 'off', zvs: 'off' } });
  });
  it('a group set to off turns off its metrics that have no setting of their own', () => {
    const d = design(withCompare('  voltages: off\n  crVoltagePeak: 15%'));
    expect(d.compare.voltages).toBe(0.1);
    expect(d.compare.metrics).toEqual({ crVoltagePeak: 0.15, diodeReverseVoltage: 'off' });
  });
  it('without per-metric keys the compare value has no metrics field (older results unchanged)', () => {
    expect(design(demo).compare.metrics).toBeUndefined();
  });
  it('reports bad tolerances, "OFF", a tolerance on a yes/no metric and misspelt metrics', () => {
    const out = problems(withCompare('  magnetizingCurrentPeek: 30%\n  tankCurrentRms: 150%\n  diodeCurrentRms: OFF\n  zcs: 5%'));
    expect(out.map((l) => l.replace(/^d\.yaml:\d+:\d+: /, ''))).toEqual([
      'compare.magnetizingCurrentPeek: unknown key "magnetizingCurrentPeek"; did you mean "magnetizingCurrentPeak"?',
      'compare.tankCurrentRms: expected a fraction > 0 and <= 100% such as "10%", got "150%": must be at most 100%',
      'compare.diodeCurrentRms: expected a fraction > 0 and <= 100% such as "10%", or "off", got "OFF": did you mean "off"?',
      'compare.zcs: expected "off" (a yes/no metric has no tolerance), got "5%"',
    ]);
    expect(out.every((l) => /^d\.yaml:\d+:\d+: compare\./.test(l))).toBe(true);
  });
});
