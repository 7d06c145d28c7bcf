#!/usr/bin/env node
/**
 * The Debian packages the tests need besides npm's: ngspice (the system engine the engine tests
 * run against) and chromium (the HTML report's browser test).
 *
 *   node scripts/system-packages.mjs            install what is missing (root: apt-get update, then
 *                                               apt-get install -y); prints one line either way
 *   node scripts/system-packages.mjs --check    exit 1 with one line naming what is missing
 *
 * `npm run system-packages` runs the first form; the engine test tier runs the check first.
 */
import { accessSync, constants } from 'node:fs';
import { delimiter, join } from 'node:path';
import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';

/** Command the tests run, the Debian package that provides it, and what needs it. */
export const REQUIRED = [
  { command: 'ngspice', pkg: 'ngspice', neededBy: 'the system-engine tests' },
  { command: 'chromium', pkg: 'chromium', neededBy: 'the HTML report browser test' },
];

/** Absolute path of an executable on PATH, or null. */
export function findCommand(command, path = process.env.PATH ?? '') {
  for (const dir of path.split(delimiter).filter(Boolean)) {
    const file = join(dir, command);
    try {
      accessSync(file, constants.X_OK);
      return file;
    } catch {
      // not in this directory
    }
  }
  return null;
}

/** The entries of REQUIRED whose command is not on PATH. */
export function missingPackages(path = process.env.PATH ?? '') {
  return REQUIRED.filter((r) => findCommand(r.command, path) === null);
}

/** One line naming what is missing and how to install it; empty when nothing is. */
export function missingLine(missing) {
  if (missing.length === 0) return '';
  const what = missing.map((m) => `${m.command} (${m.neededBy})`).join(' and ');
  return `tankcheck tests: ${what} not found; install the Debian package${missing.length > 1 ? 's' : ''}: ` +
    `apt-get install -y ${missing.map((m) => m.pkg).join(' ')}   (or: npm run system-packages, as root)`;
}

function run(cmd, args) {
  const r = spawnSync(cmd, args, { stdio: ['ignore', 'ignore', 'inherit'], env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' } });
  if (r.status !== 0) {
    process.stderr.write(`system-packages: ${cmd} ${args.join(' ')} failed (exit ${r.status ?? r.signal})\n`);
    process.exit(1);
  }
}

function main(argv) {
  const missing = missingPackages();
  if (argv.includes('--check')) {
    if (missing.length) {
      process.stderr.write(missingLine(missing) + '\n');
      process.exit(1);
    }
    return;
  }
  if (missing.length === 0) {
    process.stdout.write(`system-packages: ${REQUIRED.map((r) => r.pkg).join(' and ')} present\n`);
    return;
  }
  const pkgs = missing.map((m) => m.pkg);
  if (process.getuid?.() !== 0) {
    process.stderr.write(`system-packages: ${pkgs.join(' ')} missing and this is not root; run: sudo apt-get update && sudo apt-get install -y ${pkgs.join(' ')}\n`);
    process.exit(1);
  }
  // a fresh machine has empty package lists: update before installing
  run('apt-get', ['update', '-qq']);
  run('apt-get', ['install', '-y', '-qq', ...pkgs]);
  process.stdout.write(`system-packages: installed ${pkgs.join(' ')}\n`);
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) main(process.argv.slice(2));
