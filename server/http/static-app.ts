import { existsSync } from 'node:fs';
import path from 'node:path';
import express, { Router } from 'express';

/** Serves the built Angular app; every non-API route falls back to index.html. */
export function staticAppRouter(staticDir: string): Router {
  const root = path.resolve(staticDir);
  const indexFile = path.join(root, 'index.html');
  const router = Router();
  router.use(
    express.static(root, {
      index: false,
      setHeaders: (res, file) => {
        // Hashed bundles never change; index.html must always be revalidated.
        const hashed = /-[A-Z0-9]{8,}\.(js|css)$/.test(file);
        res.setHeader('Cache-Control', hashed ? 'public, max-age=31536000, immutable' : 'no-cache');
      },
    }),
  );
  router.get('/{*splat}', (_req, res) => {
    if (!existsSync(indexFile)) {
      res.status(503).type('text/plain').send('The web app has not been built yet. Run "npm start" (or "npm run build").');
      return;
    }
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(indexFile);
  });
  return router;
}
