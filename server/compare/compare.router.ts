import { Router } from 'express';
import { compareCurvesRequestSchema, compareDesignRequestSchema, compareSavedDesignRequestSchema } from '@shared/schemas/compare';
import { requireSignIn } from '../http/access.ts';
import { parseBody } from '../http/validate.ts';
import type { CompareService } from './compare.service.ts';

/** Stateless comparisons; every signed-in role may use them. */
export function compareRouter(compare: CompareService): Router {
  const router = Router();
  router.use(requireSignIn);
  router.post('/curves', async (req, res) => {
    res.json(await compare.curves(parseBody(compareCurvesRequestSchema, req)));
  });
  router.post('/design', async (req, res) => {
    res.json(await compare.design(parseBody(compareDesignRequestSchema, req)));
  });
  router.post('/saved-design', async (req, res) => {
    res.json(await compare.savedDesign(parseBody(compareSavedDesignRequestSchema, req)));
  });
  return router;
}
