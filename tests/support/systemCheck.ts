import { missingLine, missingPackages } from '../../scripts/system-packages.mjs';

/**
 * Global setup of the engine test tier: when ngspice or chromium is missing, stop with one line
 * that names the Debian package, instead of a wall of failures (and never a silent skip).
 */
export default function setup(): void {
  const line = missingLine(missingPackages());
  if (line) {
    process.stderr.write(`\n${line}\n\n`);
    process.exit(1);
  }
}
