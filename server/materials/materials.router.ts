import { Router } from 'express';
import { requireSignIn } from '../http/access.ts';
import { toMaterialSummary } from './material-view.ts';
import type { MaterialsRepository } from './materials.repository.ts';

export function materialsRouter(materials: MaterialsRepository): Router {
  const router = Router();
  router.use(requireSignIn);
  router.get('/', async (req, res) => {
    const includeRetired = req.query['retired'] === 'include';
    res.json({ materials: (await materials.listCurrent(includeRetired)).map(toMaterialSummary) });
  });
  return router;
}
