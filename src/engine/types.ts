/** One simulator run. The deck is complete ASCII netlist text from our writer (no .control, `.end` last). */
export interface SimJob {
  id: string;
  deck: string;
  /** Virtual path -> text, made visible to the deck's `.include` (wasm: MEMFS; native: the temp dir). */
  includes?: Record<string, string>;
  /** Wall-clock limit for this run in ms. */
  timeoutMs: number;
  signal?: AbortSignal;
}

export type SimFailure =
  | { kind: 'input'; message: string }
  | { kind: 'convergence'; message: string; atTime?: number }
  | { kind: 'timeout'; message: string }
  | { kind: 'engine'; message: string }
  | { kind: 'aborted'; message: string };

export interface Diagnostic {
  level: 'error' | 'warning' | 'note';
  text: string;
}

export interface SimResult {
  id: string;
  ok: boolean;
  failure?: SimFailure;
  /** True when the vectors stop at an abort point (rows recovered from an aborted run). */
  partial: boolean;
  /** Lower-case vector names as ngspice writes them: 'time', 'v(out)', 'i(vlr)'. */
  vectors: Record<string, Float64Array>;
  diagnostics: Diagnostic[];
  wallMs: number;
}

export interface SimEngine {
  readonly name: 'wasm' | 'ngspice';
  /** e.g. 'ngspice-45.2' */
  version(): Promise<string>;
  /** Never throws for simulator problems; they come back as `failure`. */
  run(job: SimJob): Promise<SimResult>;
  close(): Promise<void>;
}
