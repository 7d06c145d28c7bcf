/**
 * CPU used by other processes while the bench runs (Linux /proc): machine busy time from
 * /proc/stat minus this process tree's time from /proc/self/stat (worker threads and waited-for
 * children such as ngspice included). Other engineers' tests on the same machine inflate
 * absolute times; this says how much.
 */
import { readFileSync } from 'node:fs';
import { cpus } from 'node:os';

/** Clock ticks per second of /proc (USER_HZ; 100 on Linux). */
const HZ = 100;

export interface CpuSnapshot {
  /** Busy CPU seconds of the whole machine, and of this process tree, since boot / start. */
  machine: number;
  own: number;
  wall: number;
}

export function cpuSnapshot(): CpuSnapshot | null {
  try {
    const f = readFileSync('/proc/stat', 'utf8').split('\n')[0]!.trim().split(/\s+/).slice(1).map(Number);
    const busy = f[0]! + f[1]! + f[2]! + (f[5] ?? 0) + (f[6] ?? 0) + (f[7] ?? 0);
    const self = readFileSync('/proc/self/stat', 'utf8');
    const g = self.slice(self.lastIndexOf(')') + 2).split(' ').map(Number);
    // fields 14-17 of /proc/self/stat (utime, stime, cutime, cstime) are 12-15 after "pid (comm)"
    const own = g[11]! + g[12]! + g[13]! + g[14]!;
    return { machine: busy / HZ, own: own / HZ, wall: performance.now() / 1000 };
  } catch {
    return null;
  }
}

/** Share of the machine's CPU capacity used by other processes between two snapshots (0..1). */
export function foreignShare(a: CpuSnapshot | null, b: CpuSnapshot | null): number | null {
  if (!a || !b || b.wall <= a.wall) return null;
  const foreign = (b.machine - a.machine) - (b.own - a.own);
  return Math.max(0, foreign) / ((b.wall - a.wall) * cpus().length);
}
