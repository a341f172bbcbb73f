import { mkdirSync } from 'node:fs';
import { rm } from 'node:fs/promises';
import path from 'node:path';
import type { Request, RequestHandler } from 'express';
import multer from 'multer';
import { MAX_UPLOAD_BYTES } from '@shared/limits.js';
import { MAX_TAG_FILES } from '@shared/schemas/imports.js';
import { AppError } from './app-error.js';

export const NO_ROOM =
  'The server has no room to store this file right now, so nothing was stored: try again later, and tell your administrator if it persists';
const UPLOAD_UNREADABLE = 'The upload was cut off or is incomplete, so nothing was stored: upload the file again';
/** Several files of one tag each, together (each also at most MAX_UPLOAD_BYTES). */
export const MAX_UPLOAD_FILES_BYTES = 512 * 1024 * 1024;

const MULTER_MESSAGES: Partial<Record<multer.ErrorCode, string>> = {
  LIMIT_FILE_COUNT: `Upload one file, or at most ${MAX_TAG_FILES} files of one tag each together`,
  LIMIT_UNEXPECTED_FILE: 'Send the file in the form field named "file" (several files of one tag each: each in a field of that name)',
  LIMIT_FIELD_COUNT: 'The upload carries too many form fields: send only the file',
  LIMIT_PART_COUNT: 'The upload carries too many parts: send only the file',
  LIMIT_FIELD_KEY: 'A form field name in the upload is too long',
  LIMIT_FIELD_VALUE: 'A form field in the upload is too long',
};

class FilesTooLarge extends Error {}

const uniqueName = () => `${Date.now()}-${Math.random().toString(36).slice(2)}.upload`;
const TOTAL = Symbol('upload bytes');

/**
 * Multer's disk storage, counting the bytes of all files of one request: past `maxTotal` the file being read is
 * stopped with an error; its part written is removed here and multer removes every file before it.
 */
function countedDiskStorage(dir: string, maxTotal: number): multer.StorageEngine {
  const disk = multer.diskStorage({ destination: dir, filename: (_req, _file, cb) => cb(null, uniqueName()) });
  return {
    _handleFile(req, file, cb) {
      const counted = req as Request & { [TOTAL]?: { bytes: number } };
      const total = (counted[TOTAL] ??= { bytes: 0 });
      // on an error the engine must leave nothing (multer removes only files that were stored): remove the part written
      disk._handleFile(req, file, (err, info) => {
        if (!err) return cb(null, info);
        const written = (file as { path?: string }).path;
        void (written ? rm(written, { force: true }) : Promise.resolve()).finally(() => cb(err));
      });
      file.stream.on('data', (chunk: Buffer) => {
        total.bytes += chunk.length;
        if (total.bytes > maxTotal && !file.stream.destroyed) file.stream.destroy(new FilesTooLarge());
      });
    },
    _removeFile: (req, file, cb) => disk._removeFile(req, file, cb),
  };
}

const filesOf = (req: Request): Express.Multer.File[] => (Array.isArray(req.files) ? req.files : []);

/**
 * A historian upload, streamed to disk (never held in memory): one file in the field "file" (at most
 * MAX_UPLOAD_BYTES) — or several files of one tag each in fields of that name (at most MAX_TAG_FILES, each at most
 * MAX_UPLOAD_BYTES and together at most MAX_UPLOAD_FILES_BYTES). `req.file` is the first, `req.files` all of them.
 */
export function historianUpload(uploadDir: string, maxFilesBytes = MAX_UPLOAD_FILES_BYTES): RequestHandler {
  mkdirSync(uploadDir, { recursive: true });
  const upload = multer({
    storage: countedDiskStorage(uploadDir, maxFilesBytes),
    limits: { fileSize: MAX_UPLOAD_BYTES, files: MAX_TAG_FILES, fields: 5 },
    // Browsers send file names in UTF-8; multer's default reads them as Latin-1 ("KÃ¼hlwasser.csv").
    defParamCharset: 'utf8',
  }).array('file', MAX_TAG_FILES);
  return (req, res, next) =>
    upload(req, res, (err: unknown) => {
      if (!err) {
        const files = filesOf(req);
        if (files.length === 0) return next(new AppError(400, 'Choose a CSV or XLSX file to upload'));
        const empty = files.find((f) => f.size === 0);
        if (empty) {
          const message = files.length === 1 ? 'The file is empty (0 bytes)' : `"${empty.originalname.slice(0, 120)}" is empty (0 bytes): nothing was stored`;
          return void Promise.all(files.map((f) => rm(f.path, { force: true }))).finally(() => next(new AppError(400, message)));
        }
        req.file = files[0];
        return next();
      }
      // Multer removes a partly written file itself; the message is ours, never the parser's.
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') return next(new AppError(413, `The file is larger than ${MAX_UPLOAD_BYTES / 1024 / 1024} MB`));
        return next(new AppError(400, MULTER_MESSAGES[err.code] ?? UPLOAD_UNREADABLE));
      }
      if (err instanceof FilesTooLarge)
        return next(new AppError(413, `The files together are larger than ${maxFilesBytes / 1024 / 1024} MB: nothing was stored`));
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
