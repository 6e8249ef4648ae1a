import { Router } from 'express';
import { acceptFit, commitLossPoints, fitLossPoints, lossPoints, lossPointTemplate, previewLossPoints } from '@shared/api/loss-points';
import { actorOf } from '../http/access.ts';
import { singleCsvUpload, uploadedFile } from '../http/csv-upload.ts';
import { mount } from '../http/endpoint.ts';
import type { LossPointsService } from './loss-points.service.ts';

/** A material version's loss points: read, upload (preview, commit), fit and accept a fit. Mounted at /api. */
export function lossPointsRouter(service: LossPointsService): Router {
  const router = Router();
  mount(router, lossPointTemplate, ({ res }) => {
    res.attachment('gapwright-loss-points-template.csv').type('text/csv; charset=utf-8').send(service.template());
  });
  mount(router, lossPoints, ({ params, req }) => service.list(params.id, actorOf(req).role));
  mount(router, previewLossPoints, ({ params, req }) => service.preview(params.id, uploadedFile(req)), [singleCsvUpload()]);
  mount(router, commitLossPoints, ({ params, req }) => service.commit(params.id, uploadedFile(req), actorOf(req)), [singleCsvUpload()]);
  mount(router, fitLossPoints, ({ params, body }) => service.fit(params.id, body));
  mount(router, acceptFit, ({ params, body, req }) => service.accept(params.id, body, actorOf(req)));
  return router;
}
