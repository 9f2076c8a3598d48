import type { RequestHandler } from 'express';
import multer from 'multer';
import { MAX_CURVE_FILE_BYTES } from '../../shared/curves';
import { badRequest, HttpError } from '../http/errors';

/** Bounds on a curve upload's multipart body besides the file: a few short text fields. */
const fieldLimits = { files: 1, fields: 8, parts: 9, fieldSize: 1024, fieldNameSize: 40 };

const sizeWords = `${MAX_CURVE_FILE_BYTES / (1024 * 1024)} MB`;

/** Multer's refusals as the API's error shape, each naming the field; any other failure of the form is a malformed body. */
function uploadError(error: unknown): HttpError {
  if (error instanceof multer.MulterError) {
    switch (error.code) {
      case 'LIMIT_FILE_SIZE':
        return new HttpError(413, 'payload_too_large', `The curve file is larger than ${sizeWords}.`, { file: `must be at most ${sizeWords}` });
      case 'LIMIT_FILE_COUNT':
        return badRequest('Send one curve file at a time.', { file: 'must be one file' });
      case 'LIMIT_UNEXPECTED_FILE':
        return badRequest(`Only the part named file may hold a file; '${String(error.field).slice(0, 40)}' did.`, { file: 'must be the only file part' });
      case 'LIMIT_FIELD_VALUE':
        return badRequest('A form field is too long.', { [String(error.field ?? 'body').slice(0, 40)]: 'is too long' });
      default:
        return badRequest('The form has too many or too long fields.', { body: 'has too many or too long fields' });
    }
  }
  return new HttpError(400, 'malformed_body', 'The multipart/form-data body could not be read.');
}

/**
 * Reads a curve upload's multipart body into memory (never to disk) within MAX_CURVE_FILE_BYTES,
 * then hands the route's schema a File in the field `file`, so its absence or a wrong type is
 * refused by name like any other field. A body that is not multipart is refused first: the JSON
 * parser would otherwise have read it.
 */
export function curveUpload(): RequestHandler {
  const read = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: MAX_CURVE_FILE_BYTES, ...fieldLimits },
    // Browsers send the file name as raw UTF-8; busboy's default would read it as Latin-1.
    defParamCharset: 'utf8',
  }).single('file');
  return (req, res, next) => {
    if (!req.is('multipart/form-data')) {
      next(badRequest('Send the curve file as multipart/form-data.', { file: 'must be sent as a multipart/form-data part named file' }));
      return;
    }
    try {
      read(req, res, (error?: unknown) => {
        if (error) {
          next(uploadError(error));
          return;
        }
        const body = (req.body ?? {}) as Record<string, unknown>;
        if (req.file) {
          // Copied into a plain object: multer's has no prototype, and File wants an ArrayBuffer-backed view.
          const bytes = new Uint8Array(req.file.buffer);
          req.body = { ...body, file: new File([bytes], req.file.originalname, { type: req.file.mimetype }) };
        } else {
          req.body = { ...body };
        }
        next();
      });
    } catch (error) {
      next(uploadError(error));
    }
  };
}
