/** `tankcheck init`: the demo design, with the line that points editors at the schema. */
import { readFile, writeFile } from 'node:fs/promises';
import { dirname, relative, resolve, sep } from 'node:path';
import { fileURLToPath } from 'node:url';
import { fsReason, writeFilesAtomic } from '../run/files.js';
import { UsageError } from './exit.js';

const DEMO = fileURLToPath(new URL('../../examples/demo.yaml', import.meta.url));
/** The schema file of this installation (the package subpath tankcheck/schema/design.schema.json). */
export const SCHEMA_FILE = fileURLToPath(new URL('../../schema/design.schema.json', import.meta.url));

/** The comment line YAML editors (yaml-language-server) read to find the schema, relative to the file written. */
export function schemaLine(target: string): string {
  const rel = relative(dirname(resolve(target)), SCHEMA_FILE).split(sep).join('/');
  return `# yaml-language-server: $schema=${rel.startsWith('.') ? rel : `./${rel}`}\n`;
}

/**
 * Write the demo design to `file`. Without `force` the file is created exclusively (flag 'wx'), so an
 * existing file is never overwritten, even one that appears between a check and the write.
 */
export async function initCommand(file: string, o: { force?: boolean; quiet?: boolean }): Promise<void> {
  const demo = await readFile(DEMO, 'utf8');
  const text = `${schemaLine(file)}${demo.replace(/^# yaml-language-server:.*\n/, '')}`;
  try {
    if (o.force) await writeFilesAtomic([{ path: file, text }]);
    else await writeFile(file, text, { flag: 'wx' });
  } catch (e) {
    if ((e as NodeJS.ErrnoException).code === 'EEXIST') throw new UsageError(`${file} exists; use --force to overwrite`);
    throw new UsageError(`cannot write ${file}: ${fsReason(e)}`);
  }
  if (!o.quiet) process.stdout.write(`wrote ${file}\n`);
}

/** Examples shown at the end of `--help`. */
export function helpExamples(): string {
  return [
    'Examples:',
    '  tankcheck init my-design.yaml                    # the demo design to start from',
    '  tankcheck fha my-design.yaml                     # FHA predictions, no simulation',
    '  tankcheck run my-design.yaml -o out              # simulate every corner (embedded engine)',
    '  tankcheck run my-design.yaml --engine ngspice --only \'v390_*\' --quiet',
    '  tankcheck run my-design.yaml --baseline old/results.json --html report.html',
    '  tankcheck report out/results.json -o report.html',
  ].join('\n');
}
