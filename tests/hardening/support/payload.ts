/**
 * Injection payloads for the hardening tests. Every payload tries to make native ngspice create a marker
 * file through a `.control` block (`shell touch <marker>`): such a block runs under `ngspice -b`,
 * also from an included file and after `.end` (checked harmlessly with a marker file on ngspice-39).
 */
import { randomBytes } from 'node:crypto';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

/** A fresh marker path /tmp/tankcheck-pwned-<random>; it must never come into existence. */
export function markerPath(): string {
  return join(tmpdir(), `tankcheck-pwned-${randomBytes(8).toString('hex')}`);
}

/** A valid diode model card (invented parameters). */
export const GOOD_DIODE = '.model dgood d(is=1e-12 n=1.2 rs=0.01 cjo=0 tt=0)';

/** Model-file texts that each try to smuggle a control block (or another file) into the deck. */
export function modelPayloads(marker: string, includeTarget: string): Record<string, string> {
  const ctl = `.control\nshell touch ${marker}\n.endc`;
  return {
    'control block after a model': `${GOOD_DIODE}\n${ctl}\n`,
    'upper-case, tab-indented control block': `${GOOD_DIODE}\n\t.CONTROL\n\tshell touch ${marker}\n\t.ENDC\n`,
    'control block after .end': `${GOOD_DIODE}\n.end\n${ctl}\n`,
    'ng_script file': `*ng_script\n${GOOD_DIODE}\nshell touch ${marker}\n`,
    'include of a file holding a control block': `${GOOD_DIODE}\n.include ${includeTarget}\n`,
    '.inc and .lib forms': `.inc ${includeTarget}\n.lib ${includeTarget} tt\n${GOOD_DIODE}\n`,
    'carriage-return line breaks': `${GOOD_DIODE}\r.control\rshell touch ${marker}\r.endc\r`,
    'control block inside a subcircuit': `.subckt dsub a k\nD1 a k dgood\n${ctl}\n.ends dsub\n${GOOD_DIODE}\n`,
    'continuation line before the first card': `+ .control\nshell touch ${marker}\n${GOOD_DIODE}\n`,
    'NUL byte hiding a control line': `${GOOD_DIODE}\u0000\n.control\n`,
    'non-ASCII look-alike dot (U+2024)': `${GOOD_DIODE}\n\u2024control\nshell touch ${marker}\n`,
    'bare shell line': `${GOOD_DIODE}\nshell touch ${marker}\n`,
  };
}

/** Design names that try to become deck lines. */
export function namePayloads(marker: string): Record<string, string> {
  return {
    'newline + .control': JSON.stringify(`x\n.control\nshell touch ${marker}\n.endc`),
    'carriage return + .control': JSON.stringify(`x\r.control\rshell touch ${marker}`),
    'U+2028 line separator': JSON.stringify(`x\u2028.control\u2028shell touch ${marker}`),
    'path traversal': JSON.stringify('../../../etc/cron.d/x'),
    'non-ASCII': JSON.stringify('Ωmega-tank'),
  };
}
