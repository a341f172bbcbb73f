import { mkdirSync } from 'node:fs';
import { rm } from 'node:fs/promises';
import path from 'node:path';
import type { RequestHandler } from 'express';
import multer from 'multer';
import { MAX_UPLOAD_BYTES } from '@shared/limits.js';
import { AppError } from './app-error.js';

/** One file in the field "file", streamed to disk (never held in memory), at most MAX_UPLOAD_BYTES. */
export function singleFileUpload(uploadDir: string): RequestHandler {
  mkdirSync(uploadDir, { recursive: true });
  const upload = multer({
    storage: multer.diskStorage({
      destination: uploadDir,
      filename: (_req, _file, cb) => cb(null, `${Date.now()}-${Math.random().toString(36).slice(2)}.upload`),
    }),
    limits: { fileSize: MAX_UPLOAD_BYTES, files: 1, fields: 5 },
  }).single('file');
  return (req, res, next) =>
    upload(req, res, (err: unknown) => {
      if (!err) {
        if (!req.file) return next(new AppError(400, 'Choose a CSV or XLSX file to upload'));
        if (req.file.size === 0) {
          const empty = req.file.path;
          return void rm(empty, { force: true }).finally(() => next(new AppError(400, 'The file is empty (0 bytes)')));
        }
        return next();
      }
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') return next(new AppError(413, `The file is larger than ${MAX_UPLOAD_BYTES / 1024 / 1024} MB`));
        return next(new AppError(400, `The upload could not be read: ${err.message}`));
      }
      next(err);
    });
}

export const uploadDirFrom = (root: string, dir: string) => path.resolve(root, dir);
