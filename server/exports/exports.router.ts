import { Router } from 'express';
import { exportRevision } from '@shared/api/exports';
import { EXPORT_KINDS, type ExportKind } from '@shared/schemas/designs';
import { notFound } from '../http/errors.ts';
import { mount } from '../http/endpoint.ts';
import type { ExportsService } from './exports.service.ts';

const isExportKind = (kind: string): kind is ExportKind => (EXPORT_KINDS as readonly string[]).includes(kind);

/** Mounted at /api: the files of a saved revision. */
export function exportsRouter(exports: ExportsService): Router {
  const router = Router();
  mount(router, exportRevision, async ({ params, res }) => {
    if (!isExportKind(params.kind)) throw notFound(`No export "${params.kind}"; choose one of ${EXPORT_KINDS.join(', ')}.`);
    const file = await exports.export(params.id, params.rev, params.kind);
    // attachment() guesses a type from the extension; the server's own type is set after it.
    res.attachment(file.fileName);
    res.setHeader('Content-Type', file.contentType);
    res.send(file.body);
  });
  return router;
}
