import { Router } from 'express';
import type { GenerationOf } from '../http/generation.ts';
import { GenerationCache } from '../http/generation-cache.ts';
import { listMaterials } from '@shared/api/materials';
import { mount } from '../http/endpoint.ts';
import { toMaterialSummary } from './material-view.ts';
import type { MaterialsRepository } from './materials.repository.ts';

/** The change counter of a kind of data as read with the request's session (undefined if not read). */

export function materialsRouter(materials: MaterialsRepository, generationOf: GenerationOf = () => undefined): Router {
  const router = Router();
  const cache = new GenerationCache();
  // Read on most pages and changed rarely: answered from cache while the materials' change counter stands still.
  mount(router, listMaterials, async ({ query, req, res }) => {
    const includeRetired = query.retired === 'include';
    const answer = await cache.answer(includeRetired ? 'with-retired' : 'in-use', generationOf(req, 'materials'), async () => ({
      materials: (await materials.listCurrent(includeRetired)).map(toMaterialSummary),
    }));
    res.set('ETag', answer.etag).type('json').send(answer.body);
  });
  return router;
}
