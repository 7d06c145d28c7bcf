import { describe, expect, it } from 'vitest';
import { finalState, modelDrop, toWaveforms } from './waveforms.js';
import { savedVectors } from './deck.js';
import { expandCorners } from '../corners/expand.js';
import { makeDesign } from '../../tests/support/design.js';
import type { Design } from '../design/types.js';

// Vector mapping and signs. Every saved vector gets its own distinct two-point signal (a, a + 1)
// so that a swapped, reused or mis-signed vector shows as a wrong number. The physical meaning of
// the signs (tank current from the bridge into Lr, Cr voltage bridge side minus transformer side,
// diode reverse voltage cathode minus anode) is checked against independently written decks in
// tests/sim/reference.engine.test.ts (Cr peak, turn-off current and diode reverse voltage).
function vectorsFor(design: Design): Record<string, Float64Array> {
  const v: Record<string, Float64Array> = { time: Float64Array.from([0, 1e-6]) };
  savedVectors(design).forEach((name, k) => { v[name] = Float64Array.from([10 * (k + 1), 10 * (k + 1) + 1]); });
  return v;
}

const topologies = [
  ['half-bridge', 'center-tapped'], ['half-bridge', 'full-bridge'], ['full-bridge', 'center-tapped'], ['full-bridge', 'full-bridge'],
] as const;

describe('toWaveforms: vector mapping and signs', () => {
  for (const [inverter, rectifier] of topologies) {
    it(`${inverter} inverter, ${rectifier} rectifier`, () => {
      const d = makeDesign({ topology: { inverter, rectifier }, rectifier: { forwardVoltage: 0.7, resistance: 0.01 } });
      const c = expandCorners(d)[0]!;
      const v = vectorsFor(d);
      const w = toWaveforms(d, c, 90e3, v);
      const at = (name: string) => v[name]![1]!;
      const vin = 400;
      const fb = inverter === 'full-bridge';
      const fbr = rectifier === 'full-bridge';
      const vb = fb ? at('v(b)') : 0;
      expect(w.tankCurrent[1]).toBe(at('i(vlr)'));
      expect(w.crVoltage[1]).toBe(at('v(t2)') - at('v(t3)'));
      expect(w.bridgeVoltage[1]).toBe(at('v(a)') - vb);
      expect(w.vout[1]).toBe(at('v(out)'));
      // switches: S1 high side of leg A (vds = Vin - v(a)), S2 low side (v(a)); FB: S3 high side of
      // leg B on the low-side gate, S4 low side of leg B on the high-side gate
      expect(w.switches.map((s) => s.name)).toEqual(fb ? ['S1', 'S2', 'S3', 'S4'] : ['S1', 'S2']);
      expect(w.switches[0]!.vds[1]).toBe(vin - at('v(a)'));
      expect(w.switches[1]!.vds[1]).toBe(at('v(a)'));
      expect(w.switches[0]!.gate[1]).toBe(at('v(g1)'));
      expect(w.switches[1]!.gate[1]).toBe(at('v(g2)'));
      expect(w.switches[0]!.current[1]).toBe(at('i(vsw1)'));
      expect(w.switches[1]!.current[1]).toBe(at('i(vsw2)'));
      if (fb) {
        expect(w.switches[2]!.vds[1]).toBe(vin - at('v(b)'));
        expect(w.switches[3]!.vds[1]).toBe(at('v(b)'));
        expect(w.switches[2]!.gate[1]).toBe(at('v(g2)'));
        expect(w.switches[3]!.gate[1]).toBe(at('v(g1)'));
        expect(w.switches[2]!.current[1]).toBe(at('i(vsw3)'));
        expect(w.switches[3]!.current[1]).toBe(at('i(vsw4)'));
      }
      // diodes: reverse voltage = cathode - anode; CT D1 s1 -> out, D2 s2 -> out; FB rectifier
      // D1 s1 -> out, D2 0 -> s1, D3 s2 -> out, D4 0 -> s2
      const out = at('v(out)');
      const s1 = at('v(s1)');
      const s2 = at('v(s2)');
      const reverse = fbr ? [out - s1, s1, out - s2, s2] : [out - s1, out - s2];
      expect(w.diodes.map((x) => x.reverseVoltage[1])).toEqual(reverse);
      expect(w.diodes.map((x) => x.current[1])).toEqual((fbr ? [1, 2, 3, 4] : [1, 2]).map((k) => at(`i(vd${k})`)));
      // secondary current referred to the primary: (i_D1 - i_D2) / n (CT: the two halves; FB
      // rectifier: D1 carries +i_sec, D2 -i_sec); magnetizing = tank - secondary
      const isec = (at('i(vd1)') - at('i(vd2)')) / 4;
      expect(w.secondaryCurrentReferred[1]).toBeCloseTo(isec, 12);
      expect(w.magnetizingCurrent[1]).toBeCloseTo(at('i(vlr)') - isec, 12);
      // capacitor current: rectified current into the output node minus the load current
      const rect = fbr ? at('i(vd1)') + at('i(vd3)') : at('i(vd1)') + at('i(vd2)');
      expect(w.outputCapCurrent[1]).toBeCloseTo(rect - out / 4, 12);
      // the gain's drop: one diode in the path (CT) or two (FB rectifier)
      expect(w.rectifierDrop).toBeCloseTo(fbr ? 1.4 : 0.7, 12);
      const st = finalState(w, v);
      expect(st).toEqual({ vo: at('v(co)'), ir: at('i(vlr)'), im: w.magnetizingCurrent[1], vcr: at('v(t2)') - at('v(t3)'), va: at('v(a)'), vb });
    });
  }

  it('a missing vector is named in the error', () => {
    const d = makeDesign();
    const v = vectorsFor(d);
    delete v['i(vd2)'];
    expect(() => toWaveforms(d, expandCorners(d)[0]!, 90e3, v)).toThrow(/i\(vd2\)/);
  });

  it('an ideal (0 V) fitted diode is modelled with the knee voltage; a user model keeps the design value', () => {
    expect(modelDrop(makeDesign())).toBeCloseTo(0.2, 12);
    const user = makeDesign({ rectifier: { forwardVoltage: 0, resistance: 0 } });
    user.devices = { diodeModel: { file: 'd.lib', text: '.model dx d(is=1e-9)', name: 'dx' } };
    expect(modelDrop(user)).toBe(0);
  });
});
