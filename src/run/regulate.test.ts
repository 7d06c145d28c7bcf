import { describe, expect, it } from 'vitest';
import { deadTimeProblem, peakBracket } from './regulate.js';

describe('peakBracket: the target above the peak gain', () => {
  // The output rises with frequency in the capacitive region and falls in the inductive one
  // (common practice for the LLC gain curve), so the peak lies between a capacitive point and an
  // inductive point above it in frequency.
  it('a capacitive point and an inductive point above it, both below the target, bracket the peak', () => {
    expect(peakBracket([{ fs: 48e3, v: 19.8, region: 'capacitive' }, { fs: 55e3, v: 19.1, region: 'inductive' }], 24)).toEqual([48e3, 55e3]);
  });
  it('no bracket while every point is on one side, or a point between reaches the target', () => {
    expect(peakBracket([{ fs: 48e3, v: 19.8, region: 'capacitive' }, { fs: 40e3, v: 15, region: 'capacitive' }], 24)).toBeNull();
    expect(peakBracket([{ fs: 80e3, v: 23, region: 'inductive' }, { fs: 70e3, v: 23.5, region: 'inductive' }], 24)).toBeNull();
    expect(peakBracket([{ fs: 48e3, v: 19.8, region: 'capacitive' }, { fs: 60e3, v: 19, region: 'inductive' }, { fs: 52e3, v: 24.5, region: 'inductive' }], 24)).toBeNull();
  });
});

describe('deadTimeProblem: the fixed-frequency rule at any frequency', () => {
  it('accepts td < T/2 and names the frequency and half period otherwise', () => {
    expect(deadTimeProblem(200e-9, 100e3)).toBeNull();
    expect(deadTimeProblem(6e-6, 114.2e3)).toMatch(/dead time 6 us is not shorter than half the switching period at 114.2 kHz \(4.378 us\)/);
    expect(deadTimeProblem(5e-6, 100e3)).not.toBeNull(); // exactly half: refused, as in the design check
  });
});
