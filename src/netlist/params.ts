/**
 * The `.param` block at the top of every deck: the corner's inputs as numbers, then the run length,
 * then everything derived from them as brace expressions, so that editing one input line changes
 * the whole deck consistently. Only validated numbers and our own expressions over declared names
 * reach the text (nothing from a design file but numbers).
 */
import { formatSpiceEng } from '../units/format.js';

/** A parameter: a number, or an expression over earlier parameters written in braces. */
export type ParamValue = number | { expr: string };
export type ParamEntry = readonly [name: string, value: ParamValue];

/**
 * Names ngspice gives a meaning of its own in expressions (functions, constants, operators and the
 * B-source variables, from memory of the ngspice manual's "Parameters, functions, expressions"
 * chapter), plus the scale suffixes; a deck parameter must not shadow any of them.
 */
export const RESERVED_NAMES: ReadonlySet<string> = new Set([
  'abs', 'acos', 'acosh', 'agauss', 'and', 'asin', 'asinh', 'atan', 'atan2', 'atanh', 'aunif', 'boltz', 'ceil', 'cos',
  'cosh', 'ddt', 'def', 'defined', 'div', 'e', 'echarge', 'else', 'end', 'exp', 'false', 'floor', 'gauss', 'hertz', 'i',
  'if', 'int', 'kelvin', 'limit', 'ln', 'log', 'log10', 'max', 'min', 'mod', 'nint', 'no', 'not', 'or', 'pi', 'planck',
  'pow', 'pwr', 'pwrs', 'sgn', 'sin', 'sinh', 'sqr', 'sqrt', 'stp', 'table', 'tan', 'tanh', 'temper', 'ternary_fcn',
  'time', 'true', 'u', 'u2', 'unif', 'uramp', 'v', 'var', 'vt', 'yes', 'f', 'p', 'n', 'm', 'k', 'g', 't', 'meg', 'mil',
]);

/** Functions the deck's own expressions may call (each exists in ngspice 39 and 45). */
const FUNCTIONS = new Set(['min', 'max', 'sqrt']);
const NAME = /^[a-z][a-z0-9_]*$/;
const EXPR = /^[a-z0-9_ ()*/+.,-]+$/;

/** Checks a parameter name: lower-case identifier, not reserved by ngspice. */
export function checkParamName(name: string): void {
  if (!NAME.test(name) || RESERVED_NAMES.has(name)) throw new Error(`netlist: unusable parameter name ${JSON.stringify(name)}`);
}

/**
 * Checks an expression: only our arithmetic characters, and every identifier one of `known` or an
 * allowed function. Numbers inside expressions are written in plain notation (`1e-9`), never with a
 * scale suffix. Returns the expression in braces.
 */
export function braceExpression(expr: string, known: ReadonlySet<string>): string {
  if (!EXPR.test(expr)) throw new Error(`netlist: unsafe expression ${JSON.stringify(expr)}`);
  for (const m of expr.matchAll(/(?<![0-9.e])([a-z_][a-z0-9_]*)(\s*\()?/g)) {
    const [, id, call] = m;
    if (call ? !FUNCTIONS.has(id!) : !known.has(id!)) throw new Error(`netlist: expression ${JSON.stringify(expr)} uses unknown ${call ? 'function' : 'name'} ${id}`);
  }
  return `{${expr}}`;
}

/** `.param name=value` lines, one parameter per line; names may only use names declared before them. */
export function paramLines(entries: readonly ParamEntry[], declared: Set<string> = new Set()): string {
  const out: string[] = [];
  for (const [name, value] of entries) {
    checkParamName(name);
    if (declared.has(name)) throw new Error(`netlist: parameter ${name} declared twice`);
    const text = typeof value === 'number' ? formatSpiceEng(value) : braceExpression(value.expr, declared);
    declared.add(name);
    out.push(`.param ${name}=${text}`);
  }
  return out.join('\n');
}

/**
 * Checks every brace expression of a rendered deck against the parameters it declares (a typo in a
 * template would otherwise surface only as an ngspice error). Throws on the first bad one.
 */
export function checkDeckExpressions(deck: string): void {
  const declared = new Set([...deck.matchAll(/^\.param ([a-z][a-z0-9_]*)=/gm)].map((m) => m[1]!));
  for (const m of deck.matchAll(/\{([^{}\n]*)\}/g)) braceExpression(m[1]!, declared);
}
