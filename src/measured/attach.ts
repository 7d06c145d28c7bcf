import type { CornerResult, Results } from '../results/types.js';
import { gapHint, measuredEfficiency, measuredErrors, MEASURED_METRICS, type ModelValues } from './compare.js';
import type { MeasuredPoint, MeasuredReport, MeasuredSummary } from './types.js';

function values(m: unknown): ModelValues | null {
  return m && typeof m === 'object' ? (m as ModelValues) : null;
}

/** Mark a corner result as a measured point: `source: 'measured'` and its `measured` summary. */
export function attachMeasured(r: CornerResult, point: MeasuredPoint, tolerance: number): CornerResult {
  const sim = measuredErrors(point, values(r.sim));
  const within = sim ? MEASURED_METRICS.every((m) => sim[m] === undefined || Math.abs(sim[m]!) <= tolerance) : null;
  const efficiency = measuredEfficiency(point, r.inputs.load);
  const simEfficiency = r.sim?.inputPower ? r.sim.pout / r.sim.inputPower : null;
  const { line, vin, fs, vout, iin, pin, tankCurrentRms, crVoltagePeak, switchTurnOffCurrent, note } = point;
  const measured: MeasuredSummary = {
    line, vin, fs, vout,
    ...defined({ iin, pin, tankCurrentRms, crVoltagePeak, switchTurnOffCurrent, note, efficiency }),
    simEfficiency,
    errors: { fha: measuredErrors(point, values(r.fha)), ideal: measuredErrors(point, values(r.ideal)), sim },
    tolerance, within,
  };
  return { ...r, source: 'measured', measured };
}

function defined<T extends Record<string, unknown>>(o: T): Partial<T> {
  return Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined)) as Partial<T>;
}

/** The measured-points summary over a results file's measured corners. */
export function measuredReport(results: Results, file: string, tolerance: number): MeasuredReport {
  const corners = results.corners.filter((c) => c.measured);
  const samples = corners.flatMap((c) => {
    const e = c.measured!.errors.sim?.vout;
    return e === undefined ? [] : [{ fs: c.measured!.fs, iout: c.inputs.iout, error: e }];
  });
  return { file, points: corners.length, tolerance, missed: corners.filter((c) => c.measured!.within === false).length, hint: gapHint(samples, tolerance) };
}
