/** Waveform measurements: simulated LLC waveforms -> SimMetrics over a window of whole cycles. */
export type { DiodeTrace, MeasureWindow, SimMetrics, SwitchTrace, Waveforms, ZvsState } from './types.js';
export { measure, checkWaveforms, gateFrequency, windowSpan, MIN_POINTS_PER_CYCLE } from './measure.js';
export { MEASURE_DEFAULTS, resolveMeasureOptions, type MeasureOptions, type ResolvedMeasureOptions } from './options.js';
export { locate, makeSpan, sliceWindow, spanAverage, spanPeak, spanRms, spanStats, valueAt } from './window.js';
export type { GridPoint, Span, SpanStats } from './window.js';
export { bridgeSign, checkTopology, findCrossings, findGateEdges, within, GATE_LEVEL } from './edges.js';
export type { EdgeDirection, GateEdges } from './edges.js';
export { classifyZvs, regionOf, summarizeZvs, turnOffCurrent, turnOnEdges, type TurnOnEdge } from './switching.js';
export { summarizeZcs, zcsIntervals, type ConductionInterval } from './zcs.js';
export { labelRuns, modeOfWindow, stateRuns, type StateRun } from './mode.js';
