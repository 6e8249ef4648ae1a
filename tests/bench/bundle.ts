import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { gzipSync } from 'node:zlib';
import type { BenchRow } from './engine.ts';

// Static imports between the built chunks (esbuild writes `from"./chunk-X.js"` and `import"./chunk-X.js"`);
// dynamic `import("./chunk-X.js")` is lazy loading and is left out.
const STATIC_IMPORT = /(?:from|import)\s*"\.\/([\w.-]+\.js)"/g;

/** Initial bundle of the built web app: the stylesheet and scripts index.html loads, with every chunk they import statically. */
export function measureInitialBundle(browserDir: string): BenchRow[] {
  const index = path.join(browserDir, 'index.html');
  if (!existsSync(index)) return [{ name: 'initial bundle', value: 'not built (run npm run build)' }];
  const html = readFileSync(index, 'utf8');
  const pending = [...html.matchAll(/(?:src|href)="([^"]+\.(?:js|css))"/g)].map((m) => m[1]);
  const seen = new Set<string>();
  let raw = 0;
  let gzip = 0;
  while (pending.length) {
    const file = pending.pop()!;
    if (seen.has(file)) continue;
    seen.add(file);
    const content = readFileSync(path.join(browserDir, file));
    raw += content.length;
    gzip += gzipSync(content, { level: 9 }).length;
    if (file.endsWith('.js')) for (const m of content.toString('utf8').matchAll(STATIC_IMPORT)) pending.push(m[1]);
  }
  const kB = (n: number) => `${(n / 1000).toFixed(1)} kB`;
  return [
    { name: 'initial bundle (raw)', value: `${kB(raw)} in ${seen.size} files` },
    { name: 'initial bundle (gzip transfer)', value: kB(gzip) },
  ];
}
