import { describe, expect, it } from 'vitest';
import { addRshunt, insertBeforeEnd, integrationMethod, parseSpiceNumber, switchIntegrationMethod, zeroStart } from './rewrite.js';

const deck = (options: string) => `nonce\nR1 a 0 1k\n${options}\n.tran 1n 1u\n.end\n`;

describe('deck rewrites (the rungs of the retry ladder)', () => {
  it('inserts lines before the final .end', () => {
    expect(addRshunt(deck('.options method=gear'))).toBe('nonce\nR1 a 0 1k\n.options method=gear\n.tran 1n 1u\n.options rshunt=1000000000\n.end\n');
    expect(insertBeforeEnd('t\nR1 a 0 1\n', 'X')).toBe('t\nR1 a 0 1\nX\n');
  });

  it('switches gear to trap and tightens reltol to 1e-4', () => {
    expect(switchIntegrationMethod(deck('.options method=gear reltol=1e-3'))).toBe(deck('.options method=trap reltol=1e-4'));
    expect(switchIntegrationMethod(deck('.options method=gear reltol=10u'))).toBe(deck('.options method=trap reltol=10u'));
    expect(switchIntegrationMethod(deck('.OPTIONS METHOD=GEAR'))).toBe('nonce\nR1 a 0 1k\n.OPTIONS method=trap\n.tran 1n 1u\n.options reltol=1e-4\n.end\n');
  });

  it('switches trap (stated or default) to gear', () => {
    expect(switchIntegrationMethod(deck('.options method=trap reltol=1e-4'))).toBe(deck('.options method=gear reltol=1e-4'));
    expect(switchIntegrationMethod(deck('.options reltol=1e-3'))).toBe(deck('.options reltol=1e-3').replace('\n.end', '\n.options method=gear\n.end'));
    expect(integrationMethod(switchIntegrationMethod(switchIntegrationMethod(deck('.opt method=gear'))))).toBe('gear');
  });

  it('rewrites method on continuation lines of .options', () => {
    expect(switchIntegrationMethod(deck('.options abstol=1e-9\n+ method=gear'))).toBe(deck('.options abstol=1e-9\n+ method=trap').replace('\n.end', '\n.options reltol=1e-4\n.end'));
  });

  it('parses SPICE numbers with suffixes (M is milli, MEG is mega)', () => {
    expect(parseSpiceNumber('100u')).toBeCloseTo(1e-4, 18);
    expect(parseSpiceNumber('1M')).toBe(1e-3);
    expect(parseSpiceNumber('2.5meg')).toBe(2.5e6);
    expect(parseSpiceNumber('abc')).toBeNaN();
  });

  it('zero start sets every initial condition to 0 and leaves everything else alone', () => {
    const d = 'n\nLr t1 t2 {lr} ic=-1.51786\nCr t2 t3 {cr} IC=17.2356\nCo co 0 100u ic={vo0}\nLs1 s1 0 {ls} ic=0\nVg1 g1 0 pulse(0 1 {g1d} {ge} {ge} {gw} {period})\n.tran {tstep} {tstop} {tstart} {tmax} uic\n.end\n';
    expect(zeroStart(d)).toBe(d.replace('ic=-1.51786', 'ic=0').replace('IC=17.2356', 'IC=0').replace('ic={vo0}', 'ic=0'));
  });
});
