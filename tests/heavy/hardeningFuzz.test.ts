// Heavy variant of the design-file hardening fuzz (npm run test:heavy): twenty times the cases of
// tests/hardening with fresh random seeds on every run; a failure prints the seed to replay it.
process.env['TANKCHECK_FUZZ_SCALE'] ??= '20';
await import('../hardening/designFuzz.test.js');
await import('../hardening/impossibleDesigns.test.js');
