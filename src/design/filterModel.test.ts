import { describe, expect, it } from 'vitest';
import { filterModelText } from './filterModel.js';
import { formatProblem } from './problem.js';

const DIODE = '* fast diode (invented parameters)\n.model DFAST D(IS=1e-12 N=1 RS=0.01 CJO=50p TT=0)\n';
const SUBCKT = '.subckt SW1 d g s\nM1 d g s s NM\n.model NM NMOS(VTO=3 KP=20)\n.param rg=2\nR1 g s 1meg\n.ends SW1\n';

const rejected = (text: string): string[] => {
  const r = filterModelText(text, 'm.lib', 'devices.diodeModel.file');
  if (r.ok) throw new Error('expected the filter to refuse');
  return r.problems.map((p) => formatProblem(p, 'design.yaml'));
};

describe('filterModelText', () => {
  it('passes plain model and subcircuit definitions and lists their names', () => {
    expect(filterModelText(DIODE, 'd.lib')).toEqual({ ok: true, text: DIODE, names: ['DFAST'] });
    const r = filterModelText(SUBCKT.replace(/\n/g, '\r\n'), 's.lib');
    expect(r.ok && r.names).toEqual(['SW1']); // NM is local to the subcircuit
    expect(r.ok && r.text).toBe(SUBCKT); // CRLF normalised
    expect(filterModelText('.MODEL D2 D(IS=1e-14\n+ N=1.05)\n', 'x').ok).toBe(true);
  });

  // Why: a .control block runs `shell` under native ngspice, even from an included file or after .end
  // (tests/hardening/injection.engine.test.ts shows it with a marker file).
  it('refuses .control blocks and shell commands, naming file and line', () => {
    expect(rejected(`${DIODE}.control\nshell touch /tmp/x\n.endc\n`)).toEqual([
      'm.lib:3:1: devices.diodeModel.file: ".control" is not allowed in a model file: a .control block runs simulator commands',
      'm.lib:4:1: devices.diodeModel.file: "shell" is not allowed in a model file: shell commands are never allowed',
      'm.lib:5:1: devices.diodeModel.file: ".endc" is not allowed in a model file: a .control block runs simulator commands',
    ]);
    expect(rejected(`${DIODE}  .CONTROL\n`)[0]).toMatch(/^m\.lib:3:3: .*"\.control" is not allowed/);
    expect(rejected(`*NG_SCRIPT\n${DIODE}`)[0]).toMatch(/^m\.lib:1:1: .*"\*ng_script" is not allowed/);
  });
  it('refuses includes and libraries', () => {
    expect(rejected(`${DIODE}.include /etc/passwd\n`)).toEqual([
      'm.lib:3:1: devices.diodeModel.file: ".include" is not allowed in a model file: includes would read files that were not checked; paste the models instead',
    ]);
    expect(rejected(`.inc other.lib\n${DIODE}`)[0]).toContain('m.lib:1:1');
    expect(rejected(`.lib lib.l tt\n${DIODE}`)[0]).toContain('".lib" is not allowed');
  });
  it('refuses .end and everything after it', () => {
    expect(rejected(`${DIODE}.end\n\n.control\n`)).toEqual([
      'm.lib:3:1: devices.diodeModel.file: .end is not allowed in a model file; tankcheck ends the netlist itself',
      'm.lib:5:1: devices.diodeModel.file: text after .end (line 3) is not allowed',
    ]);
  });
  it('refuses non-ASCII bytes and control characters with line and column', () => {
    expect(rejected(`${DIODE}* 50\u00b5H coil\n`)).toEqual([
      'm.lib:3:5: devices.diodeModel.file: non-ASCII byte 0xB5; model files must be plain ASCII',
    ]);
    expect(rejected(`.model X D(IS=1e-12)\u0007\n`)[0]).toContain('m.lib:1:21: devices.diodeModel.file: control character 0x07');
    expect(rejected(`.model X D(IS=1e-12)\u2028\n`)[0]).toContain('non-ASCII character U+2028');
    expect(filterModelText('.model X D(IS=1e-12)\t* tab is fine\n', 'x').ok).toBe(true);
  });
  it('refuses analysis cards, top-level devices and parameters, and unbalanced subcircuits', () => {
    const out = rejected(`${DIODE}.tran 1n 1u\nV1 in 0 5\n.param p_lr=1\n.subckt OPEN a b\nR1 a b 1\n`);
    expect(out).toEqual([
      'm.lib:3:1: devices.diodeModel.file: ".tran" is not allowed here; a model file may hold at top level only .model and .subckt definitions',
      'm.lib:4:1: devices.diodeModel.file: a device line outside a .subckt would add a part to the circuit; only definitions are allowed',
      'm.lib:5:1: devices.diodeModel.file: ".param" is not allowed here; a model file may hold at top level only .model and .subckt definitions',
      'm.lib:6:1: devices.diodeModel.file: .subckt is never closed by .ends',
    ]);
  });
  it('refuses a continuation line before the first card (it would extend a line of the deck, e.g. its .options)', () => {
    expect(rejected(`* vendor header\n+ interp\n${DIODE}`)).toEqual([
      'm.lib:2:1: devices.diodeModel.file: a continuation line (+) must follow a card of this file; here it would continue a line of the netlist tankcheck writes',
    ]);
    expect(filterModelText(`.model X D(IS=1e-12\n* comment between\n+ N=1.5)\n`, 'x').ok).toBe(true);
  });
  it('requires at least one definition', () => {
    expect(rejected('* only a comment\n')).toEqual(['m.lib: devices.diodeModel.file: no .model or .subckt definition found']);
    expect(rejected('')).toHaveLength(1);
  });
  it('caps the number of problems per file', () => {
    const out = rejected(`${DIODE}${'V1 a 0 1\n'.repeat(80)}`);
    expect(out).toHaveLength(51);
    expect(out[50]).toContain('and 30 more problems in this file');
  });
});
