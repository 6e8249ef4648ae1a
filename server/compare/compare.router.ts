import { Router } from 'express';
import { compareCurves, compareDesign, compareSavedDesign } from '@shared/api/compare';
import { mount } from '../http/endpoint.ts';
import type { CompareService } from './compare.service.ts';

/** Stateless comparisons; every signed-in role may use them. Mounted at /api. */
export function compareRouter(compare: CompareService): Router {
  const router = Router();
  mount(router, compareCurves, ({ body }) => compare.curves(body));
  mount(router, compareDesign, ({ body }) => compare.design(body));
  mount(router, compareSavedDesign, ({ body }) => compare.savedDesign(body));
  return router;
}
