/** HTML escaping and anchor names for the report. Every string that comes from results goes through here. */

const ENTITIES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

/** Text safe for element content and for double- or single-quoted attribute values. */
export function esc(value: unknown): string {
  return String(value ?? '').replace(/[&<>"']/g, (c) => ENTITIES[c]!);
}

/**
 * A valid, collision-free HTML id fragment for any corner id: [A-Za-z0-9.-] pass through, every other
 * character (the underscore included) becomes _hex_. Corner ids are [a-z0-9_.-] in practice, but
 * results files are user input.
 */
export function idPart(id: string): string {
  return Array.from(id, (ch) => (/[A-Za-z0-9.-]/.test(ch) ? ch : `_${ch.codePointAt(0)!.toString(16)}_`)).join('');
}

/** Anchor of a corner's table row. */
export function rowAnchor(cornerId: string): string {
  return `c-${idPart(cornerId)}`;
}

/** Anchor of a corner's waveform figure. */
export function waveAnchor(cornerId: string): string {
  return `w-${idPart(cornerId)}`;
}

/** Anchor of a bench point's row in the measured-points table (`run --measured`). */
export function benchAnchor(cornerId: string): string {
  return `b-${idPart(cornerId)}`;
}
