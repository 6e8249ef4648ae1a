import type { Express } from 'express';

interface LayerLike {
  rawPath?: string | string[];
  route?: { path: string; methods: Record<string, boolean> };
  handle: { stack?: LayerLike[] };
}

/** Every route mounted on the app as "METHOD /full/path", found by walking Express 5's router. */
export function listRoutes(app: Express): string[] {
  const out = new Set<string>();
  const walk = (stack: LayerLike[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        for (const method of Object.keys(layer.route.methods)) {
          if (method === '_all') continue;
          out.add(`${method.toUpperCase()} ${(prefix + layer.route.path).replace(/\/$/, '') || '/'}`);
        }
      } else if (layer.handle?.stack) {
        const raw = Array.isArray(layer.rawPath) ? layer.rawPath[0] : layer.rawPath;
        walk(layer.handle.stack, prefix + (raw && raw !== '/' ? raw : ''));
      }
    }
  };
  walk((app as unknown as { router: { stack: LayerLike[] } }).router.stack, '');
  return [...out].filter((r) => r.includes(' /api/')).sort();
}
