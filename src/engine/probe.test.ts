// The `ngspice -v` probe against wrappers that hang: the limit must end the wait, whatever the
// wrapper started. Needs only /bin/sh and sleep (no simulator).
import { chmodSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { execFileSync } from 'node:child_process';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { probeNgspice } from './native.js';
import { EngineUnavailableError } from './errors.js';

const dir = mkdtempSync(join(tmpdir(), 'tankcheck-probe-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** Processes whose command line contains `tag` (the sleeps the wrappers started). */
const alive = (tag: string): string[] => execFileSync('ps', ['-eo', 'pid=,args='], { encoding: 'utf8' }).split('\n').filter((l) => l.includes(tag) && !l.includes('ps -eo'));

describe('probeNgspice', () => {
  it('a wrapper whose child hangs holding the output open: unavailable at the limit, the whole group killed', async () => {
    // `sleep` keeps the wrapper's stdout open: killing only the shell would leave the probe waiting for it
    const tag = `4242.${process.pid}`;
    const wrapper = join(dir, 'hanging-ngspice');
    writeFileSync(wrapper, `#!/bin/sh\nsleep ${tag} &\nsleep ${tag}\n`);
    chmodSync(wrapper, 0o755);
    const t0 = performance.now();
    const err = await probeNgspice(wrapper, 400).catch((e: unknown) => e);
    const ms = performance.now() - t0;
    expect(err).toBeInstanceOf(EngineUnavailableError);
    expect((err as Error).message).toMatch(/did not finish within 400 ms/);
    expect(ms).toBeLessThan(5000); // without the group kill it waits the sleeps' 4242 s out
    await new Promise((r) => setTimeout(r, 200));
    expect(alive(tag)).toEqual([]);
  }, 20_000);

  it('a program that is not ngspice is unavailable, with the reason', async () => {
    await expect(probeNgspice('/bin/true')).rejects.toThrow(/printed no ngspice version/);
    await expect(probeNgspice(join(dir, 'missing'))).rejects.toThrow(/cannot run ngspice/);
  });
});
