import { describe, expect, it } from 'vitest';
import { EXIT, EXIT_TABLE, exitCodeFor, renderExitTable } from './exit.js';
import type { Results } from '../results/types.js';

const results = (over: Partial<Results['summary']>, corners: unknown[] = [], extra: Partial<Results> = {}): Results =>
  ({ corners, summary: { failed: 0, ...over }, ...extra } as unknown as Results);
const explained = { id: 'a', status: 'diverged', checks: [], divergences: [{ metric: 'gain', cause: 'approximation' }] };

describe('exit codes', () => {
  it('one table with every code, in code order', () => {
    expect(EXIT_TABLE.map((e) => e.code)).toEqual(Object.values(EXIT).sort((a, b) => a - b));
    expect(renderExitTable().split('\n')).toHaveLength(EXIT_TABLE.length);
  });
  it('interrupted > failed > checks; explained divergences pass unless failOn divergence', () => {
    expect(exitCodeFor(results({}, [explained]))).toBe(EXIT.ok);
    expect(exitCodeFor(results({}, [explained]), 'divergence')).toBe(EXIT.diverged);
    expect(exitCodeFor(results({}, [{ ...explained, divergences: [{ metric: 'gain' }] }]))).toBe(EXIT.diverged);
    expect(exitCodeFor(results({ failed: 1 }, [{ ...explained, status: 'failed' }]))).toBe(EXIT.failed);
    expect(exitCodeFor(results({}, [], { incomplete: true }))).toBe(EXIT.interrupted);
  });
});
