// The multipart side of a CSV upload (materials, cores): one file in memory under a size limit, the file
// of a request, and the optional `decisions` JSON field. multer's refusals become our one error shape.
import type { Request, RequestHandler } from 'express';
import multer from 'multer';
import { isStorableText, UNSTORABLE_TEXT_MESSAGE } from '@shared/schemas/text';
import { AppError, badRequest } from './errors.ts';
import { findUnsafeInput } from './storable-input.ts';

export const MAX_UPLOAD_BYTES = 2 * 1024 * 1024;
const uploadLimit = `${MAX_UPLOAD_BYTES / (1024 * 1024)} MB`;

/** What multer keeps of an uploaded file. */
export interface UploadedFile {
  originalname: string;
  buffer: Buffer;
}

/** One CSV file in the field "file", in memory, under the size limit. */
export function singleCsvUpload(): RequestHandler {
  const upload = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: MAX_UPLOAD_BYTES, files: 1, fields: 4, fieldSize: 256 * 1024, parts: 6 },
  }).single('file');
  return (req, res, next) => {
    upload(req, res, (error: unknown) => {
      if (!error) return next(unsafeUpload(req) ?? undefined);
      const code = (error as { code?: string }).code;
      if (code === 'LIMIT_FILE_SIZE')
        return next(
          new AppError(413, 'payload_too_large', `The file is larger than ${uploadLimit}.`, { file: `Larger than ${uploadLimit}` }),
        );
      if (code === 'LIMIT_FILE_COUNT' || code === 'LIMIT_UNEXPECTED_FILE')
        return next(badRequest('Send one CSV file in the field "file".', { file: 'One file only, in the field "file"' }));
      if (typeof code === 'string' && code.startsWith('LIMIT_'))
        return next(badRequest('The upload has too many or too large form fields.', { file: 'Malformed upload' }));
      next(badRequest('The upload is not a well-formed multipart form.', { file: 'Malformed upload' }));
    });
  };
}

/** The form fields and the file's name hold only text the database can store (they reach the import log). */
function unsafeUpload(req: Request): AppError | null {
  const file = (req as { file?: UploadedFile }).file;
  if (file && !isStorableText(file.originalname))
    return badRequest(`The file name: ${UNSTORABLE_TEXT_MESSAGE.toLowerCase()}.`, { file: UNSTORABLE_TEXT_MESSAGE });
  return findUnsafeInput(req.body);
}

export function uploadedFile(req: Request): UploadedFile {
  const file = (req as { file?: UploadedFile }).file;
  if (!file) throw badRequest('Choose a CSV file to upload.', { file: 'Choose a CSV file' });
  return file;
}

/** The `decisions` form field as parsed JSON (an empty object when absent); its shape is checked by the service. */
export function decisionsField(req: Request): unknown {
  const raw = ((req.body ?? {}) as Record<string, unknown>)['decisions'];
  if (raw === undefined || raw === '') return {};
  if (typeof raw !== 'string') throw badRequest('decisions must be a JSON object.', { decisions: 'Must be a JSON object' });
  try {
    const parsed = JSON.parse(raw) as unknown;
    const problem = findUnsafeInput(parsed, ['decisions']);
    if (problem) throw problem;
    return parsed;
  } catch (error) {
    if (error instanceof AppError) throw error;
    throw badRequest('decisions must be a JSON object.', { decisions: 'Must be a JSON object' });
  }
}
