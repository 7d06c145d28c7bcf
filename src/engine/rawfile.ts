/**
 * Pure parser for ngspice raw files (the `-r file.raw` / `write file.raw` output). No I/O.
 *
 * Format (read from ngspice-39 and ngspice-45.2 output; fixtures in shared/raw/):
 * a file holds one or more plots back to back. Each plot is a text header, one `Key: value` per line,
 * decoded here as latin1 so that character offsets equal byte offsets:
 *
 *   Title: <circuit title; ngspice lowercases it>
 *   Date: <date>
 *   Command: ngspice-45.2, Build ...      (optional; written by `write`, not by `-r`)
 *   Plotname: Transient Analysis | AC Analysis | Operating Point | ...
 *   Flags: real | complex                 (possibly more words, e.g. `unpadded`)
 *   No. Variables: N
 *   No. Points: P<padding spaces>         (patched at the end of a streamed `-r` run: 0 if it aborted)
 *   Variables:
 *   \t0\ttime\ttime                       (index, name, type, optional attributes such as grid=3)
 *   \t1\tv(out)\tvoltage
 *   Binary:                               (or `Values:` for the ASCII form)
 *
 * Binary data: P rows, each N little-endian float64 (the first is the scale: time, frequency...).
 * Complex plots store two float64 (re, im) per variable, scale included; the scale's imaginary part is
 * garbage and is dropped. ASCII data: per row `index<TAB>value` then one `<TAB>value` line per further
 * variable; complex values are written `re,im`. The next plot, if any, starts with `Title:` right after.
 *
 * A run that aborted (timestep too small, killed) leaves `No. Points: 0` or fewer bytes than declared;
 * rows are then inferred from the bytes present, a partial last row is dropped and `aborted` is set.
 * Names are lower-cased; old-style branch names `vx#branch` become `i(vx)`.
 */

/** One variable (column) of a plot. */
export interface RawVariable {
  index: number;
  /** Lower-case name: 'time', 'v(out)', 'i(vsense)'. */
  name: string;
  /** ngspice type word: 'time' | 'voltage' | 'current' | 'frequency' | 'notype' ... */
  type: string;
}

/** One plot (analysis result) of a raw file. */
export interface RawPlot {
  title: string;
  plotname: string;
  flags: 'real' | 'complex';
  variables: RawVariable[];
  /** Rows actually present (after dropping a partial last row). */
  points: number;
  /** `No. Points` as written in the header. */
  declaredPoints: number;
  /** True when the rows were inferred from the bytes because the header count was 0 or too large. */
  aborted: boolean;
  /** Values per variable name; the real part for complex plots. */
  vectors: Record<string, Float64Array>;
  /** Imaginary parts (complex plots only; not for the scale). */
  imag?: Record<string, Float64Array>;
}

/** Thrown for input that is not an ngspice raw file (missing header fields or data marker). */
export class RawFormatError extends Error {
  override name = 'RawFormatError';
}

interface Header {
  title: string;
  plotname: string;
  complex: boolean;
  nVars: number;
  nPoints: number;
  variables: RawVariable[];
}

