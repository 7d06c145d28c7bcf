import type { StudyPlan } from '../plan/plan.js';
import { assignShards, type ShardSpec } from '../plan/shard.js';

/**
 * The plan as text for `run --dry-run`: one line per item (plan index, corner id, source, simulate
 * or screened, estimated cost in fixed-frequency corners) and, with a shard, the shard of each item
 * and the cost of every shard. Nothing is simulated.
 */
export function renderPlan(plan: StudyPlan, shard?: ShardSpec): string {
  const where = shard ? assignShards(plan.items.map((it) => it.cost), shard.count) : null;
  const width = Math.max(6, ...plan.items.map((it) => it.corner.id.length));
  const head = `${'#'.padStart(5)}  ${'corner'.padEnd(width)}  source    work       cost${where ? '  shard' : ''}`;
  const rows = plan.items.map((it, i) => {
    const mine = where && where[i] === shard!.index - 1 ? ' *' : '';
    return `${String(it.index).padStart(5)}  ${it.corner.id.padEnd(width)}  ${it.source.padEnd(8)}  ${(it.simulate ? (it.corner.fs === null ? 'regulated' : 'simulate') : 'screened').padEnd(9)}  ${it.cost.toFixed(2).padStart(5)}${where ? `  ${where[i]! + 1}/${shard!.count}${mine}` : ''}`;
  });
  const simulated = plan.items.filter((it) => it.simulate).length;
  const total = plan.items.reduce((s, it) => s + it.cost, 0);
  const lines = [`plan: ${plan.items.length} corners, ${simulated} to simulate, estimated cost ${total.toFixed(2)} (1 = one fixed-frequency corner)`, head, ...rows];
  if (where && shard) {
    const loads = Array.from({ length: shard.count }, (_, k) => plan.items.reduce((s, it, i) => s + (where[i] === k ? it.cost : 0), 0));
    const counts = Array.from({ length: shard.count }, (_, k) => where.filter((w) => w === k).length);
    lines.push(`shards: ${loads.map((l, k) => `${k + 1}/${shard.count}: ${counts[k]} corners, cost ${l.toFixed(2)}`).join('; ')}`);
    lines.push(`this shard (${shard.index}/${shard.count}, marked *): ${counts[shard.index - 1]} corners`);
  }
  lines.push('dry run: nothing simulated, nothing written');
  return `${lines.join('\n')}\n`;
}
