import { Router } from 'express';
import {
  copyDesign,
  createDesign,
  diffRevisions,
  getDesign,
  getRevision,
  importDesign,
  listDesigns,
  newRevision,
  updateRevision,
} from '@shared/api/designs';
import { actorOf } from '../http/access.ts';
import { mount } from '../http/endpoint.ts';
import type { GenerationOf } from '../http/generation.ts';
import type { DesignEditsService } from './design-edits.service.ts';
import type { DesignsService } from './designs.service.ts';

/** Mounted at /api. Everyone signed in reads designs; designers create them and change their own drafts. */
export function designsRouter(designs: DesignsService, edits: DesignEditsService, generationOf: GenerationOf = () => undefined): Router {
  const router = Router();
  mount(router, listDesigns, ({ query, req }) => designs.list(actorOf(req), query, generationOf(req, 'designs')));
  mount(router, createDesign, ({ body, req }) => edits.create(actorOf(req), body));
  mount(router, importDesign, ({ body, req }) => edits.importFile(actorOf(req), body));
  mount(router, getDesign, ({ params, req }) => designs.get(actorOf(req), params.id));
  mount(router, copyDesign, ({ params, body, req }) => edits.copy(actorOf(req), params.id, body));
  mount(router, diffRevisions, ({ params, query }) => designs.diff(params.id, query.from, query.to));
  mount(router, newRevision, ({ params, body, req }) => edits.newRevision(actorOf(req), params.id, body));
  mount(router, getRevision, ({ params, req }) => designs.revision(params.id, params.rev, actorOf(req)));
  mount(router, updateRevision, ({ params, body, req }) => edits.update(actorOf(req), params.id, params.rev, body));
  return router;
}
