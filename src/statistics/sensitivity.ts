import { spearman } from './rank.js';

/** One input's influence on one output across the samples. */
export interface SensitivityEntry {
  /** Input name (a toleranced parameter). */
  parameter: string;
  /** Spearman rank correlation of the input with the output, -1..1 (sign: the output rises with the input when > 0). */
  rho: number;
}

/**
 * Rank the inputs by |Spearman rank correlation| with an output, largest first (A. Saltelli et
 * al., "Global Sensitivity Analysis: The Primer", Wiley 2008, section 1.2: for a monotonic model
 * the rank coefficients order the inputs by influence). Inputs that do not vary, and samples
 * whose output is missing (null), are left out; ties in |rho| keep the inputs' given order.
 * inputs: per parameter, one value per sample; output: one value per sample.
 */
export function rankSensitivity(inputs: Record<string, readonly number[]>, output: readonly (number | null)[]): SensitivityEntry[] {
  const keep = output.map((v, i) => (v !== null && Number.isFinite(v) ? i : -1)).filter((i) => i >= 0);
  const y = keep.map((i) => output[i]!);
  const out: SensitivityEntry[] = [];
  for (const [parameter, xs] of Object.entries(inputs)) {
    if (xs.length !== output.length) throw new RangeError(`input ${parameter} has ${xs.length} values for ${output.length} outputs`);
    const rho = spearman(keep.map((i) => xs[i]!), y);
    if (rho !== null) out.push({ parameter, rho });
  }
  return out.sort((a, b) => Math.abs(b.rho) - Math.abs(a.rho));
}
