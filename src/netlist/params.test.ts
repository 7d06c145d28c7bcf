import { describe, expect, it } from 'vitest';
import { buildDeck } from './deck.js';
import { fhaSeed } from './fhaState.js';
import { withHandMeasurements } from './hand.js';
import { braceExpression, checkDeckExpressions, paramLines, RESERVED_NAMES } from './params.js';
import { parseSpiceNumber } from './rewrite.js';
import { expandCorners } from '../corners/expand.js';
import { predictCorner } from '../fha/predict.js';
import { makeDesign } from '../../tests/support/design.js';
import type { Design } from '../design/types.js';

/** Evaluates a deck's .param block in order, as ngspice does (min, max, sqrt; * / + - and parentheses). */
function evaluate(deck: string): Record<string, number> {
  const p: Record<string, number> = {};
  for (const [, name, value] of deck.matchAll(/^\.param ([a-z][a-z0-9_]*)=(.+)$/gm)) {
    p[name!] = value!.startsWith('{') ? evalExpr(value!.slice(1, -1), p) : parseSpiceNumber(value!);
  }
  return p;
}

function evalExpr(expr: string, p: Record<string, number>): number {
  const js = expr.replace(/(?<![0-9.e])([a-z_][a-z0-9_]*)/g, (id) => (['min', 'max', 'sqrt'].includes(id) ? `Math.${id}` : `p.${id}`));
  return new Function('p', `return ${js};`)(p) as number;
}

function deckOf(d: Design, cycles = 30, saveCycles = 20) {
  const [c] = expandCorners(d);
  const fs = c!.fs!;
  return { corner: c!, fs, deck: buildDeck({ design: d, corner: c!, fs, seed: fhaSeed(d, c!, fs, predictCorner(d, c!).vout!), cycles, saveCycles }) };
}

describe('the .param block', () => {
  const d = makeDesign({ tank: { lr: 63e-6, cr: 47e-9, lm: 280e-6, turnsRatio: 4.2, integrated: true }, operating: { frequency: [97.3e3] },
    rectifier: { forwardVoltage: 0.7, resistance: 0.01 } });
  const { corner, fs, deck } = deckOf(d);
  const p = evaluate(deck.text);

  it('holds the corner inputs as written, each reading back within 1e-12 of the value used', () => {
    const want = { vin: corner.vin, fs, lr: corner.lr, cr: corner.cr, lm: corner.lm, turns: 4.2, tdead: d.switches.deadTime,
      coss: d.switches.coss, rdson: d.switches.rdsOn, rload: corner.load, cout: d.output.capacitance, esr: d.output.esr, vf: 0.7, rdiode: 0.01 };
    for (const [k, v] of Object.entries(want)) expect(Math.abs(p[k]! - v) / v, k).toBeLessThanOrEqual(1e-12);
    expect(deck.text).toMatch(/^\.param fs=97\.3k$/m);
    expect(deck.text).toMatch(/^\.param lr=63u$/m);
  });

  it('derives the period, time window and transformer from them (integrated: Lp = Lr + Lm, k = sqrt(Lm / (Lr + Lm)), Ls = Lp / (Np/Ns)^2 = Lm / n_e^2)', () => {
    expect(p['period']).toBeCloseTo(1 / fs, 18);
    expect(p['tstop']! / deck.tstop).toBeCloseTo(1, 12);
    expect(p['tstart']! / deck.tstart).toBeCloseTo(1, 12);
    expect(p['ls']! / (corner.lm / corner.turnsRatio ** 2)).toBeCloseTo(1, 12);
    expect(p['ls']! / ((corner.lr + corner.lm) / 4.2 ** 2)).toBeCloseTo(1, 12);
    expect(p['lp']! / (corner.lr + corner.lm)).toBeCloseTo(1, 12);
    // coupling of an integrated transformer: leakage Lr = (1 - k^2) Lp (common practice, textbook two-winding model)
    expect((1 - p['kps']! ** 2) * p['lp']! / corner.lr).toBeCloseTo(1, 12);
  });

  it('changing one line (fs) moves every time quantity with it', () => {
    const edited = evaluate(deck.text.replace(/^\.param fs=.*$/m, '.param fs=120k'));
    expect(edited['period']).toBeCloseTo(1 / 120e3, 18);
    for (const k of ['tstop', 'tstart', 'tstep', 'gwidth', 'gedge']) expect(Number.isFinite(edited[k]!) && Math.abs(edited[k]! / p[k]! - 1) > 0.1, k).toBe(true);
    expect(edited['tstop']! * 120e3).toBeCloseTo(30, 9);
    expect(edited['ls']).toBe(p['ls']);
  });

  it('uses no name ngspice reserves, and every brace expression only names declared parameters', () => {
    const names = [...deck.text.matchAll(/^\.param ([a-z0-9_]+)=/gm)].map((m) => m[1]!);
    expect(names.filter((n) => RESERVED_NAMES.has(n))).toEqual([]);
    expect(new Set(names).size).toBe(names.length);
    expect(() => checkDeckExpressions(withHandMeasurements(deck, 10))).not.toThrow();
    const hand = withHandMeasurements(deck, 10);
    const ph = evaluate(hand);
    for (const e of [...hand.matchAll(/\{([^}]*)\}/g)].map((m) => m[1]!)) expect(evalExpr(e, ph), e).toBeGreaterThan(0);
    // gate timing as before the parameters: delays td - edge/2 and T/2 + td - edge/2, width T/2 - td - edge
    const edge = Math.min(d.switches.deadTime / 10, 1 / fs / 1000);
    expect(evalExpr('tdead-gedge/2', p)).toBeCloseTo(d.switches.deadTime - edge / 2, 20);
    expect(evalExpr('period/2+tdead-gedge/2', p)).toBeCloseTo(0.5 / fs + d.switches.deadTime - edge / 2, 20);
    expect(p['gwidth']).toBeCloseTo(0.5 / fs - d.switches.deadTime - edge, 20);
  });

  it('refuses reserved or malformed names, unknown names and unsafe characters in expressions', () => {
    expect(() => paramLines([['ln', 1]])).toThrow(/unusable parameter name/);
    expect(() => paramLines([['pi', 1]])).toThrow(/unusable/);
    expect(() => paramLines([['Fs', 1]])).toThrow(/unusable/);
    expect(() => paramLines([['a', 1], ['a', 2]])).toThrow(/twice/);
    expect(() => paramLines([['b', { expr: 'a*2' }]])).toThrow(/unknown name a/);
    expect(() => braceExpression('exp(a)', new Set(['a']))).toThrow(/unknown function exp/);
    expect(() => braceExpression('a}\n.control', new Set(['a']))).toThrow(/unsafe/);
    expect(() => checkDeckExpressions('.param a=1\nR1 x 0 {a*b}\n')).toThrow(/unknown name b/);
    expect(paramLines([['a', 2.5e-6], ['b', { expr: 'a*1e-9+max(a, 2)' }]])).toBe('.param a=2.5u\n.param b={a*1e-9+max(a, 2)}');
  });
});