/** Lower-cases a vector name and maps `x#branch` to `i(x)`. */
export function normaliseVectorName(name: string): string {
  const n = name.trim().toLowerCase();
  const m = /^([^()#\s]+)#branch$/.exec(n);
  return m ? `i(${m[1]})` : n;
}

/** `truncated`: the header was cut off by an aborted run; accept what is there. */
function parseHeader(text: string, truncated = false): Header {
  const field = (key: string): string | undefined => {
    const m = new RegExp(`^${key}:[ \\t]*(.*)$`, 'm').exec(text);
    return m ? m[1].trim() : undefined;
  };
  const nVars = Number(field('No\\. Variables') ?? (truncated ? 0 : NaN));
  const nPoints = Number(field('No\\. Points') ?? (truncated ? 0 : NaN));
  if (!Number.isInteger(nVars) || nVars < (truncated ? 0 : 1) || !Number.isInteger(nPoints) || nPoints < 0) {
    throw new RawFormatError('raw file header lacks a valid "No. Variables" / "No. Points"');
  }
  const varsAt = text.search(/^Variables:/m);
  if (varsAt < 0 && !truncated) throw new RawFormatError('raw file header lacks "Variables:"');
  const varLines = varsAt < 0 ? [] : text.slice(varsAt).split('\n').slice(1).filter((l) => /^\s*\d+\s+\S+\s+\S+/.test(l));
  if (!truncated && varLines.length < nVars) throw new RawFormatError(`raw file lists ${varLines.length} of ${nVars} variables`);
  const variables: RawVariable[] = varLines.slice(0, nVars).map((line, i) => {
    const [idx, name, type] = line.trim().split(/\s+/);
    if (Number(idx) !== i || !name) throw new RawFormatError(`bad variable line: ${JSON.stringify(line)}`);
    return { index: i, name: normaliseVectorName(name), type: (type ?? 'notype').toLowerCase() };
  });
  const flags = (field('Flags') ?? 'real').toLowerCase();
  const complex = /\bcomplex\b/.test(flags);
  return { title: field('Title') ?? '', plotname: field('Plotname') ?? '', complex, nVars: variables.length, nPoints, variables };
}

function emptyPlot(h: Header): RawPlot {
  const vectors: Record<string, Float64Array> = {};
  return { title: h.title, plotname: h.plotname, flags: h.complex ? 'complex' : 'real', variables: h.variables, points: 0, declaredPoints: h.nPoints, aborted: false, vectors };
}

/** Allocates arrays for `rows` rows; the scale (index 0) gets no imaginary part. */
function allocate(plot: RawPlot, rows: number): Float64Array[][] {
  plot.points = rows;
  if (plot.flags === 'complex') plot.imag = {};
  return plot.variables.map((v) => {
    const re = new Float64Array(rows);
    plot.vectors[v.name] = re;
    if (plot.flags !== 'complex' || v.index === 0) return [re];
    const im = new Float64Array(rows);
    plot.imag![v.name] = im;
    return [re, im];
  });
}

function readBinary(bytes: Uint8Array, start: number, h: Header, plot: RawPlot): number {
  const rowBytes = h.nVars * (h.complex ? 16 : 8);
  const available = Math.floor((bytes.length - start) / rowBytes);
  let rows = h.nPoints;
  if (rows === 0 || available < rows) {
    rows = rows === 0 ? rowsBeforeNextPlot(bytes, start, rowBytes, available) : available;
    plot.aborted = true;
  }
  const cols = allocate(plot, rows);
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const stride = h.complex ? 2 : 1;
  for (let r = 0, off = start; r < rows; r++) {
    for (let v = 0; v < h.nVars; v++, off += 8 * stride) {
      const c = cols[v];
      c[0][r] = view.getFloat64(off, true);
      if (c.length > 1) c[1][r] = view.getFloat64(off + 8, true);
    }
  }
  return start + rows * rowBytes;
}

/** With `No. Points: 0` the data runs to the end, unless another plot header starts on a row boundary. */
function rowsBeforeNextPlot(bytes: Uint8Array, start: number, rowBytes: number, available: number): number {
  const buf = asBuffer(bytes);
  for (let at = buf.indexOf('Title: ', start, 'latin1'); at >= 0; at = buf.indexOf('Title: ', at + 1, 'latin1')) {
    if ((at - start) % rowBytes === 0 && /\nPlotname:/.test(latin1(bytes, at, Math.min(at + 4096, bytes.length)))) {
      return (at - start) / rowBytes;
    }
  }
  return available;
}

function readAscii(bytes: Uint8Array, start: number, h: Header, plot: RawPlot): number {
  let end = bytes.length;
  const next = asBuffer(bytes).indexOf('\nTitle:', start, 'latin1');
  if (next >= 0) end = next + 1;
  const tokens = latin1(bytes, start, end).split(/\s+/).filter((t) => t !== '');
  const perRow = h.nVars + 1;
  let rows = Math.floor(tokens.length / perRow);
  if (h.nPoints > 0 && rows >= h.nPoints) rows = h.nPoints;
  else plot.aborted = true;
  const cols = allocate(plot, rows);
  for (let r = 0; r < rows; r++) {
    for (let v = 0; v < h.nVars; v++) {
      const [re, im] = tokens[r * perRow + 1 + v].split(',');
      cols[v][0][r] = Number(re);
      if (cols[v].length > 1) cols[v][1][r] = Number(im ?? 0);
    }
  }
  return end;
}

function asBuffer(bytes: Uint8Array): Buffer {
  return Buffer.from(bytes.buffer, bytes.byteOffset, bytes.length);
}

function latin1(bytes: Uint8Array, from: number, to: number): string {
  return asBuffer(bytes).toString('latin1', from, to);
}

/**
 * Parses every plot of an ngspice raw file (binary or ASCII).
 * @throws RawFormatError when the bytes do not start with a raw-file header.
 */
export function parseRaw(bytes: Uint8Array): RawPlot[] {
  const buf = asBuffer(bytes);
  const plots: RawPlot[] = [];
  let pos = 0;
  while (pos < buf.length) {
    const titleAt = buf.indexOf('Title:', pos, 'latin1');
    if (titleAt < 0) break;
    if (buf.subarray(pos, titleAt).some((b) => b !== 0x20 && b !== 0x0a && b !== 0x0d)) break;
    const bin = buf.indexOf('\nBinary:\n', titleAt, 'latin1');
    const asc = buf.indexOf('\nValues:\n', titleAt, 'latin1');
    const isBinary = bin >= 0 && (asc < 0 || bin < asc);
    const mark = isBinary ? bin : asc;
    if (mark < 0) {
      // Only a run aborted mid-header leaves no data marker: keep it as a plot with no rows.
      const plot = emptyPlot(parseHeader(latin1(bytes, titleAt, bytes.length).replace(/\r/g, ''), true));
      allocate(plot, 0);
      plot.aborted = true;
      plots.push(plot);
      break;
    }
    const header = parseHeader(latin1(bytes, titleAt, mark + 1).replace(/\r/g, ''));
    const plot = emptyPlot(header);
    const dataStart = mark + '\nBinary:\n'.length; // same length as '\nValues:\n'
    pos = isBinary ? readBinary(bytes, dataStart, header, plot) : readAscii(bytes, dataStart, header, plot);
    plots.push(plot);
  }
  if (plots.length === 0 && bytes.length > 0) throw new RawFormatError('no "Title:" header found');
  return plots;
}
