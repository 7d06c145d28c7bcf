// Worker thread for the wasm engine (eecircuit-engine 1.8.0, ngspice-45.2). Plain ESM JavaScript so that it
// runs unchanged from src/ (vitest) and from dist/ (copied by scripts/copy-assets.mjs).
//
// Message protocol: see wasm-protocol.ts. One job at a time: the Simulation keeps a single pending-run promise.
// Per job: ASCII check, includes written to MEMFS (removed afterwards), a placeholder out.raw, the title line
// replaced by a fresh nonce, run, then the nonce is looked for in the result header (stale-result guard).
import { parentPort, threadId } from 'node:worker_threads';
import { randomBytes } from 'node:crypto';

const ASCII = /^[\x00-\x7f]*$/;
// A valid one-row raw file written before each run: if ngspice's own `write` fails (e.g. the operating
// point failed), the engine reads this instead of throwing inside its loop (which would hang the run).
const PLACEHOLDER = Buffer.concat([
  Buffer.from('Title: tankcheck placeholder\nDate: -\nPlotname: none\nFlags: real\nNo. Variables: 1\n' +
    'No. Points: 1\nVariables:\n\t0\ttime\ttime\nBinary:\n', 'latin1'),
  Buffer.alloc(8),
]);

let current = null; // { jobId, lines }
console.error = (...args) => {
  const text = args.map(String).join(' ');
  if (!current) return;
  current.lines.push(text);
  if (/fatal error in ngspice/i.test(text)) {
    parentPort.postMessage({ type: 'fatal', jobId: current.jobId, lines: current.lines.slice() });
  }
};
console.info = () => {};
console.warn = () => {};
console.log = () => {};
// Swallow anything else written to stdio here: the parent never reads the worker's stdout/stderr
// streams, because reading them keeps the worker referenced (and the CLI alive) until it exits.
const discard = (_chunk, encoding, callback) => {
  const done = typeof encoding === 'function' ? encoding : callback;
  if (typeof done === 'function') done();
  return true;
};
process.stdout.write = discard;
process.stderr.write = discard;

let sim;
let FS;
let counter = 0;
try {
  const { Simulation } = await import('eecircuit-engine');
  sim = new Simulation();
  await sim.start();
  FS = sim.__getSpiceModuleForTests()?.FS;
  if (!FS) throw new Error('eecircuit-engine exposes no FS (test hook __getSpiceModuleForTests changed?)');
  const m = /ngspice-[0-9][\w.+-]*/.exec(sim.getInitInfo());
  parentPort.postMessage({ type: 'ready', version: m ? m[0] : 'ngspice-unknown' });
} catch (err) {
  parentPort.postMessage({ type: 'startError', message: String(err?.stack ?? err) });
}

function mkdirs(path) {
  const parts = path.split('/').filter(Boolean);
  let dir = '';
  for (const part of parts.slice(0, -1)) {
    dir += `/${part}`;
    try {
      FS.mkdir(dir);
    } catch (err) {
      if (!FS.analyzePath(dir).exists) throw err;
    }
  }
}

async function run(msg) {
  const lines = [];
  current = { jobId: msg.jobId, lines };
  const written = [];
  try {
    const includes = Object.entries(msg.includes ?? {});
    if (!ASCII.test(msg.deck) || includes.some(([, text]) => !ASCII.test(text))) {
      return { lines: ['Error: deck is not 7-bit ASCII'], nonceOk: false, constants: false };
    }
    for (const [path, text] of includes) {
      const abs = path.startsWith('/') ? path : `/${path}`;
      mkdirs(abs);
      FS.writeFile(abs, text);
      written.push(abs);
    }
    FS.writeFile('/out.raw', PLACEHOLDER);
    // ngspice lowercases the title; the nonce is lowercase ASCII so it survives unchanged.
    const nonce = `tankcheck-${threadId}-${++counter}-${randomBytes(6).toString('hex')}`;
    const deckLines = msg.deck.split('\n');
    deckLines[0] = nonce;
    sim.setNetList(deckLines.join('\n'));
    const r = await sim.runSim();
    lines.splice(0, lines.length, ...sim.getError().map(String));
    const nonceOk = typeof r?.header === 'string' && r.header.toLowerCase().includes(nonce);
    const constants = r?.numPoints === 1 && r?.numVariables === 0;
    const out = { lines, nonceOk, constants };
    if (nonceOk && !constants) {
      const bytes = FS.readFile('/out.raw');
      // Transfer only a buffer the bytes own alone (never a view into the wasm heap).
      out.raw = bytes.byteOffset === 0 && bytes.buffer.byteLength === bytes.length ? bytes : bytes.slice();
    }
    return out;
  } finally {
    for (const abs of written) {
      try {
        FS.unlink(abs);
      } catch {
        // already gone
      }
    }
    current = null;
  }
}

parentPort.on('message', async (msg) => {
  if (msg?.type !== 'run') return;
  let out;
  try {
    out = await run(msg);
  } catch (err) {
    out = { lines: [`Error: wasm worker failed: ${String(err?.message ?? err)}`], nonceOk: false, constants: false };
  }
  parentPort.postMessage({ type: 'done', jobId: msg.jobId, ...out }, out.raw ? [out.raw.buffer] : []);
});
