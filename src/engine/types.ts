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
  /** Native engine with `keepDir`: the job's directory (deck.cir, includes, out.raw), left in place. */
  workDir?: string;
  /** Set by runWithRetries: every try in order, the last one being this result. */
  attempts?: Attempt[];
}

/** One try of a job under the retry ladder. */
export interface Attempt {
  /** Rung label, e.g. 'as configured', 'rshunt=1e9'. */
  label: string;
  outcome: 'ok' | SimFailure['kind'];
  message?: string;
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
