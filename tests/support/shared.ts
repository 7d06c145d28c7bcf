import { fileURLToPath } from 'node:url';
import { join } from 'node:path';

/** The repository root (this file is tests/support/shared.ts). */
export const REPO_ROOT = fileURLToPath(new URL('../..', import.meta.url));

/**
 * Path of a file in the repository's own `shared/` folder (golden decks, recorded raw files,
 * report test data, reference check tables): `sharedFile('raw', 'rc-tran.cir')`.
 */
export function sharedFile(...parts: string[]): string {
  return join(REPO_ROOT, 'shared', ...parts);
}
