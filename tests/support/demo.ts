import { loadDesignOrThrow } from '../../src/design/index.js';
import type { Design } from '../../src/design/types.js';

export const DEMO_FILE = new URL('../../examples/demo.yaml', import.meta.url).pathname;

/** The demo design as the loader reads it. */
export async function loadDemo(): Promise<Design> {
  return (await loadDesignOrThrow(DEMO_FILE)).design;
}
