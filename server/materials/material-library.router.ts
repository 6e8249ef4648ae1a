import { Router } from 'express';
import {
  commitMaterialImport,
  editMaterial,
  exportMaterials,
  materialHistory,
  materialImports,
  materialLibrary,
  materialTemplate,
  previewMaterialImport,
  retireMaterial,
  unretireMaterial,
} from '@shared/api/materials';
import { actorOf } from '../http/access.ts';
import { decisionsField, singleCsvUpload, uploadedFile } from '../http/csv-upload.ts';
import { mount } from '../http/endpoint.ts';
import type { MaterialsService } from './materials.service.ts';

/** The library: upload, edit, retire, export, history. Mounted at /api before the plain listing router. */
export function materialLibraryRouter(service: MaterialsService): Router {
  const router = Router();
  mount(router, materialLibrary, ({ req }) => service.list(actorOf(req).role));
  mount(router, materialTemplate, ({ res }) => {
    res.attachment('gapwright-materials-template.csv').type('text/csv; charset=utf-8').send(service.template());
  });
  mount(router, exportMaterials, async ({ query, res }) => {
    const csv = await service.exportCsv(query.ids?.map(Number));
    res.attachment('gapwright-materials.csv').type('text/csv; charset=utf-8').send(csv);
  });
  mount(router, materialImports, async () => ({ imports: await service.imports() }));
  mount(router, previewMaterialImport, ({ req }) => service.preview(uploadedFile(req)), [singleCsvUpload()]);
  mount(router, commitMaterialImport, ({ req }) => service.commit(uploadedFile(req), decisionsField(req), actorOf(req)), [
    singleCsvUpload(),
  ]);
  mount(router, materialHistory, async ({ params, req }) => ({ versions: await service.history(params.id, actorOf(req).role) }));
  mount(router, editMaterial, ({ params, body, req }) => service.edit(params.id, body, actorOf(req)));
  mount(router, retireMaterial, ({ params, req }) => service.setRetired(params.id, true, actorOf(req)));
  mount(router, unretireMaterial, ({ params, req }) => service.setRetired(params.id, false, actorOf(req)));
  return router;
}
