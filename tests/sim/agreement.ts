// Agreement of one simulated number with its reference, for tests that print what they measured.

export interface Check {
  name: string;
  tool: number;
  ref: number;
  /** Allowed difference: relative to |ref| (or to `scale`), or in the quantity's unit when absolute. */
  tol: number;
  /** Reference size the relative difference is taken against, default |ref|. */
  scale?: number;
  absolute?: boolean;
}

export interface Agreement {
  name: string;
  ok: boolean;
  /** Difference in the tolerance's terms: relative (ratio) or absolute. */
  error: number;
  text: string;
}

/** Compares one check; a non-finite tool value never agrees. */
export function agreement(c: Check): Agreement {
  const diff = c.tool - c.ref;
  const error = c.absolute ? diff : diff / (c.scale ?? Math.abs(c.ref));
  const ok = Number.isFinite(error) && Math.abs(error) <= c.tol;
  const text = c.absolute
    ? `${(error * 1e9).toFixed(2)} ns (tol ${(c.tol * 1e9).toFixed(1)} ns)`
    : `${error >= 0 ? '+' : ''}${(error * 100).toFixed(3)} % (tol ${(c.tol * 100).toFixed(1)} %)`;
  return { name: c.name, ok, error, text };
}

/** One line: "vout +0.003 % (tol 0.5 %), tank rms ..." */
export function formatAgreement(rows: Agreement[]): string {
  return rows.map((r) => `${r.name} ${r.text}${r.ok ? '' : ' FAIL'}`).join(', ');
}
