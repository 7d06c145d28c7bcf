/** Small SVG plotting primitives: linear scales, tick choice, path data and an axis frame. Pure. */
import { esc } from './escape.js';

export interface Scale {
  (v: number): number;
  d0: number;
  d1: number;
}

/** Linear map from the domain [d0, d1] to the pixel range [r0, r1]. */
export function linearScale(d0: number, d1: number, r0: number, r1: number): Scale {
  const k = d1 === d0 ? 0 : (r1 - r0) / (d1 - d0);
  const f = ((v: number) => r0 + (v - d0) * k) as Scale;
  f.d0 = d0;
  f.d1 = d1;
  return f;
}

/** Step of about `count` intervals over [min, max], from the 1-2-5 series. */
export function niceStep(min: number, max: number, count = 5): number {
  const span = Math.abs(max - min) || Math.abs(max) || 1;
  const raw = span / Math.max(count, 1);
  const p = 10 ** Math.floor(Math.log10(raw));
  const m = raw / p;
  return (m < 1.5 ? 1 : m < 3.5 ? 2 : m < 7.5 ? 5 : 10) * p;
}

/** Domain widened outward to whole steps, and the ticks on it. */
export function niceDomain(min: number, max: number, count = 5): { d0: number; d1: number; ticks: number[] } {
  if (!(max > min)) {
    const pad = Math.abs(min) * 0.1 || 1;
    min -= pad;
    max += pad;
  }
  const step = niceStep(min, max, count);
  const d0 = Math.floor(min / step + 1e-9) * step;
  const d1 = Math.ceil(max / step - 1e-9) * step;
  return { d0, d1, ticks: ticksIn(d0, d1, step) };
}

/** Multiples of step inside [d0, d1], rounded so they print cleanly. */
export function ticksIn(d0: number, d1: number, step: number): number[] {
  const out: number[] = [];
  for (let k = Math.ceil(d0 / step - 1e-9); k * step <= d1 + step * 1e-9; k++) out.push(Number((k * step).toPrecision(12)));
  return out;
}

/** Pixel coordinate with at most one decimal. */
export function px(v: number): string {
  return String(Math.round(v * 10) / 10);
}

/**
 * Path data through (xs[i], ys[i]); a null or non-finite y breaks the line. Pixel y is clamped to
 * [-limit, limit] so a curve far off the chart stays a small number (the plot area clips it). Each
 * run is simplified (Ramer-Douglas-Peucker) to `tolerance` pixels, which keeps the drawing within
 * that distance of the data while flat and straight stretches shrink to a few points.
 */
export function linePath(xs: readonly number[], ys: readonly (number | null)[], sx: Scale, sy: Scale, tolerance = 0.25, limit = 5000): string {
  const parts: string[] = [];
  let run: number[] = [];
  const flush = () => {
    const keep = simplify(run, tolerance);
    for (let k = 0; k < keep.length; k++) parts.push(`${k === 0 ? 'M' : 'L'}${px(run[2 * keep[k]!]!)} ${px(run[2 * keep[k]! + 1]!)}`);
    run = [];
  };
  for (let i = 0; i < xs.length; i++) {
    const y = ys[i];
    if (y === null || y === undefined || !Number.isFinite(y) || !Number.isFinite(xs[i]!)) {
      flush();
      continue;
    }
    run.push(sx(xs[i]!), Math.min(Math.max(sy(y), -limit), limit));
  }
  flush();
  return parts.join('');
}

/** Indices of the points (flat x,y pairs) that Ramer-Douglas-Peucker keeps at this tolerance, in order. */
export function simplify(flat: readonly number[], tolerance: number): number[] {
  const n = flat.length / 2;
  if (n <= 2) return Array.from({ length: n }, (_, i) => i);
  const keep = new Uint8Array(n);
  keep[0] = keep[n - 1] = 1;
  const stack: [number, number][] = [[0, n - 1]];
  while (stack.length) {
    const [a, b] = stack.pop()!;
    const ax = flat[2 * a]!, ay = flat[2 * a + 1]!, dx = flat[2 * b]! - ax, dy = flat[2 * b + 1]! - ay;
    const len = Math.hypot(dx, dy) || 1;
    let worst = -1;
    let far = tolerance;
    for (let i = a + 1; i < b; i++) {
      const dist = Math.abs(dy * (flat[2 * i]! - ax) - dx * (flat[2 * i + 1]! - ay)) / len;
      if (dist > far) { far = dist; worst = i; }
    }
    if (worst >= 0) {
      keep[worst] = 1;
      stack.push([a, worst], [worst, b]);
    }
  }
  const out: number[] = [];
  keep.forEach((k, i) => { if (k) out.push(i); });
  return out;
}

export interface AxisSpec {
  scale: Scale;
  ticks: number[];
  format: (v: number) => string;
  label?: string;
}

export interface FrameSpec {
  /** Plot area in the SVG's user units. */
  x: number;
  y: number;
  w: number;
  h: number;
  xAxis: AxisSpec;
  yAxis: AxisSpec;
  /** Right-hand axis: ticks are positions in the left axis's domain, labels its own. */
  y2?: { ticks: { at: number; text: string }[]; label: string };
  /** Draw the x tick labels (off for stacked panels except the lowest). @default true */
  xLabels?: boolean;
}

/** Grid (one path), border, tick labels and axis titles; scales map into the plot area's own coordinates. */
export function frame(f: FrameSpec): string {
  const { x, y, w, h } = f;
  const gx = f.xAxis.ticks.map((t) => `M${px(x + f.xAxis.scale(t))} ${y}v${h}`).join('');
  const gy = f.yAxis.ticks.map((t) => `M${x} ${px(y + f.yAxis.scale(t))}h${w}`).join('');
  const out = [`<path class="grid" d="${gx}${gy}"/>`, `<rect class="border" x="${x}" y="${y}" width="${w}" height="${h}"/>`];
  const yl = f.yAxis.ticks.map((t) => `<text x="${x - 4}" y="${px(y + f.yAxis.scale(t) + 3.5)}" text-anchor="end">${esc(f.yAxis.format(t))}</text>`);
  out.push(`<g class="tick">${yl.join('')}`);
  if (f.xLabels !== false) {
    out.push(...f.xAxis.ticks.map((t) => `<text x="${px(x + f.xAxis.scale(t))}" y="${y + h + 13}" text-anchor="middle">${esc(f.xAxis.format(t))}</text>`));
  }
  if (f.y2) out.push(...f.y2.ticks.map((t) => `<text x="${x + w + 4}" y="${px(y + f.yAxis.scale(t.at) + 3.5)}">${esc(t.text)}</text>`));
  out.push('</g>');
  if (f.xAxis.label && f.xLabels !== false) out.push(`<text class="axis" x="${x + w / 2}" y="${y + h + 28}" text-anchor="middle">${esc(f.xAxis.label)}</text>`);
  if (f.yAxis.label) out.push(`<text class="axis" transform="translate(${x - 36} ${y + h / 2}) rotate(-90)" text-anchor="middle">${esc(f.yAxis.label)}</text>`);
  if (f.y2) out.push(`<text class="axis" transform="translate(${x + w + 38} ${y + h / 2}) rotate(90)" text-anchor="middle">${esc(f.y2.label)}</text>`);
  return out.join('');
}
