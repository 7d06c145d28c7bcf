// Smoke test of the command line in-process: --version, --help, per-command help and usage errors.
// (The built binary gets the same checks in signals.engine.test.ts.)
import { describe, expect, it } from 'vitest';
import { runCli } from '../support/cli.js';
import { TOOL_VERSION } from '../../src/version.js';

describe('tankcheck --version / --help', () => {
  it('--version and -V print the version and exit 0', async () => {
    for (const flag of ['--version', '-V']) {
      const r = await runCli([flag]);
      expect(r.code).toBe(0);
      expect(r.stdout.trim()).toBe(TOOL_VERSION);
    }
  });

  it('--help lists every command; each command has its own help; all exit 0', async () => {
    const r = await runCli(['--help']);
    expect(r.code).toBe(0);
    const commands = ['init', 'fha', 'decks', 'run', 'report', 'schema'];
    for (const c of commands) expect(r.stdout).toMatch(new RegExp(`^\\s+${c}\\b`, 'm'));
    for (const c of commands) {
      const h = await runCli([c, '--help']);
      expect(h.code, c).toBe(0);
      expect(h.stdout).toMatch(new RegExp(`^Usage: tankcheck ${c}\\b`, 'm'));
    }
  });

  it('usage mistakes exit 2 with a message: unknown option, missing argument, bad --jobs, bad --timeout', async () => {
    for (const args of [['--frobnicate'], ['fha'], ['run', 'x.yaml', '--jobs', '0'], ['run', 'x.yaml', '--timeout', '1.5'], ['run', 'x.yaml', '--jobs', 'two']]) {
      const r = await runCli(args);
      expect(r.code, args.join(' ')).toBe(2);
      expect(r.stderr).toMatch(/error: /);
    }
  });
});
