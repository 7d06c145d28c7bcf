import type { Accuracy, Design } from '../design/types.js';
import type { Corner } from '../corners/types.js';
import type { DeckSeed, StepProfile } from './types.js';
import { TEMPLATES } from './templateText.js';
import { renderTemplate, safeName, type TemplateValue } from './render.js';
import { checkDeckExpressions, type ParamEntry } from './params.js';
import { diodeFitCurrent, diodeModelCard, diodeInstance, switchInstance, userModelCards } from './devices.js';

/**
 * Accuracy profiles: trapezoidal integration only with reltol 1e-4 (at the default 1e-3 it rang in a
 * time-step study on the LLC deck during development; docs/method.md#steady-state), step limited to a fraction of the period.
 */
export const STEP_PROFILES: Record<Accuracy, StepProfile> = {
  fast: { method: 'trap', reltol: 1e-4, stepsPerPeriod: 140 },
  normal: { method: 'trap', reltol: 1e-4, stepsPerPeriod: 350 },
  fine: { method: 'trap', reltol: 1e-5, stepsPerPeriod: 1000 },
};

/** Small series resistance of the resonant capacitor, ohm. */
export const CR_ESR = 5e-3;

export interface DeckRequest {
  design: Design;
  corner: Corner;
  /** Switching frequency, Hz. */
  fs: number;
  seed: DeckSeed;
  /** Whole switching cycles to simulate. */
  cycles: number;
  /** Cycles at the end of the run whose data is saved (the data starts at cycles - saveCycles). */
  saveCycles: number;
  /** Integration override (retry ladder); default from design.simulation.accuracy. */
  profile?: StepProfile;
  /** Extra comment lines appended after the header (ASCII, sanitised). */
  title?: string;
}

export interface Deck {
  text: string;
  /** Vector names the deck saves (besides time). */
  save: string[];
  period: number;
  tstart: number;
  tstop: number;
  /** Files the deck includes: none (user models are inlined). */
}

/** Vectors the measurements need, per topology. */
export function savedVectors(design: Design): string[] {
  const fb = design.topology.inverter === 'full-bridge';
  const fbr = design.topology.rectifier === 'full-bridge';
  return [
    'v(a)', 'v(b)', 'v(g1)', 'v(g2)', 'i(vlr)', 'v(t2)', 'v(t3)',
    'i(vsw1)', 'i(vsw2)', ...(fb ? ['i(vsw3)', 'i(vsw4)'] : []),
    'i(vd1)', 'i(vd2)', ...(fbr ? ['i(vd3)', 'i(vd4)'] : []),
    'v(s1)', 'v(s2)', 'v(out)', 'v(co)',
  ];
}

/**
 * Every node of the deck except ground and the source-driven ones (vin, g1, g2); each gets a
 * 1 Gohm shunt to ground (4 uA at 400 V), the DC path that keeps the matrix regular.
 */
export function circuitNodes(design: Design): string[] {
  const fb = design.topology.inverter === 'full-bridge';
  const fbr = design.topology.rectifier === 'full-bridge';
  return [
    'a', 'd1', 'd2', ...(fb ? ['b', 'd3', 'd4'] : []),
    ...(design.tank.integrated ? [] : ['t1']), 't2', 't3', 'p',
    's1', 's2', 'r1', 'r2', ...(fbr ? ['r3', 'r4'] : []), 'out', 'co',
  ];
}

/** Initial winding currents of the secondary from the referred secondary current ir - im. */
function secondaryCurrents(design: Design, n: number, seed: DeckSeed) {
  const isec = seed.ir - seed.im;
  if (design.topology.rectifier === 'full-bridge') return { is1: -isec * n, is2: 0 };
  return { is1: -Math.max(isec, 0) * n, is2: Math.max(-isec, 0) * n };
}

/**
 * Np/Ns of the deck's transformer: the ratio as entered. Integrated, that is the winding ratio (the
 * models' turnsRatio is k Np/Ns there); the deck's coupled inductors take Ls = Lp / (Np/Ns)^2.
 */
function windingRatio(design: Design, corner: Corner): number {
  if (!design.tank.integrated) return corner.turnsRatio;
  return corner.windingRatio ?? corner.turnsRatio / Math.sqrt(corner.lm / (corner.lr + corner.lm));
}

/** The corner's inputs, in the order the deck lists them (the fitted diode's only when it is used). */
function inputParams(design: Design, corner: Corner, fs: number): ParamEntry[] {
  const fitted: ParamEntry[] = design.devices.diodeModel ? [] : [
    ['vf', design.rectifier.forwardVoltage],
    ['rdiode', design.rectifier.resistance],
    ['ifit', diodeFitCurrent(design)],
  ];
  return [
    ['vin', corner.vin], ['fs', fs], ['lr', corner.lr], ['cr', corner.cr], ['lm', corner.lm], ['turns', windingRatio(design, corner)],
    ['tdead', design.switches.deadTime], ['coss', design.switches.coss], ['rdson', design.switches.rdsOn],
    ['rload', corner.load], ['cout', design.output.capacitance], ['esr', design.output.esr], ...fitted, ['rcr', CR_ESR],
  ];
}

