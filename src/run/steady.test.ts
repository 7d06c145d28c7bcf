import { describe, expect, it } from 'vitest';
import { APPROACH_CYCLES, CHECK_CYCLES, MAX_CHECK_CYCLES, PLAIN_CHECK_CYCLES } from './steady.js';
import { EXTRAPOLATION_STATES } from '../periodic/index.js';

describe('simulateSteady run lengths', () => {
  it('the first run holds the states the extrapolation reads and a whole check window after the fast modes', () => {
    // EXTRAPOLATION_STATES boundary states need that many minus one cycles; the first two cycles
    // carry the fast tank modes of the start and are left out of the extrapolation.
    expect(APPROACH_CYCLES + 1 - EXTRAPOLATION_STATES).toBeGreaterThanOrEqual(2);
    expect(APPROACH_CYCLES).toBeGreaterThanOrEqual(CHECK_CYCLES);
  });

  it('every check window has two equal halves of whole cycles', () => {
    for (const c of [CHECK_CYCLES, 2 * CHECK_CYCLES, MAX_CHECK_CYCLES, PLAIN_CHECK_CYCLES]) expect(c % 2).toBe(0);
  });
});
