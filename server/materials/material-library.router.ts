import { Router } from 'express';
import { materialEditSchema, materialExportQuerySchema } from '@shared/schemas/materials';
import { actorOf, requireRole, requireSignIn } from '../http/access.ts';
import { decisionsField, singleCsvUpload, uploadedFile } from '../http/csv-upload.ts';
import { parseBody, parseIdParam, parseQuery } from '../http/validate.ts';
import type { MaterialsService } from './materials.service.ts';

/** The library: upload, edit, retire, export, history. Mounted before the plain listing router. */
export function materialLibraryRouter(service: MaterialsService): Router {
  const router = Router();
  router.use(requireSignIn);
  const uploaders = requireRole('engineer', 'reviewer', 'admin');
  const curators = requireRole('reviewer', 'admin');

  router.get('/library', async (_req, res) => {
    res.json({ materials: await service.list() });
  });

  router.get('/template.csv', (_req, res) => {
    res.attachment('gapwright-materials-template.csv').type('text/csv; charset=utf-8').send(service.template());
  });

  router.get('/export.csv', async (req, res) => {
    const { ids } = parseQuery(materialExportQuerySchema, req);
    const csv = await service.exportCsv(ids?.map(Number));
    res.attachment('gapwright-materials.csv').type('text/csv; charset=utf-8').send(csv);
  });

  router.get('/imports', async (_req, res) => {
    res.json({ imports: await service.imports() });
  });

  router.post('/import/preview', uploaders, singleCsvUpload(), async (req, res) => {
    res.json(await service.preview(uploadedFile(req)));
  });

  router.post('/import/commit', uploaders, singleCsvUpload(), async (req, res) => {
    res.status(201).json(await service.commit(uploadedFile(req), decisionsField(req), actorOf(req)));
  });

  router.get('/:id/history', async (req, res) => {
    res.json({ versions: await service.history(parseIdParam(req)) });
  });

  router.patch('/:id', uploaders, async (req, res) => {
    res.status(201).json(await service.edit(parseIdParam(req), parseBody(materialEditSchema, req), actorOf(req)));
  });

  router.post('/:id/retire', curators, async (req, res) => {
    res.json(await service.setRetired(parseIdParam(req), true, actorOf(req)));
  });

  router.post('/:id/unretire', curators, async (req, res) => {
    res.json(await service.setRetired(parseIdParam(req), false, actorOf(req)));
  });

  return router;
}
