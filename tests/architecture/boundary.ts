import { builtinModules } from 'node:module';
import { dirname, relative, resolve, sep } from 'node:path';

/**
 * The dependency-direction rule as a function, so the test can show it catches a violation.
 * A source file in a pure folder may import only from pure folders, the pure files at the top
 * of src, and npm packages; never a Node built-in (I/O lives at the edge) and never engine/,
 * run/ or cli/. It must not read the clock, a random source or the environment either.
 */

/** The folder lists, as DEVELOPERS.md states them. */
export interface Layers {
  pure: string[];
  edge: string[];
  /** Files directly in src/ that pure code may import (e.g. version.ts). */
  pureRootFiles: string[];
  /** Files inside a pure folder that are adapters by design (`folder/file.ts`), with the reason. */
  adapters: string[];
}

/** Read the lists from the lines of DEVELOPERS.md that start with the given labels. */
export function readLayers(markdown: string): Layers {
  const line = (label: string): string[] => {
    const m = markdown.split('\n').find((l) => l.startsWith(`- ${label}:`));
    if (!m) throw new Error(`DEVELOPERS.md has no line starting "- ${label}:"`);
    return [...m.slice(label.length + 3).matchAll(/`([^`]+)`/g)].map((x) => x[1].replace(/\/$/, ''));
  };
  return { pure: line('Pure folders'), edge: line('Edge folders'), pureRootFiles: line('Pure files in src'), adapters: line('Adapters inside pure folders') };
}

const BUILTINS = new Set(builtinModules.flatMap((m) => [m, `node:${m}`]));
const IMPORT = /(?:^|[\s;])(?:import|export)\s[^'"]*?from\s*['"]([^'"]+)['"]|(?:^|[\s;])import\s*['"]([^'"]+)['"]|\bimport\s*\(\s*['"]([^'"]+)['"]\s*\)|\brequire\s*\(\s*['"]([^'"]+)['"]\s*\)/g;
const IMPURE_GLOBALS: [RegExp, string][] = [
  [/\bprocess\s*\.\s*(env|argv|cwd|exit|stdout|stderr|stdin|hrtime)\b/, 'reads or writes the process (env, argv, cwd, streams, exit)'],
  [/\bDate\s*\.\s*now\s*\(|\bnew\s+Date\s*\(\s*\)/, 'reads the clock'],
  [/\bperformance\s*\.\s*now\s*\(/, 'reads the clock'],
  [/\bMath\s*\.\s*random\s*\(/, 'uses an unseeded random source'],
];

/** Import specifiers of a TypeScript/JavaScript source (comments removed first). */
export function importsOf(source: string): string[] {
  const code = source.replace(/\/\*[\s\S]*?\*\//g, '').replace(/(^|[^:'"`\\])\/\/.*$/gm, '$1');
  return [...code.matchAll(IMPORT)].map((m) => m[1] ?? m[2] ?? m[3] ?? m[4]);
}

/**
 * Violations of one file at `file` (absolute) under `srcDir`, `source` its text.
 * Returns one message per violation; empty when the file keeps the rule or is not in a pure folder.
 */
export function violations(srcDir: string, file: string, source: string, layers: Layers): string[] {
  const rel = relative(srcDir, file).split(sep).join('/');
  const folder = rel.split('/')[0];
  if (!layers.pure.includes(folder) || layers.adapters.includes(rel)) return [];
  const out: string[] = [];
  for (const spec of importsOf(source)) {
    if (BUILTINS.has(spec) || spec.startsWith('node:')) {
      out.push(`${rel} imports the Node built-in "${spec}" (pure folders do no I/O; move the I/O to engine/, run/ or cli/)`);
      continue;
    }
    if (!spec.startsWith('.')) continue; // an npm package
    const target = relative(srcDir, resolve(dirname(file), spec)).split(sep).join('/');
    if (target.startsWith('..')) {
      out.push(`${rel} imports "${spec}" from outside src/`);
      continue;
    }
    const parts = target.split('/');
    const ok = parts.length === 1 ? layers.pureRootFiles.includes(parts[0].replace(/\.js$/, '.ts')) : layers.pure.includes(parts[0]);
    if (!ok) out.push(`${rel} imports "${spec}" (${parts.length === 1 ? 'src/' + parts[0] : parts[0] + '/'} is not pure: pure folders depend only on pure folders)`);
  }
  const code = source.replace(/\/\*[\s\S]*?\*\//g, '').replace(/(^|[^:'"`\\])\/\/.*$/gm, '$1');
  for (const [re, what] of IMPURE_GLOBALS) if (re.test(code)) out.push(`${rel} ${what}`);
  return out;
}
