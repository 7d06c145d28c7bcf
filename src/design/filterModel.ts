import { quote, type Problem } from './problem.js';

/** Outcome of the model-file line filter: the text (LF line ends) and the model/subcircuit names it defines. */
export type FilterResult = { ok: true; text: string; names: string[] } | { ok: false; problems: Problem[] };

/**
 * Line starts refused anywhere (after leading whitespace, any case). `.control`/`.endc` blocks and
 * `*ng_script` run interpreter commands (native ngspice executes `shell` from them, even from an
 * included file or after `.end`); includes would pull in files we have not filtered.
 */
const BANNED: readonly [string, string][] = [
  ['.control', 'a .control block runs simulator commands'],
  ['.endc', 'a .control block runs simulator commands'],
  ['*ng_script', 'an ng_script file runs simulator commands'],
  ['.include', 'includes would read files that were not checked; paste the models instead'],
  ['.inc', 'includes would read files that were not checked; paste the models instead'],
  ['.lib', 'library includes would read files that were not checked; paste the models instead'],
  ['shell', 'shell commands are never allowed'],
];
const TOP_LEVEL = ['.model', '.subckt'];
const IN_SUBCKT = ['.model', '.subckt', '.ends', '.param', '.func'];
const MAX_PROBLEMS = 50;

/** First character that is not printable ASCII (tab allowed), described for a message. */
function badChar(line: string): { column: number; what: string } | undefined {
  for (let i = 0; i < line.length; i++) {
    const c = line.charCodeAt(i);
    if (c === 9 || (c >= 0x20 && c <= 0x7e)) continue;
    const hex = c.toString(16).toUpperCase().padStart(2, '0');
    const what = c < 0x20 || c === 0x7f ? `control character 0x${hex}` : c <= 0xff ? `non-ASCII byte 0x${hex}` : `non-ASCII character U+${hex.padStart(4, '0')}`;
    return { column: i + 1, what };
  }
  return undefined;
}

/**
 * Check a device model file (vendor `.model` / `.subckt` text) before it is pasted into a netlist.
 * Pure. Refused, each with its line: any non-ASCII byte or control character (tab excepted);
 * lines starting with `.control`, `.endc`, `*ng_script`, `.include`, `.inc`, `.lib`, `shell`;
 * `.end` and anything after it; a `+` continuation before the file's first card (it would extend a line of
 * the deck); dot commands other than `.model`/`.subckt` at top level (and
 * `.ends`/`.param`/`.func` inside a subcircuit); device lines outside a `.subckt`; unbalanced
 * `.subckt`/`.ends`. At least one `.model` or `.subckt` is required. `file` names the model file
 * in the problems; `path` is the design key that referenced it.
 */
export function filterModelText(text: string, file: string, path = ''): FilterResult {
  const problems: Problem[] = [];
  const add = (line: number, column: number, received: string, message: string): void => {
    problems.push({ code: 'model', path, line, column, expected: 'model or subcircuit definitions only', received: received === '' ? '' : quote(received), message, file });
  };
  const lines = text.replace(/\r\n/g, '\n').split('\n');
  const names: string[] = [];
  const opened: number[] = [];
  let endLine = 0;
  // A '+' line continues the line before it; before this file's first card that would be a line of our deck
  let hasCard = false;
  lines.forEach((raw, i) => {
    const n = i + 1;
    const trimmed = raw.trim();
    const low = trimmed.toLowerCase();
    const bad = badChar(raw);
    if (bad) return add(n, bad.column, raw, `${bad.what}; model files must be plain ASCII`);
    if (trimmed === '') return;
    if (endLine > 0) return add(n, 1, raw, `text after .end (line ${endLine}) is not allowed`);
    const banned = BANNED.find(([start]) => low.startsWith(start));
    if (banned) return add(n, raw.length - raw.trimStart().length + 1, raw, `"${banned[0]}" is not allowed in a model file: ${banned[1]}`);
    if (/^\.end(\s|$)/.test(low)) {
      endLine = n;
      return add(n, 1, raw, '.end is not allowed in a model file; tankcheck ends the netlist itself');
    }
    if (low.startsWith('*')) return;
    if (low.startsWith('+')) {
      if (!hasCard) add(n, 1, raw, 'a continuation line (+) must follow a card of this file; here it would continue a line of the netlist tankcheck writes');
      return;
    }
    hasCard = true;
    const word = low.split(/[\s(]/)[0];
    if (word.startsWith('.')) {
      const allowed = opened.length > 0 ? IN_SUBCKT : TOP_LEVEL;
      if (!allowed.includes(word)) {
        return add(n, 1, raw, `"${word}" is not allowed here; a model file may hold ${opened.length > 0 ? 'inside a subcircuit only devices and .model, .subckt, .ends, .param, .func' : 'at top level only .model and .subckt definitions'}`);
      }
      // only top-level definitions can be instantiated by the netlist; models inside a subcircuit are local
      const name = trimmed.split(/[\s(]+/)[1];
      if (opened.length === 0 && (word === '.model' || word === '.subckt') && name) names.push(name);
      if (word === '.subckt') opened.push(n);
      if (word === '.ends') opened.pop();
      return;
    }
    if (opened.length === 0) add(n, 1, raw, 'a device line outside a .subckt would add a part to the circuit; only definitions are allowed');
  });
  for (const n of opened) add(n, 1, '', '.subckt is never closed by .ends');
  if (names.length === 0 && problems.length === 0) add(0, 0, '', 'no .model or .subckt definition found');
  if (problems.length > MAX_PROBLEMS) {
    const more = problems.length - MAX_PROBLEMS;
    problems.length = MAX_PROBLEMS;
    add(0, 0, '', `and ${more} more problems in this file`);
  }
  return problems.length > 0 ? { ok: false, problems } : { ok: true, text: lines.join('\n'), names };
}
