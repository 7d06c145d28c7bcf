import { describe, expect, it } from 'vitest';
import { readFileSync, writeFileSync, existsSync } from 'node:fs';
import { buildDeck } from './deck.js';
import { fhaSeed } from './fhaState.js';
import { parseSpiceNumber } from './rewrite.js';
import { diodeFit, THERMAL_VOLTAGE } from './devices.js';
import { expandCorners } from '../corners/expand.js';
import { predictCorner } from '../fha/predict.js';
import { makeDesign } from '../../tests/support/design.js';
import type { Design } from '../design/types.js';
import { TEMPLATES } from './templateText.js';
import { generate } from '../../scripts/gen-templates.mjs';
import { sharedFile } from '../../tests/support/shared.js';

const topologies = [
  ['half-bridge', 'center-tapped'], ['half-bridge', 'full-bridge'], ['full-bridge', 'center-tapped'], ['full-bridge', 'full-bridge'],
] as const;

function deckFor(d: Design) {
  const [c] = expandCorners(d);
  const f = predictCorner(d, c!);
  return buildDeck({ design: d, corner: c!, fs: c!.fs!, seed: fhaSeed(d, c!, c!.fs!, f.vout!), cycles: 30, saveCycles: 20 });
}

const normalise = (s: string) => s.split('\n').map((l) => l.trim().replace(/\s+/g, ' ')).filter(Boolean).join('\n');

describe('golden decks (normalised text)', () => {
  for (const [inverter, rectifier] of topologies) {
    for (const integrated of [false, true]) {
      const name = `${inverter}_${rectifier}${integrated ? '_integrated' : ''}.cir`;
      it(name, () => {
        const d = makeDesign({ name: 'golden', topology: { inverter, rectifier }, tank: { lr: 50e-6, cr: 50e-9, lm: 250e-6, turnsRatio: 4, integrated },
          rectifier: { forwardVoltage: 0.7, resistance: 0.01 } });
        const text = deckFor(d).text;
        const file = sharedFile('golden', name);
        // A missing golden is a failure, never silently created: only UPDATE_GOLDEN=1 writes them.
        if (process.env['UPDATE_GOLDEN']) writeFileSync(file, text);
        expect(existsSync(file), `shared/golden/${name} is missing; write it with UPDATE_GOLDEN=1 and review it`).toBe(true);
        expect(normalise(text)).toBe(normalise(readFileSync(file, 'utf8')));
      });
    }
  }
});

describe('deck hygiene (SPICE number pitfalls: ngspice manual, "Some naming conventions")', () => {
  const d = makeDesign({ topology: { inverter: 'full-bridge', rectifier: 'full-bridge' } });
  const text = deckFor(d).text;
  it('is 7-bit ASCII, ends with .end and has no control block, include or interpolation option', () => {
    expect(/^[\x09\x0a\x20-\x7e]*$/.test(text)).toBe(true);
    expect(text.trimEnd().endsWith('.end')).toBe(true);
    expect(text).not.toMatch(/^\s*\.(control|endc|include|inc|lib)\b/im);
    expect(text).not.toMatch(/interp/i);
  });
  it('takes every circuit value from the .param block: element lines hold only expressions, initial conditions and fixed constants', () => {
    const elements = text.split('\n').filter((l) => /^[A-Z]/.test(l));
    for (const line of elements) {
      const rest = line.replace(/\{[^}]*\}/g, '').replace(/ ic=-?[0-9.]+(e-?\d+)?[a-z]*/g, '').split(/[\s()=]+/).slice(3);
      for (const v of rest.filter((x) => /^[0-9.+-]/.test(x))) expect(v, line).toMatch(/^(0|1|12|2|1e7|1e8|1e9)$/);
    }
    for (const m of text.matchAll(/ ic=(\S+)/g)) expect(Number.isFinite(parseSpiceNumber(m[1]!)), m[0]).toBe(true);
  });
  it('uses trapezoidal integration only with a tightened reltol (trap at reltol 1e-3 rang in a time-step study during development)', () => {
    const m = /method=(\w+) reltol=(\S+)/.exec(text)!;
    if (m[1] === 'trap') expect(parseSpiceNumber(m[2]!)).toBeLessThanOrEqual(1e-4);
  });
  it('a design name carrying a newline and a control block cannot inject lines', () => {
    const evil = makeDesign({ name: 'x\n.control\nshell touch /tmp/pwned\n.endc\n.include /etc/passwd' });
    const t = deckFor(evil).text;
    expect(t).not.toMatch(/^\s*\.(control|endc|include)/im);
    expect(t).not.toMatch(/^\s*shell/im);
    expect(t.split('\n').length).toBe(deckFor(makeDesign({ name: 'x' })).text.split('\n').length);
  });
  it('templateText.ts is generated from templates/*.cir and up to date', () => {
    expect(readFileSync(new URL('./templateText.ts', import.meta.url), 'utf8')).toBe(generate());
    expect(Object.keys(TEMPLATES).length).toBe(8);
  });
});

describe('fitted rectifier diode', () => {
  it('drops forwardVoltage + I rs at the rated current (Shockley diode equation, common practice)', () => {
    const d = makeDesign({ rectifier: { forwardVoltage: 0.6, resistance: 0.008 }, operating: { ratedPower: 200, vin: [400], load: [{ kind: 'ohm', value: 4 }], frequency: [90e3], corners: [] }, output: { voltage: 24, capacitance: 1e-4, esr: 0.01 } });
    const f = diodeFit(d);
    const i = 200 / 24;
    const v = f.n * THERMAL_VOLTAGE * Math.log(i / f.is + 1) + i * f.rs;
    expect(v).toBeCloseTo(0.6 + i * 0.008, 9);
    expect(f.is / i).toBeLessThanOrEqual(1e-9); // reverse leakage stays negligible
  });
});
