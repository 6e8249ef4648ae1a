import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import { materialEditSchema, materialExportQuerySchema } from '@shared/schemas/materials';
import { actorOf, requireRole, requireSignIn } from '../http/access.ts';
import { AppError, badRequest } from '../http/errors.ts';
import { parseBody, parseIdParam, parseQuery } from '../http/validate.ts';
import { MAX_UPLOAD_BYTES } from './material-csv.ts';
import type { MaterialsService, UploadedFile } from './materials.service.ts';

const uploadLimit = `${MAX_UPLOAD_BYTES / (1024 * 1024)} MB`;

/** One CSV file in memory, under the size limit; multer's refusals become our error shape. */
function singleCsvUpload(): RequestHandler {
  const upload = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: MAX_UPLOAD_BYTES, files: 1, fields: 4, fieldSize: 256 * 1024, parts: 6 },
  }).single('file');
  return (req, res, next) => {
    upload(req, res, (error: unknown) => {
      if (!error) return next();
      const code = (error as { code?: string }).code;
      if (code === 'LIMIT_FILE_SIZE') return next(new AppError(413, 'payload_too_large', `The file is larger than ${uploadLimit}.`, { file: `Larger than ${uploadLimit}` }));
      if (code === 'LIMIT_FILE_COUNT' || code === 'LIMIT_UNEXPECTED_FILE') return next(badRequest('Send one CSV file in the field "file".', { file: 'One file only, in the field "file"' }));
      if (typeof code === 'string' && code.startsWith('LIMIT_')) return next(badRequest('The upload has too many or too large form fields.', { file: 'Malformed upload' }));
      next(badRequest('The upload is not a well-formed multipart form.', { file: 'Malformed upload' }));
    });
  };
}

function uploadedFile(req: Parameters<RequestHandler>[0]): UploadedFile {
  const file = (req as { file?: UploadedFile }).file;
  if (!file) throw badRequest('Choose a CSV file to upload.', { file: 'Choose a CSV file' });
  return file;
}

function decisionsField(raw: unknown): unknown {
  if (raw === undefined || raw === '') return {};
  if (typeof raw !== 'string') throw badRequest('decisions must be a JSON object.', { decisions: 'Must be a JSON object' });
  try {
    return JSON.parse(raw) as unknown;
  } catch {
    throw badRequest('decisions must be a JSON object.', { decisions: 'Must be a JSON object' });
  }
}

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
    const csv = await service.exportCsv(ids ? ids.split(',').map(Number) : undefined);
    res.attachment('gapwright-materials.csv').type('text/csv; charset=utf-8').send(csv);
  });

  router.get('/imports', async (_req, res) => {
    res.json({ imports: await service.imports() });
  });

  router.post('/import/preview', uploaders, singleCsvUpload(), async (req, res) => {
    res.json(await service.preview(uploadedFile(req)));
  });

  router.post('/import/commit', uploaders, singleCsvUpload(), async (req, res) => {
    const body = (req.body ?? {}) as Record<string, unknown>;
    res.status(201).json(await service.commit(uploadedFile(req), decisionsField(body['decisions']), actorOf(req)));
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
