import { describe, expect, it } from 'vitest';
import { parseLoad } from './parseLoad.js';

describe('parseLoad', () => {
  it('reads each load kind in SI units', () => {
    expect(parseLoad('25%')).toEqual({ ok: true, value: { kind: 'percent', value: 0.25 } });
    expect(parseLoad('100 %')).toEqual({ ok: true, value: { kind: 'percent', value: 1 } });
    expect(parseLoad('12 ohm')).toEqual({ ok: true, value: { kind: 'ohm', value: 12 } });
    expect(parseLoad('1.2 kohm')).toEqual({ ok: true, value: { kind: 'ohm', value: 1200 } });
    expect(parseLoad('2 Mohm')).toEqual({ ok: true, value: { kind: 'ohm', value: 2e6 } });
    expect(parseLoad('5 A')).toEqual({ ok: true, value: { kind: 'ampere', value: 5 } });
    expect(parseLoad('300mA')).toEqual({ ok: true, value: { kind: 'ampere', value: 0.3 } });
    expect(parseLoad('120 W')).toEqual({ ok: true, value: { kind: 'watt', value: 120 } });
    expect(parseLoad('1.5 kW')).toEqual({ ok: true, value: { kind: 'watt', value: 1500 } });
  });
  it('requires a unit: a bare number is ambiguous', () => {
    const r = parseLoad('12');
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toContain('no unit');
    expect(parseLoad(12).ok).toBe(false);
    expect(parseLoad('12k').ok).toBe(false);
  });
  it('refuses units that are not a load and the bare M', () => {
    const v = parseLoad('24 V');
    expect(v.ok).toBe(false);
    if (!v.ok) expect(v.message).toContain('"V"');
    const m = parseLoad('22M');
    expect(m.ok).toBe(false);
    if (!m.ok) expect(m.message).toContain('"22meg"');
    expect(parseLoad('').ok).toBe(false);
    expect(parseLoad('NaN%').ok).toBe(false);
    expect(parseLoad('4k7 ohm').ok).toBe(false);
  });
});
