import { Router } from 'express';
import {
  copyDesignRequestSchema,
  createDesignRequestSchema,
  designFileSchema,
  designListQuerySchema,
  EXPORT_KINDS,
  newRevisionRequestSchema,
  revisionDiffQuerySchema,
  updateRevisionRequestSchema,
  type ExportKind,
} from '@shared/schemas/designs';
import type { ExportsService } from '../exports/exports.service.ts';
import { actorOf, requireRole, requireSignIn } from '../http/access.ts';
import { notFound } from '../http/errors.ts';
import type { GenerationOf } from '../materials/materials.router.ts';
import { parseBody, parseIdParam, parseQuery } from '../http/validate.ts';
import { DESIGNER_ROLES, type DesignsService } from './designs.service.ts';

/** Everyone signed in reads designs; engineers create them and change their own drafts. */
export function designsRouter(designs: DesignsService, exports: ExportsService, generationOf: GenerationOf = () => undefined): Router {
  const router = Router();
  router.use(requireSignIn);
  // Refused before the body is read: a role that may not design gets 403, not a validation error.
  const designers = requireRole(...DESIGNER_ROLES);

  router.get('/', async (req, res) => {
    res.json(await designs.list(actorOf(req), parseQuery(designListQuerySchema, req), generationOf(req, 'designs')));
  });

  router.post('/', designers, async (req, res) => {
    res.status(201).json(await designs.create(actorOf(req), parseBody(createDesignRequestSchema, req)));
  });

  router.post('/import', designers, async (req, res) => {
    res.status(201).json(await designs.importFile(actorOf(req), parseBody(designFileSchema, req)));
  });

  router.get('/:id', async (req, res) => {
    res.json(await designs.get(actorOf(req), parseIdParam(req)));
  });

  router.post('/:id/copy', designers, async (req, res) => {
    res.status(201).json(await designs.copy(actorOf(req), parseIdParam(req), parseBody(copyDesignRequestSchema, req)));
  });

  router.get('/:id/diff', async (req, res) => {
    const { from, to } = parseQuery(revisionDiffQuerySchema, req);
    res.json(await designs.diff(parseIdParam(req), from, to));
  });

  router.post('/:id/revisions', designers, async (req, res) => {
    res.status(201).json(await designs.newRevision(actorOf(req), parseIdParam(req), parseBody(newRevisionRequestSchema, req)));
  });

  router.get('/:id/revisions/:rev', async (req, res) => {
    res.json(await designs.revision(parseIdParam(req), parseIdParam(req, 'rev')));
  });

  router.patch('/:id/revisions/:rev', designers, async (req, res) => {
    res.json(await designs.update(actorOf(req), parseIdParam(req), parseIdParam(req, 'rev'), parseBody(updateRevisionRequestSchema, req)));
  });

  router.get('/:id/revisions/:rev/exports/:kind', async (req, res) => {
    const kind = String(req.params['kind']);
    if (!(EXPORT_KINDS as readonly string[]).includes(kind)) throw notFound(`No export "${kind}"; choose one of ${EXPORT_KINDS.join(', ')}.`);
    const file = await exports.export(parseIdParam(req), parseIdParam(req, 'rev'), kind as ExportKind);
    // attachment() guesses a type from the extension; the server's own type is set after it.
    res.attachment(file.fileName);
    res.setHeader('Content-Type', file.contentType);
    res.send(file.body);
  });

  return router;
}
