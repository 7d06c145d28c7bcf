import { expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { TOOL_VERSION } from './version.js';

it('TOOL_VERSION is the package version', () => {
  expect(TOOL_VERSION).toBe(JSON.parse(readFileSync(new URL('../package.json', import.meta.url), 'utf8')).version);
});
