import type { Request, RequestHandler } from 'express';
import multer from 'multer';
import { ValidationError, type AnyObjectSchema } from 'yup';
import { REGISTER_LIMITS } from '../../shared/schemas/register';
import { AppError, errors } from '../errors';
import { validationItems } from '../http/validate';
import type { UploadedPhoto } from './register.service';

const MB = REGISTER_LIMITS.photoBytesMax / (1024 * 1024);

/** Photos arrive as multipart field `photos` (up to four), with the entry as JSON text in field `entry`. */
const receive = multer({
  storage: multer.memoryStorage(),
  limits: {
    fileSize: REGISTER_LIMITS.photoBytesMax,
    files: REGISTER_LIMITS.photosPerRequest,
    fields: 2,
    fieldSize: 64 * 1024,
    parts: REGISTER_LIMITS.photosPerRequest + 2,
    headerPairs: 200,
  },
}).array('photos', REGISTER_LIMITS.photosPerRequest);

function multerProblem(err: unknown): AppError {
  if (err instanceof multer.MulterError) {
    const field = err.field || 'photos';
    switch (err.code) {
      case 'LIMIT_FILE_SIZE':
        return new AppError(413, 'PHOTO_TOO_LARGE', `A photo is larger than ${MB} MB; take it at a lower resolution or choose a smaller file.`, [
          { code: 'PHOTO_TOO_LARGE', message: `A photo is larger than ${MB} MB; take it at a lower resolution or choose a smaller file.`, field },
        ]);
      case 'LIMIT_FILE_COUNT':
        return errors.badRequest('TOO_MANY_PHOTOS', `Send at most ${REGISTER_LIMITS.photosPerRequest} photos at a time.`, 'photos');
      case 'LIMIT_UNEXPECTED_FILE':
        return errors.badRequest('UNEXPECTED_FIELD', `Files go in the field "photos", not "${field}".`, field);
      case 'LIMIT_FIELD_VALUE':
        return errors.badRequest('FIELD_TOO_LARGE', `The field "${field}" is too long.`, field);
      default:
        return errors.badRequest('BAD_UPLOAD', `The upload could not be read (${err.message}).`, field);
    }
  }
  return errors.badRequest('BAD_UPLOAD', 'The upload could not be read; it may have been cut short. Try again.', 'photos');
}

/** Reads a multipart body into memory (nothing touches the disk until every photo has been checked). */
export const receivePhotos: RequestHandler = (req, res, next) => {
  if (!req.is('multipart/form-data')) return next();
  receive(req, res, (err: unknown) => next(err ? multerProblem(err) : undefined));
};

/** The photos a request carried (none for a JSON body). */
export const photosOf = (req: Request): UploadedPhoto[] => (Array.isArray(req.files) ? (req.files as UploadedPhoto[]) : []);

/** Validates a body against a strict schema, as validateBody does, for bodies that are not req.body. */
export async function validated<T>(schema: AnyObjectSchema, value: unknown): Promise<T> {
  if (value === null || typeof value !== 'object' || Array.isArray(value)) {
    throw errors.badRequest('VALIDATION_FAILED', 'Send a JSON object.');
  }
  try {
    return (await schema.validate(value, { abortEarly: false, strict: true })) as T;
  } catch (e) {
    if (e instanceof ValidationError) throw errors.validation(validationItems(e));
    throw e;
  }
}

/**
 * The entry of a create request: the JSON body, or for a multipart request the JSON text of field `entry`.
 */
export function entryBody(req: Request): unknown {
  if (!req.is('multipart/form-data')) return req.body ?? {};
  const text = (req.body as Record<string, unknown> | undefined)?.entry;
  if (typeof text !== 'string') throw errors.badRequest('VALIDATION_FAILED', 'Send the entry as JSON text in the multipart field "entry".', 'entry');
  try {
    return JSON.parse(text);
  } catch {
    throw errors.badRequest('INVALID_JSON', 'The field "entry" is not valid JSON.', 'entry');
  }
}
