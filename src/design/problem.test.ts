import { describe, expect, it } from 'vitest';
import { didYouMean, formatProblem, quote, type Problem } from './problem.js';

const p = (over: Partial<Problem>): Problem => ({ code: 'value', path: 'tank.lm', line: 9, column: 7, expected: '', received: '', message: 'm', ...over });

describe('formatProblem', () => {
  it('renders file:line:column: path: message, and leaves out what is unknown', () => {
    expect(formatProblem(p({}), 'demo.yaml')).toBe('demo.yaml:9:7: tank.lm: m');
    expect(formatProblem(p({ line: 0, column: 0 }), 'demo.yaml')).toBe('demo.yaml: tank.lm: m');
    expect(formatProblem(p({ line: 0, column: 0, path: '' }), 'demo.yaml')).toBe('demo.yaml: m');
    expect(formatProblem(p({ path: '' }), 'demo.yaml')).toBe('demo.yaml:9:7: m');
    expect(formatProblem(p({ file: 'models/d.lib', line: 3, column: 1 }), 'demo.yaml')).toBe('models/d.lib:3:1: tank.lm: m');
  });
});

describe('quote', () => {
  it('escapes control characters, quotes and backslashes, and shortens long text', () => {
    expect(quote('a\nb\u0000"\\')).toBe('"a\\u000ab\\u0000\\"\\\\"');
    expect(quote('x'.repeat(50))).toBe(`"${'x'.repeat(40)}..."`);
  });
});

describe('didYouMean', () => {
  const keys = ['lr', 'cr', 'lm', 'turnsRatio', 'integrated'];
  it('finds case, separator and one-letter slips', () => {
    expect(didYouMean('Lm', keys)).toBe('lm');
    expect(didYouMean('turns_ratio', keys)).toBe('turnsRatio');
    expect(didYouMean('turnratio', keys)).toBe('turnsRatio');
    expect(didYouMean('integrate', keys)).toBe('integrated');
    expect(didYouMean('lx', keys)).toBe('lr');
  });
  it('stays quiet for unrelated words', () => {
    expect(didYouMean('frequency', keys)).toBeUndefined();
    expect(didYouMean('voltage', keys)).toBeUndefined();
  });
});
