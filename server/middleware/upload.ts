import type { Request, RequestHandler } from 'express';
import multer, { MulterError, type StorageEngine } from 'multer';
import { PHOTO_LIMITS } from '../../shared/domain/photos';
import { AppError } from '../errors';
import { ScanStream, type UploadScan } from '../images/inspect';
import { randomKeyPart, type ObjectStorage } from '../storage';

/** A file as the upload middleware leaves it: already in object storage under a temporary random key. */
export interface IncomingObject {
  key: string;
  bytes: number;
  scan: UploadScan;
}

type MulterFile = Express.Multer.File & { objectKey?: string; scan?: UploadScan };

/**
 * A multer storage engine that streams each file straight into object storage under a random
 * temporary key (never the client's file name), looking at its bytes on the way. multer calls
 * `_removeFile` for every stored file when the request fails (a limit hit), so a refusal
 * leaves nothing behind.
 */
function objectStorageEngine(storage: ObjectStorage): StorageEngine {
  return {
    _handleFile(_req, file, cb) {
      const key = `incoming/${randomKeyPart()}`;
      const scan = new ScanStream();
      file.stream.on('error', (err) => scan.destroy(err));
      file.stream.pipe(scan);
      storage.put(key, scan).then(
        ({ bytes }) => cb(null, { size: bytes, objectKey: key, scan: scan.scan } as Partial<MulterFile>),
        async (err) => {
          await storage.delete(key).catch(() => undefined);
          cb(err);
        },
      );
    },
    _removeFile(_req, file, cb) {
      const key = (file as MulterFile).objectKey;
      if (!key) return cb(null);
      storage.delete(key).then(() => cb(null), cb);
    },
  };
}

const mb = (n: number) => `${Math.round(n / (1024 * 1024))} MB`;

/** multer's limit errors in a keeper's words: 413 for a file too large, 400 for the rest. */
export function uploadError(err: unknown): AppError {
  if (err instanceof MulterError) {
    switch (err.code) {
      case 'LIMIT_FILE_SIZE':
        return new AppError('photo_too_large', `A photo is larger than ${mb(PHOTO_LIMITS.maxBytes)}. Choose a smaller one, or take it again at a lower size.`, 413);
      case 'LIMIT_FILE_COUNT':
        return new AppError('too_many_photos', `Send at most ${PHOTO_LIMITS.maxFiles} photos at a time.`, 400);
      case 'LIMIT_UNEXPECTED_FILE':
        return err.field === 'photos'
          ? new AppError('too_many_photos', `Send at most ${PHOTO_LIMITS.maxFiles} photos at a time.`, 400)
          : new AppError('invalid', 'Photos go in the "photos" field of the upload.', 400);
      default:
        return new AppError('invalid', 'The upload carries details that are not expected or too long.', 400);
    }
  }
  if (err instanceof AppError) return err;
  const message = err instanceof Error ? err.message : '';
  if (/multipart|boundary|Unexpected end of form|Malformed/i.test(message)) {
    return new AppError('invalid', 'The upload was cut off or is not a valid form. Try sending it again.', 400);
  }
  return err as AppError;
}

/** Accepts up to PHOTO_LIMITS.maxFiles files in the `photos` field and a few short text fields. */
export function photoUpload(storage: ObjectStorage): RequestHandler {
  const handler = multer({
    storage: objectStorageEngine(storage),
    limits: {
      fileSize: PHOTO_LIMITS.maxBytes,
      files: PHOTO_LIMITS.maxFiles,
      fields: 8,
      fieldSize: 100,
      fieldNameSize: 40,
      parts: PHOTO_LIMITS.maxFiles + 8,
      headerPairs: 100,
    },
  }).array('photos', PHOTO_LIMITS.maxFiles);
  return (req, res, next) => handler(req, res, (err?: unknown) => (err ? next(uploadError(err)) : next()));
}

/** The files multer stored for this request, in the order they were sent. */
export function incomingObjects(req: Request): IncomingObject[] {
  const files = (Array.isArray(req.files) ? req.files : []) as MulterFile[];
  return files.filter((f) => f.objectKey && f.scan).map((f) => ({ key: f.objectKey!, bytes: f.size, scan: f.scan! }));
}

/**
 * Runs a check before the body is read; on refusal the rest of the body is read and dropped
 * before answering, so the client gets the answer rather than a reset connection.
 */
export function beforeBody(check: (req: Request) => Promise<void>): RequestHandler {
  return (req, res, next) => {
    check(req).then(
      () => next(),
      (err) => {
        res.setHeader('Connection', 'close');
        if (req.complete || req.readableEnded) return next(err);
        let done = false;
        const go = () => {
          if (!done) {
            done = true;
            next(err);
          }
        };
        req.on('end', go);
        req.on('close', go);
        req.on('error', go);
        req.resume();
      },
    );
  };
}
