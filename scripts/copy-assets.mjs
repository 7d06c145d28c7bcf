// Copies hand-written runtime assets (worker scripts, bundled report assets) from src/ to dist/.
import { cpSync, readdirSync, statSync, mkdirSync } from 'node:fs';
import { join, dirname } from 'node:path';

function walk(dir) {
  for (const name of readdirSync(dir)) {
    const p = join(dir, name);
    if (statSync(p).isDirectory()) walk(p);
    else if (/\.(mjs|css|txt)$/.test(name)) {
      const dest = join('dist', p.slice('src/'.length));
      mkdirSync(dirname(dest), { recursive: true });
      cpSync(p, dest);
    }
  }
}
walk('src');
