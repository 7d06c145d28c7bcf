import type { StudyProgress } from '../run/study.js';

/**
 * Progress on stderr: a redrawn bar with corners done, failed and an ETA on a TTY; one plain line
 * per finished corner otherwise (CI logs); nothing with `quiet`.
 */
export function createProgress(stream: NodeJS.WriteStream, total: number, options: { quiet?: boolean; now?: () => number } = {}) {
  const now = options.now ?? Date.now;
  const t0 = now();
  const tty = Boolean(stream.isTTY);
  if (options.quiet) return { update(_p: StudyProgress) {}, start(_what?: string) {}, end() {} };
  return {
    update(p: StudyProgress) {
      // screening is fast and may count thousands of corners: a line per tenth in a log
      if (p.phase === 'screening' && !tty) {
        const step = Math.max(1, Math.ceil(p.total / 10));
        if (p.done % step === 0 || p.done === p.total) stream.write(`screening [${p.done}/${p.total}] FHA and ideal model\n`);
        return;
      }
      if (p.phase === 'confirming' && !tty) {
        stream.write(`confirming [${p.done}/${p.total}] ${p.id} ${p.status}\n`);
        return;
      }
      if (!tty) {
        stream.write(`[${p.done}/${p.total}] ${p.id} ${p.status}\n`);
        return;
      }
      const width = 24;
      const filled = Math.round((p.done / Math.max(p.total, 1)) * width);
      const elapsed = (now() - t0) / 1000;
      const eta = p.done > 0 ? (elapsed / p.done) * (p.total - p.done) : NaN;
      const bar = `${'#'.repeat(filled)}${'.'.repeat(width - filled)}`;
      const what = p.phase === 'screening' ? 'screened' : p.phase === 'confirming' ? 'confirmed' : 'corners';
      stream.write(`\r[${bar}] ${p.done}/${p.total} ${what}, ${p.failed} failed, ETA ${Number.isFinite(eta) ? `${Math.ceil(eta)} s` : '?'}   `);
    },
    /** what: the opening line instead of "simulating N corners" (a Monte Carlo run screens first). */
    start(what?: string) {
      if (!tty) stream.write(`${what ?? `simulating ${total} corners`}\n`);
    },
    end() {
      if (tty) stream.write('\n');
    },
  };
}
