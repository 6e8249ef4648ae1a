import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { gzipSync } from 'node:zlib';
import type { BenchRow } from './engine.ts';

/** Initial bundle of the built web app: every script and stylesheet index.html loads, raw and gzip. */
export function measureInitialBundle(browserDir: string): BenchRow[] {
  const index = path.join(browserDir, 'index.html');
  if (!existsSync(index)) return [{ name: 'initial bundle', value: 'not built (run npm run build)' }];
  const html = readFileSync(index, 'utf8');
  const files = [...html.matchAll(/(?:src|href)="([^"]+\.(?:js|css))"/g)].map((m) => m[1]);
  let raw = 0;
  let gzip = 0;
  for (const file of files) {
    const content = readFileSync(path.join(browserDir, file));
    raw += content.length;
    gzip += gzipSync(content, { level: 9 }).length;
  }
  const kB = (n: number) => `${(n / 1000).toFixed(1)} kB`;
  return [
    { name: 'initial bundle (raw)', value: `${kB(raw)} in ${files.length} files` },
    { name: 'initial bundle (gzip transfer)', value: kB(gzip) },
  ];
}
