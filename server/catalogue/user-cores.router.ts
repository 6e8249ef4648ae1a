import { Router } from 'express';
import {
  commitCoreImport,
  coreTemplate,
  createUserCore,
  editUserCore,
  previewCoreImport,
  retireUserCore,
  unretireUserCore,
  userCoreHistory,
} from '@shared/api/catalogue';
import { actorOf } from '../http/access.ts';
import { decisionsField, singleCsvUpload, uploadedFile } from '../http/csv-upload.ts';
import { mount } from '../http/endpoint.ts';
import type { UserCoresService } from './user-cores.service.ts';

/** User cores (one at a time or a CSV file); the listing itself is GET /catalogue/cores in catalogue.router.ts. Mounted at /api. */
export function userCoresRouter(cores: UserCoresService): Router {
  const router = Router();
  mount(router, createUserCore, ({ body, req }) => cores.create(body, actorOf(req)));
  mount(router, coreTemplate, ({ res }) => {
    res.attachment('gapwright-cores-template.csv').type('text/csv; charset=utf-8').send(cores.template());
  });
  mount(router, previewCoreImport, ({ req }) => cores.preview(uploadedFile(req)), [singleCsvUpload()]);
  mount(router, commitCoreImport, ({ req }) => cores.commit(uploadedFile(req), decisionsField(req), actorOf(req)), [singleCsvUpload()]);
  mount(router, userCoreHistory, async ({ params, req }) => ({ versions: await cores.history(params.id, actorOf(req).role) }));
  mount(router, editUserCore, ({ params, body, req }) => cores.edit(params.id, body, actorOf(req)));
  mount(router, retireUserCore, ({ params, req }) => cores.setRetired(params.id, true, actorOf(req)));
  mount(router, unretireUserCore, ({ params, req }) => cores.setRetired(params.id, false, actorOf(req)));
  return router;
}
