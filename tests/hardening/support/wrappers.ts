/**
 * Fake `ngspice` executables for fault injection, passed with --ngspice-path. Each wraps the real
 * system ngspice (found on PATH) and misbehaves in one way, only for decks whose header names a chosen
 * corner (`* design: ... corner: <id>`), so the other corners of the same study run normally.
 * `-v` (the version probe) always goes straight to the real binary.
 */
import { chmodSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { execFileSync } from 'node:child_process';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

export const REAL_NGSPICE = execFileSync('sh', ['-c', 'command -v ngspice'], { encoding: 'utf8' }).trim();

let wrapperDir: string | undefined;
/** Where wrapper folders go: the temp folder at import time, not the private TMPDIR a test sets later. */
const WRAPPER_ROOT = tmpdir();

/** Removes the folder of the wrapper scripts written so far (call from afterAll). */
export function removeWrappers(): void {
  if (wrapperDir) rmSync(wrapperDir, { recursive: true, force: true });
  wrapperDir = undefined;
}

function script(name: string, body: string): string {
  wrapperDir ??= mkdtempSync(join(WRAPPER_ROOT, 'tankcheck-wrappers-'));
  const path = join(wrapperDir, name);
  writeFileSync(path, body);
  chmodSync(path, 0o755);
  return path;
}

/** Makes the deck simulate 10 s of circuit time (minutes of work) while saving only the last 10 ms. */
const LENGTHEN = `sed -i 's/^\\.tran .*/.tran 1e-7 10 9.99 1e-7 uic/' deck.cir`;

/** Shell prologue: version probe passes through; `hit` is true when the deck is for the target corner. */
const prologue = (corner: string): string => `#!/bin/sh
REAL='${REAL_NGSPICE}'
case "$1" in -v) exec "$REAL" "$@";; esac
hit=false
if grep -q 'corner: ${corner}\\b' deck.cir 2>/dev/null; then hit=true; fi
`;

/**
 * For the target corner: start the real ngspice on a lengthened deck (so it is surely still running),
 * then after `delay` s SIGKILL it and exit with its status, as a wrapper around a killed process would.
 */
export function killChildWrapper(corner: string, delay = 0.3): string {
  return script(`kill-child-${corner}`, `${prologue(corner)}
if $hit; then
  ${LENGTHEN}
  "$REAL" "$@" &
  child=$!
  sleep ${delay}
  kill -KILL $child
  wait $child
  exit $?
fi
exec "$REAL" "$@"
`);
}

/**
 * For the target corner: start the real ngspice in the background on a lengthened deck and SIGKILL the
 * wrapper itself, so the process tankcheck started dies by a signal and its ngspice child (minutes of
 * work left, holding the output pipes) would be left behind as an orphan. Its pid goes to `pidFile`.
 */
export function killSelfWrapper(corner: string, pidFile: string, delay = 0.3): string {
  return script(`kill-self-${corner}`, `${prologue(corner)}
if $hit; then
  ${LENGTHEN}
  "$REAL" "$@" &
  echo $! > '${pidFile}'
  sleep ${delay}
  kill -KILL $$
fi
exec "$REAL" "$@"
`);
}

/** How the raw file is damaged after a normal run. */
export type RawDamage = 'truncate-half' | 'header-only' | 'empty' | 'garbage' | 'nan-data' | 'missing' | 'time-reversed';

/**
 * Runs the real ngspice to completion (exit code kept), then damages out.raw as `plan` says for the
 * corner the deck belongs to (other corners pass untouched). Written in Node so the byte surgery is exact.
 */
export function rawDamageWrapper(plan: Record<string, RawDamage>): string {
  return script('raw-damage', `#!/usr/bin/env node
const { spawnSync } = require('node:child_process');
const fs = require('node:fs');
const plan = ${JSON.stringify(plan)};
const args = process.argv.slice(2);
const r = spawnSync('${REAL_NGSPICE}', args, { stdio: 'inherit' });
const corner = args[0] === '-v' ? undefined : (/corner: (\\S+)/.exec(fs.readFileSync('deck.cir', 'latin1')) || [])[1];
const damage = plan[corner];
if (damage) {
  const buf = fs.existsSync('out.raw') ? fs.readFileSync('out.raw') : Buffer.alloc(0);
  const data = buf.indexOf('Binary:\\n') + 8;
  if (damage === 'truncate-half') fs.writeFileSync('out.raw', buf.subarray(0, data + Math.floor((buf.length - data) / 2) + 3));
  if (damage === 'header-only') fs.writeFileSync('out.raw', buf.subarray(0, 60));
  if (damage === 'empty') fs.writeFileSync('out.raw', '');
  if (damage === 'garbage') fs.writeFileSync('out.raw', Buffer.from(Array.from({ length: 4096 }, (_, i) => (i * 97 + 13) & 0xff)));
  if (damage === 'nan-data') { buf.fill(0xff, data); fs.writeFileSync('out.raw', buf); }
  if (damage === 'missing') fs.rmSync('out.raw', { force: true });
  if (damage === 'time-reversed') {
    const nVars = Number(/No\\. Variables:\\s*(\\d+)/.exec(buf.toString('latin1', 0, data))[1]);
    const rows = Math.floor((buf.length - data) / (8 * nVars));
    const f = new Float64Array(buf.buffer.slice(buf.byteOffset + data, buf.byteOffset + data + rows * nVars * 8));
    for (let i = 0; i < rows; i++) f[i * nVars] = (rows - i) * 1e-9;
    Buffer.from(f.buffer).copy(buf, data);
    fs.writeFileSync('out.raw', buf);
  }
}
process.exit(r.status ?? 1);
`);
}

/**
 * For the target corner, always fails like a deck that does not converge: prints ngspice's "Timestep too
 * small" report and exits 1, without writing a raw file. Each such deck is copied to `logDir/attempt-<n>.cir`.
 */
export function noConvergenceWrapper(corner: string, logDir: string): string {
  return script(`no-convergence-${corner}`, `${prologue(corner)}
if ! $hit; then exec "$REAL" "$@"; fi
n=$(ls '${logDir}' | wc -l)
cp deck.cir '${logDir}/attempt-'$((n + 1))'.cir'
echo "doAnalyses: TRAN:  Timestep too small; time = 1.23e-06, timestep = 1.25e-20: trouble with d-instance d1" >&2
echo "run simulation(s) aborted" >&2
exit 1
`);
}

/** For the target corner: the real ngspice on the lengthened deck (minutes of work); others run as they are. */
export function lengthenWrapper(corner: string): string {
  return script(`lengthen-${corner}`, `${prologue(corner)}
if $hit; then ${LENGTHEN}; fi
exec "$REAL" "$@"
`);
}

/** Prints a banner without "ngspice-<version>": not an ngspice at all. */
export function notNgspice(): string {
  return script('not-ngspice', '#!/bin/sh\necho "some other simulator 1.0"\nexit 0\n');
}
