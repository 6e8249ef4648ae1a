import { Router } from 'express';
import { requireSignIn } from '../http/access.ts';
import type { CatalogueService } from './catalogue.service.ts';

export function catalogueRouter(catalogue: CatalogueService): Router {
  const router = Router();
  router.use(requireSignIn);
  router.get('/cores', (_req, res) => {
    res.json({ cores: catalogue.cores() });
  });
  return router;
}
