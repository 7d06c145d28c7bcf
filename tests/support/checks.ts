import { readFileSync } from 'node:fs';
import { sharedFile } from './shared.js';

/**
 * A reference check table from shared/checks/ (JSON). Each table names its published source (or
 * says how its values were computed) in its `source` field; tests cite that field rather than
 * restating it.
 */
export function readChecks<T>(name: string): T & { title: string; source: string } {
  return JSON.parse(readFileSync(sharedFile('checks', name), 'utf8')) as T & { title: string; source: string };
}