/** Everything computed from the inputs, as expressions (same formulas as the numbers buildDeck returns). */
function derivedParams(integrated: boolean): ParamEntry[] {
  const e = (expr: string) => ({ expr });
  return [
    ['period', e('1/fs')],
    // gate edge: a tenth of the dead time, at most a thousandth of the period
    ['gedge', e('min(tdead/10, period/1000)')],
    ['gwidth', e('period/2-tdead-gedge')],
    ['lp', e(integrated ? 'lr+lm' : 'lm')],
    // secondary self-inductance Lp / (Np/Ns)^2 (= Lm / n^2 for the discrete tank's ideal coupling)
    ['ls', e('lp/(turns*turns)')],
    ['kps', integrated ? e('sqrt(lm/(lr+lm))') : 1],
    ['resr', e('max(esr, 1e-6)')],
    ['tstep', e('period/steps')],
    ['tstop', e('cycles*period')],
    ['tstart', e('(cycles-savecycles)*period')],
  ];
}

/** Render the complete deck of one operating point. Pure: same request, same text. */
export function buildDeck(req: DeckRequest): Deck {
  const { design, corner, fs, seed } = req;
  const T = 1 / fs;
  const profile = req.profile ?? STEP_PROFILES[design.simulation.accuracy];
  const n = corner.turnsRatio;
  const integrated = design.tank.integrated;
  const fb = design.topology.inverter === 'full-bridge';
  const fbr = design.topology.rectifier === 'full-bridge';
  const save = savedVectors(design);
  const tstop = req.cycles * T;
  const tstart = (req.cycles - req.saveCycles) * T;
  const { is1, is2 } = secondaryCurrents(design, n, seed);
  const sw = (i: number, d: string, s: string, g: string) => ({ raw: switchInstance(design, i, d, s, g) });
  const di = (i: number, a: string, k: string) => ({ raw: diodeInstance(design, i, a, k) });
  const values: Record<string, TemplateValue> = {
    title: { raw: safeName(`${design.name} ${corner.id}`) },
    design: { raw: safeName(design.name) },
    corner: { raw: safeName(corner.id) },
    inverter: { raw: design.topology.inverter },
    rectifier: { raw: design.topology.rectifier },
    inputs: { params: inputParams(design, corner, fs) },
    run: { params: [['cycles', req.cycles], ['savecycles', req.saveCycles], ['steps', profile.stepsPerPeriod]] },
    derived: { params: derivedParams(integrated) },
    method: { raw: profile.method },
    reltol: profile.reltol,
    switch1: sw(1, 'd1', 'a', 'g1'),
    switch2: sw(2, 'd2', '0', 'g2'),
    switch3: sw(3, 'd3', 'b', 'g2'),
    switch4: sw(4, 'd4', '0', 'g1'),
    vcs1: corner.vin - seed.va,
    vcs2: seed.va,
    vcs3: corner.vin - seed.vb,
    vcs4: seed.vb,
    ir0: seed.ir,
    vcr0: seed.vcr,
    is1,
    is2,
    diode1: di(1, 'r1', 'out'),
    diode2: fbr ? di(2, '0', 'r2') : di(2, 'r2', 'out'),
    diode3: di(3, 'r3', 'out'),
    diode4: di(4, '0', 'r4'),
    vo0: seed.vo,
    save: { raw: save.join(' ') },
    shunts: { raw: circuitNodes(design).map((node) => `Rsh_${node} ${node} 0 1e9`).join('\n') },
  };
  const parts = [
    TEMPLATES['header']!,
    diodeModelCard(design),
    fb ? TEMPLATES['inverter-full-bridge']! : TEMPLATES['inverter-half-bridge']!,
    integrated ? TEMPLATES['tank-integrated']! : TEMPLATES['tank-discrete']!,
    fbr ? TEMPLATES['rectifier-full-bridge']! : TEMPLATES['rectifier-center-tapped']!,
    TEMPLATES['footer']!,
  ];
  const body = renderTemplate(parts.join(''), values);
  checkDeckExpressions(body);
  const text = insertUserModels(body, design);
  return { text, save, period: T, tstart, tstop };
}

/** User model text goes after the header comments, before the first element line. */
function insertUserModels(deck: string, design: Design): string {
  const cards = userModelCards(design);
  if (!cards) return deck;
  return deck.replace(/^(\.model tk_sw)/m, `${cards}$1`);
}
