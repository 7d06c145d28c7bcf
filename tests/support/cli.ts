import { vi } from 'vitest';
import { main } from '../../src/cli/main.js';

/** Run the CLI in-process; returns the exit code and what it printed. */
export async function runCli(args: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  let stdout = '';
  let stderr = '';
  const o = vi.spyOn(process.stdout, 'write').mockImplementation((s: string | Uint8Array) => { stdout += String(s); return true; });
  const e = vi.spyOn(process.stderr, 'write').mockImplementation((s: string | Uint8Array) => { stderr += String(s); return true; });
  try {
    const code = await main(['node', 'tankcheck', ...args]);
    return { code, stdout, stderr };
  } finally {
    o.mockRestore();
    e.mockRestore();
  }
}
