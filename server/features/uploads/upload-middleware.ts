import multer from 'multer';
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import type { RequestHandler } from 'express';
import type { AppConfig } from '../../config/config';
import { AppError } from '../../http/errors';
import { hashingDiskStorage } from './hashing-disk-storage';
import { kindFromName, uploadErrors } from './sniff-upload';

/**
 * Streams one file to disk under a random name (never the client's), within the size
 * limit, hashing it on the way (`req.file.sha256`). Refuses other extensions before any byte is stored.
 */
export function uploadMiddleware(config: AppConfig): RequestHandler {
  const incoming = path.resolve(config.dataDir, 'uploads', 'incoming');
  mkdirSync(incoming, { recursive: true });
  const upload = multer({
    storage: hashingDiskStorage(incoming),
    limits: { fileSize: config.uploads.limitBytes, files: 1, fields: 5, fieldSize: 4096, parts: 8 },
    // Browsers send file names as raw UTF-8; busboy's default (latin1) would garble them.
    defParamCharset: 'utf8',
    fileFilter: (_req, file, cb) => {
      if (kindFromName(file.originalname)) cb(null, true);
      else cb(uploadErrors.wrongType());
    },
  }).single('file');

  const limitMb = Math.round(config.uploads.limitBytes / 1024 / 1024);
  return (req, res, next) => {
    upload(req, res, (err: unknown) => {
      if (!err) return next();
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') return next(uploadErrors.tooLarge(limitMb));
        return next(uploadErrors.missing());
      }
      // A malformed multipart body (busboy's plain errors) is the client's fault, not a 500;
      // system errors (disk full and the like) carry a code and stay server errors.
      if (!(err instanceof AppError) && !(err as NodeJS.ErrnoException)?.code) {
        return next(new AppError(400, 'upload.malformed', 'The upload could not be read: the request is not a well-formed file form.'));
      }
      next(err);
    });
  };
}
