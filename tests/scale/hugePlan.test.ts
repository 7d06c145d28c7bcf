// A grid far larger than one machine should run is refused on its count, before any planning or
// simulation, with the ways out named (split into shards, or --yes).
import { describe, expect, it } from 'vitest';
import { existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCli } from '../support/cli.js';
import { DEMO_FILE } from '../support/demo.js';
import { HUGE_PLAN } from '../../src/cli/run.js';

describe('huge plans', () => {
  it(`a 50 x 50 grid (2500 corners > ${HUGE_PLAN}) exits 2 at once naming the count, writing nothing`, async () => {
    const dir = mkdtempSync(join(tmpdir(), 'tankcheck-huge-'));
    const vins = Array.from({ length: 50 }, (_, i) => `${340 + i} V`).join(', ');
    const loads = Array.from({ length: 50 }, (_, i) => `${i + 1}%`).join(', ');
    const file = join(dir, 'huge.yaml');
    writeFileSync(file, readFileSync(DEMO_FILE, 'utf8').replace(/vin: \[.*\]/, `vin: [${vins}]`).replace(/load: \[.*\]/, `load: [${loads}]`));
    const out = join(dir, 'out');
    const r = await runCli(['run', file, '--engine', 'ngspice', '--ngspice-path', '/nonexistent/ngspice', '--out', out]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/2500 corners planned, more than 2000: split it with --shard K\/N, or pass --yes/);
    expect(existsSync(out)).toBe(false);
    // refused on the count, before planning (the plan of 2500 corners would outlast the test timeout)
    expect(r.stderr).not.toMatch(/planning/);
  });
});
