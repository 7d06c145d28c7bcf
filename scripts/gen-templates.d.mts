/** Text of src/netlist/templateText.ts generated from templates/*.cir. */
export function generate(): string;
