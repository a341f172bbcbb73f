import type { DataSource } from 'typeorm';
import {
  caseApprove,
  caseCommentCreate,
  caseComment,
  caseCommentsResponse,
  caseCreate,
  caseListQuery,
  caseListResponse,
  casePatch,
  caseReturn,
  caseView,
  type CaseListQuery,
} from '@shared/schemas/cases.js';
import type { Config } from '../config.js';
import { baseUrl } from '../http/base-url.js';
import { caseWriteLimiter } from '../http/rate-limits.js';
import { idParam } from '../http/params.js';
import type { RouteSpec } from '../http/route-registry.js';
import { scopeOf } from '../policies/tenant-scope.js';
import { addComment, listComments } from '../services/cases/case-comments.js';
import { caseFile, type CaseFileKind } from '../services/cases/case-files.js';
import { changeCaseStatus, type Transition } from '../services/cases/case-transitions.js';
import { copyCase } from '../services/cases/copy-case.js';
import { createCase } from '../services/cases/create-case.js';
import { editCase } from '../services/cases/edit-case.js';
import { getCase } from '../services/cases/get-case.js';
import { listCases } from '../services/cases/list-cases.js';

export function caseRoutes(ds: DataSource, config: Config): RouteSpec[] {
  /** One count for creating, editing and copying cases, each a calculation (after sign-in: counted per member). */
  const calculationLimit = [caseWriteLimiter(ds)];
  const file = (kind: CaseFileKind, path: string, contentType: string, description: string): RouteSpec => ({
    method: 'get',
    path,
    access: 'data.read',
    tenantScoped: true,
    response: { file: [contentType] },
    description,
    handler: async (req, res) => {
      const f = await caseFile(ds, scopeOf(req.actor), idParam(req), kind);
      res.setHeader('content-type', f.contentType);
      res.setHeader('content-disposition', `attachment; filename="${f.fileName}"`);
      res.send(f.body);
    },
  });
  const transition = (name: Transition, access: RouteSpec['access'], description: string, body?: RouteSpec['body']): RouteSpec => ({
    method: 'post',
    path: `/api/cases/:id/${name}`,
    access,
    tenantScoped: true,
    ...(body ? { body } : {}),
    response: caseView,
    description,
    handler: async (req, res) =>
      res.json(
        await changeCaseStatus(ds, scopeOf(req.actor), idParam(req), name, {
          reason: (req.body as { reason?: string } | undefined)?.reason,
          seenUpdatedAt: (req.body as { seenUpdatedAt?: string } | undefined)?.seenUpdatedAt,
          baseUrl: baseUrl(config, req),
        }),
      ),
  });
  return [
    {
      method: 'get',
      path: '/api/cases',
      access: 'data.read',
      tenantScoped: true,
      query: caseListQuery,
      response: caseListResponse,
      description: 'Cleaning cases the member may see (viewers: approved ones), newest change first; filter by status and unit',
      handler: async (req, res) => res.json({ cases: await listCases(ds, scopeOf(req.actor), req.validQuery as CaseListQuery) }),
    },
    {
      method: 'get',
      path: '/api/units/:id/cases',
      access: 'data.read',
      tenantScoped: true,
      response: caseListResponse,
      description: 'Cleaning cases of one unit the member may see',
      handler: async (req, res) => res.json({ cases: await listCases(ds, scopeOf(req.actor), { unitId: idParam(req) }) }),
    },
    {
      method: 'post',
      path: '/api/units/:id/cases',
      access: 'data.write',
      tenantScoped: true,
      body: caseCreate,
      before: calculationLimit,
      response: caseView,
      status: 201,
      description:
        'Start a draft cleaning case on a unit: inputs prefilled from its fouling trend, seasonal history, setup, prices, planned outages and the cleaning-method library, results computed (409 when the unit lacks setup or a fouling trend)',
      handler: async (req, res) => res.status(201).json(await createCase(ds, scopeOf(req.actor), idParam(req), req.body)),
    },
    {
      method: 'get',
      path: '/api/cases/:id',
      access: 'data.read',
      tenantScoped: true,
      response: caseView,
      description: 'One cleaning case: inputs with their sources, results as built, the data it was built from, newer data, and what the member may do with it',
      handler: async (req, res) => res.json(await getCase(ds, scopeOf(req.actor), idParam(req))),
    },
    {
      method: 'patch',
      path: '/api/cases/:id',
      access: 'data.write',
      tenantScoped: true,
      body: casePatch,
      before: calculationLimit,
      response: caseView,
      description: 'Change a draft or returned case’s title or inputs; results are recomputed and changed inputs marked entered (409 in any other status)',
      handler: async (req, res) => res.json(await editCase(ds, scopeOf(req.actor), idParam(req), req.body)),
    },
    transition('submit', 'data.write', 'Submit a draft or returned case for a decision; approvers and administrators who see the unit get an e-mail'),
    transition(
      'approve',
      'cases.approve',
      'Approve a submitted case (never one the member wrote, changed since the last decision or submitted); with seenUpdatedAt, 409 when the case changed since; the author gets an e-mail',
      caseApprove,
    ),
    transition(
      'return',
      'cases.approve',
      'Send a submitted case back with a reason (never one the member wrote, changed since the last decision or submitted); with seenUpdatedAt, 409 when the case changed since; the author gets an e-mail',
      caseReturn,
    ),
    transition('archive', 'data.write', 'Archive a draft, returned or approved case'),
    {
      method: 'post',
      path: '/api/cases/:id/copy',
      access: 'data.write',
      tenantScoped: true,
      before: calculationLimit,
      response: caseView,
      status: 201,
      description: 'Copy a case as a new draft: entered inputs kept, measured and prefilled ones refreshed from the unit’s current data',
      handler: async (req, res) => res.status(201).json(await copyCase(ds, scopeOf(req.actor), idParam(req))),
    },
    {
      method: 'get',
      path: '/api/cases/:id/comments',
      access: 'data.read',
      tenantScoped: true,
      response: caseCommentsResponse,
      description: 'The comment thread of a case, oldest first',
      handler: async (req, res) => res.json({ comments: await listComments(ds, scopeOf(req.actor), idParam(req)) }),
    },
    {
      method: 'post',
      path: '/api/cases/:id/comments',
      access: 'data.read',
      tenantScoped: true,
      body: caseCommentCreate,
      response: caseComment,
      status: 201,
      description: 'Add a comment to a case (members other than viewers)',
      handler: async (req, res) => res.status(201).json(await addComment(ds, scopeOf(req.actor), idParam(req), req.body)),
    },
    file(
      'pdf',
      '/api/cases/:id/report.pdf',
      'application/pdf',
      'The case report as a PDF: title block, recommendation, every input with its unit and source, charts, cash flows, uncertainty, method notes and cautions',
    ),
    file(
      'xlsx',
      '/api/cases/:id/export.xlsx',
      'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
      'The case as a workbook: inputs with units and sources, yearly cash flows, the schedule and the daily path (text cells neutralised)',
    ),
  ];
}
