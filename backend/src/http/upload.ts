import { mkdirSync } from 'node:fs';
import { rm } from 'node:fs/promises';
import path from 'node:path';
import type { RequestHandler } from 'express';
import multer from 'multer';
import { MAX_UPLOAD_BYTES } from '@shared/limits.js';
import { AppError } from './app-error.js';

const NO_ROOM = 'The server has no room to store this file right now, so nothing was stored: try again later, and tell your administrator if it persists';
const UPLOAD_UNREADABLE = 'The upload was cut off or is incomplete, so nothing was stored: upload the file again';

const MULTER_MESSAGES: Partial<Record<multer.ErrorCode, string>> = {
  LIMIT_FILE_COUNT: 'Upload one file at a time',
  LIMIT_UNEXPECTED_FILE: 'Send the file in the form field named "file", one file at a time',
  LIMIT_FIELD_COUNT: 'The upload carries too many form fields: send only the file',
  LIMIT_PART_COUNT: 'The upload carries too many parts: send only the file',
  LIMIT_FIELD_KEY: 'A form field name in the upload is too long',
  LIMIT_FIELD_VALUE: 'A form field in the upload is too long',
};

/** One file in the field "file", streamed to disk (never held in memory), at most MAX_UPLOAD_BYTES. */
export function singleFileUpload(uploadDir: string): RequestHandler {
  mkdirSync(uploadDir, { recursive: true });
  const upload = multer({
    storage: multer.diskStorage({
      destination: uploadDir,
      filename: (_req, _file, cb) => cb(null, `${Date.now()}-${Math.random().toString(36).slice(2)}.upload`),
    }),
    limits: { fileSize: MAX_UPLOAD_BYTES, files: 1, fields: 5 },
    // Browsers send file names in UTF-8; multer's default reads them as Latin-1 ("KÃ¼hlwasser.csv").
    defParamCharset: 'utf8',
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
      // Multer removes a partly written file itself; the message is ours, never the parser's.
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') return next(new AppError(413, `The file is larger than ${MAX_UPLOAD_BYTES / 1024 / 1024} MB`));
        return next(new AppError(400, MULTER_MESSAGES[err.code] ?? UPLOAD_UNREADABLE));
      }
      const code = (err as { code?: unknown } | null)?.code;
      if (code === 'ENOSPC' || code === 'EDQUOT') {
        req.log?.error({ err }, 'upload refused: no room on the upload folder');
        return next(new AppError(507, NO_ROOM));
      }
      req.log?.warn({ err }, 'upload refused: the form could not be read');
      next(new AppError(400, UPLOAD_UNREADABLE));
    });
}

export const uploadDirFrom = (root: string, dir: string) => path.resolve(root, dir);
