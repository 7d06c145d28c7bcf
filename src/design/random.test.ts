// The Monte Carlo keys of `tolerances` and `simulation.confirm`: values, defaults and problems at file:line:col.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseDesign } from './parse.js';
import { formatProblem } from './problem.js';

const demo = readFileSync(new URL('../../examples/demo.yaml', import.meta.url), 'utf8');
const withTolerances = (block: string): string => demo.replace(/^tolerances:[\s\S]*?(?=compare:)/m, `tolerances:\n${block}\n`);
const parse = (text: string) => parseDesign(text, 'd.yaml');
const report = (text: string): string[] => {
  const r = parse(text);
  return r.ok ? r.warnings.map((p) => formatProblem(p, 'd.yaml')) : r.problems.map((p) => formatProblem(p, 'd.yaml'));
};

describe('tolerances: corners random', () => {
  it('reads samples, seed, distribution and the turns-ratio tolerance', () => {
    const r = parse(withTolerances('  lr: 5%\n  cr: 5%\n  lm: 10%\n  turnsRatio: 0.5%\n  corners: random\n  samples: 500\n  seed: 42\n  distribution: normal'));
    if (!r.ok) throw new Error(r.problems.map((p) => p.message).join('\n'));
    expect(r.design.tolerances).toEqual({ lr: 0.05, cr: 0.05, lm: 0.1, turnsRatio: 0.005, corners: 'random', samples: 500, seed: 42, distribution: 'normal' });
    expect(r.warnings).toEqual([]);
  });

  it('reports bad values at their line and column', () => {
    const lines = report(withTolerances('  cr: 5%\n  corners: random\n  samples: 2.5\n  seed: -1\n  distribution: gaussian'));
    // the tolerances block starts on line 29 of the demo
    expect(lines).toEqual([
      'd.yaml:32:12: tolerances.samples: expected a whole number > 0 such as "500", got "2.5": must be a whole number',
      'd.yaml:33:9: tolerances.seed: expected a whole number >= 0 such as "42", got "-1"',
      'd.yaml:34:17: tolerances.distribution: expected "uniform" or "normal", got "gaussian"',
    ]);
  });

  it('refuses more than 100000 samples and a misspelt mode', () => {
    expect(report(withTolerances('  corners: randm\n  samples: 200000'))).toEqual([
      'd.yaml:30:12: tolerances.corners: expected "extremes" or "nominal" or "random", got "randm": did you mean "random"?',
      'd.yaml:31:12: tolerances.samples: expected a whole number > 0 such as "500", got "200000": must be at most 100 k',
    ]);
  });

  it('warns when a random-mode key is given without corners: random', () => {
    expect(report(withTolerances('  cr: 5%\n  corners: extremes\n  seed: 7'))).toEqual([
      'd.yaml:32:9: tolerances.seed: tolerances.seed has an effect only with tolerances.corners: random',
    ]);
  });

  it('reads simulation.confirm, default 20', () => {
    const r = parse(`${demo}\nsimulation:\n  confirm: 0\n`);
    expect(r.ok && r.design.simulation.confirm).toBe(0);
    const d = parse(demo);
    expect(d.ok && d.design.simulation.confirm).toBe(20);
  });
});
