import type { Request } from 'express';
import path from 'node:path';
import type { DataSource } from 'typeorm';
import { z } from 'zod';
import type { Config } from '../config.js';
import { idParam } from '../http/params.js';
import type { RouteSpec } from '../http/route-registry.js';
import { historianUpload } from '../http/upload.js';
import { assertRoomForUpload } from '../services/upload-housekeeping.js';
import { scopeOf } from '../policies/tenant-scope.js';
import {
  chooseSheet,
  errorReportCsv,
  findImport,
  importView,
  listImports,
  receiveUpload,
  startImport,
  undoImport,
  unitForUpload,
} from '../services/import.service.js';
import { chooseSheetBody, importsResponse, importView as importViewSchema, uploadResponse } from '@shared/schemas/imports.js';
import { statusWordsBody, statusWordsResponse } from '@shared/schemas/historian-status.js';
import { getStatusWords, setStatusWords } from '../services/historian-status.service.js';

const startBody = z.object({ mapping: z.unknown() }).strict();

export function importRoutes(ds: DataSource, config: Config): RouteSpec[] {
  const upload = historianUpload(path.resolve(config.UPLOAD_DIR));
  const unitOrThrow = (req: Request) => unitForUpload(ds, scopeOf(req.actor), idParam(req));
  return [
    {
      method: 'get',
      path: '/api/organisation/historian-status-words',
      response: statusWordsResponse,
      access: 'data.read',
      tenantScoped: true,
      description: "Historian status words that mark a missing value in an imported file: the defaults and your organisation's own",
      handler: async (req, res) => res.json(await getStatusWords(ds, scopeOf(req.actor))),
    },
    {
      method: 'put',
      path: '/api/organisation/historian-status-words',
      response: statusWordsResponse,
      access: 'members.manage',
      tenantScoped: true,
      body: statusWordsBody,
      description: "Replace your organisation's own historian status words (administrators; the defaults always apply)",
      handler: async (req, res) => res.json(await setStatusWords(ds, scopeOf(req.actor), req.body.words)),
    },
    {
      method: 'post',
      path: '/api/units/:id/uploads',
      response: uploadResponse,
      status: 201,
      access: 'data.write',
      tenantScoped: true,
      // The unit is checked before a byte is stored: outside the scope answers 404 whatever is sent.
      before: [
        async (req, _res, next) =>
          unitOrThrow(req)
            .then(() => assertRoomForUpload(ds.manager, scopeOf(req.actor).organisationId))
            .then(() => next(), next),
        upload,
      ],
      description:
        'Upload a historian CSV or XLSX (up to 200 MB), or files of one tag each (up to 20, in fields named "file", or one ZIP of them): returns the columns or tags, first rows and a proposed mapping',
      handler: async (req, res) => res.status(201).json(await receiveUpload(ds, scopeOf(req.actor), idParam(req), req.files as Express.Multer.File[])),
    },
    {
      method: 'post',
      path: '/api/imports/:id/sheet',
      response: uploadResponse,
      access: 'data.write',
      tenantScoped: true,
      body: chooseSheetBody,
      description: 'Read another sheet of an uploaded XLSX workbook for the mapping: its columns, first rows and a proposed mapping',
      handler: async (req, res) => res.json(await chooseSheet(ds, scopeOf(req.actor), idParam(req), req.body.sheet)),
    },
    {
      method: 'get',
      path: '/api/units/:id/imports',
      response: importsResponse,
      access: 'data.read',
      tenantScoped: true,
      description: 'Import history of a unit, newest first',
      handler: async (req, res) => res.json({ imports: await listImports(ds, scopeOf(req.actor), idParam(req)) }),
    },
    {
      method: 'get',
      path: '/api/imports/:id',
      response: importViewSchema,
      access: 'data.read',
      tenantScoped: true,
      description: 'One import: status, progress, counts by outcome and reason, errors by row and column',
      handler: async (req, res) => res.json(importView(await findImport(ds, scopeOf(req.actor), idParam(req)))),
    },
    {
      method: 'post',
      path: '/api/imports/:id/start',
      response: importViewSchema,
      status: 202,
      access: 'data.write',
      tenantScoped: true,
      body: startBody,
      description: 'Confirm the column mapping and import (runs in the background; poll the import for progress)',
      handler: async (req, res) => res.status(202).json(await startImport(ds, scopeOf(req.actor), idParam(req), req.body.mapping)),
    },
    {
      method: 'get',
      path: '/api/imports/:id/errors.csv',
      response: { file: ['text/csv'] },
      access: 'data.read',
      tenantScoped: true,
      description: 'Every file error by row and column, as CSV (cells that could run as formulas are neutralised)',
      handler: async (req, res) => {
        const report = await errorReportCsv(ds, scopeOf(req.actor), idParam(req));
        res.setHeader('content-type', 'text/csv; charset=utf-8');
        res.setHeader('content-disposition', `attachment; filename="${report.fileName.replace(/[^A-Za-z0-9._-]/g, '_')}"`);
        res.send(report.csv);
      },
    },
    {
      method: 'delete',
      path: '/api/imports/:id',
      response: importViewSchema,
      access: 'data.write',
      tenantScoped: true,
      description: 'Undo an import: remove its rows and recompute',
      handler: async (req, res) => res.json(await undoImport(ds, scopeOf(req.actor), idParam(req))),
    },
  ];
}
