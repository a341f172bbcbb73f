import type { DataSource } from 'typeorm';
import {
  optimiseResponse,
  outageApprove,
  outageCreate,
  outageItemCreate,
  outageItemPatch,
  outageListQuery,
  outageListResponse,
  outagePatch,
  outageView,
  scopeSave,
  type OutageListQuery,
} from '@shared/schemas/outages.js';
import { idParam } from '../http/params.js';
import type { RouteSpec } from '../http/route-registry.js';
import { scopeOf } from '../policies/tenant-scope.js';
import { addItem } from '../services/outages/add-item.js';
import { approveOutage } from '../services/outages/approve-outage.js';
import { createOutage } from '../services/outages/create-outage.js';
import { deleteItem } from '../services/outages/delete-item.js';
import { deleteOutage } from '../services/outages/delete-outage.js';
import { editItem } from '../services/outages/edit-item.js';
import { editOutage } from '../services/outages/edit-outage.js';
import { getOutage } from '../services/outages/get-outage.js';
import { listOutages } from '../services/outages/list-outages.js';
import { optimiseOutage } from '../services/outages/optimise-outage.js';
import { removeScope } from '../services/outages/remove-scope.js';
import { outageProposalLimiter } from '../http/rate-limits.js';
import { outageFile, type OutageFileKind } from '../services/outages/outage-files.js';
import { saveScope } from '../services/outages/save-scope.js';

export function outageRoutes(ds: DataSource): RouteSpec[] {
  const file = (kind: OutageFileKind, path: string, contentType: string, description: string): RouteSpec => ({
    method: 'get',
    path,
    access: 'data.read',
    tenantScoped: true,
    response: { file: [contentType] },
    description,
    handler: async (req, res) => {
      const f = await outageFile(ds, scopeOf(req.actor), idParam(req), kind);
      res.setHeader('content-type', f.contentType);
      res.setHeader('content-disposition', `attachment; filename="${f.fileName}"`);
      res.send(f.body);
    },
  });
  return [
    {
      method: 'get',
      path: '/api/outages',
      access: 'data.read',
      tenantScoped: true,
      query: outageListQuery,
      response: outageListResponse,
      description: 'Outages the member may see (every unit within their client groups; viewers: approved ones), newest change first; filter by status and unit',
      handler: async (req, res) => res.json({ outages: await listOutages(ds, scopeOf(req.actor), req.validQuery as OutageListQuery) }),
    },
    {
      method: 'post',
      path: '/api/outages',
      access: 'outages.plan',
      tenantScoped: true,
      body: outageCreate,
      response: outageView,
      status: 201,
      description: 'Start a draft outage: name, units, window (plant-local first and last day, both inside) and budget in the units’ currency',
      handler: async (req, res) => res.status(201).json(await createOutage(ds, scopeOf(req.actor), req.body)),
    },
    {
      method: 'get',
      path: '/api/outages/:id',
      access: 'data.read',
      tenantScoped: true,
      response: outageView,
      description:
        'One outage: units, items with their priced benefit and how it was priced, the latest proposal, saved scopes side by side, the approval and cautions',
      handler: async (req, res) => res.json(await getOutage(ds, scopeOf(req.actor), idParam(req))),
    },
    {
      method: 'patch',
      path: '/api/outages/:id',
      access: 'outages.plan',
      tenantScoped: true,
      body: outagePatch,
      response: outageView,
      description: 'Change a draft outage’s name, units, window or budget (409 once approved, or when a unit to take out still has items)',
      handler: async (req, res) => res.json(await editOutage(ds, scopeOf(req.actor), idParam(req), req.body)),
    },
    {
      method: 'delete',
      path: '/api/outages/:id',
      access: 'outages.delete',
      tenantScoped: true,
      response: 'empty',
      description: 'Delete an outage, approved or not (administrators); the audit log keeps its record',
      handler: async (req, res) => {
        await deleteOutage(ds, scopeOf(req.actor), idParam(req));
        res.status(204).end();
      },
    },
    {
      method: 'post',
      path: '/api/outages/:id/items',
      access: 'outages.plan',
      tenantScoped: true,
      body: outageItemCreate,
      response: outageView,
      status: 201,
      description:
        'Add a candidate item: an approved case’s cleaning (benefit from the case) or other condenser work with its benefit as money or as a cleanliness recovered, priced with the unit’s model',
      handler: async (req, res) => res.status(201).json(await addItem(ds, scopeOf(req.actor), idParam(req), req.body)),
    },
    {
      method: 'patch',
      path: '/api/outage-items/:id',
      access: 'outages.plan',
      tenantScoped: true,
      body: outageItemPatch,
      response: outageView,
      description: 'Change an item of a draft outage (title, cost, duration, lane, benefit, needs, forced in or out); answers the outage',
      handler: async (req, res) => res.json(await editItem(ds, scopeOf(req.actor), idParam(req), req.body)),
    },
    {
      method: 'delete',
      path: '/api/outage-items/:id',
      access: 'outages.plan',
      tenantScoped: true,
      response: outageView,
      description: 'Remove an item from a draft outage; answers the outage',
      handler: async (req, res) => res.json(await deleteItem(ds, scopeOf(req.actor), idParam(req))),
    },
    {
      method: 'post',
      path: '/api/outages/:id/optimise',
      access: 'outages.plan',
      tenantScoped: true,
      response: optimiseResponse,
      before: [outageProposalLimiter(ds)],
      description:
        'Propose the items with the most value (benefit less cost) within the budget and, lane by lane, the window, honouring forced items and needs; one sentence per item says why',
      handler: async (req, res) => res.json(await optimiseOutage(ds, scopeOf(req.actor), idParam(req))),
    },
    {
      method: 'post',
      path: '/api/outages/:id/scopes',
      access: 'outages.plan',
      tenantScoped: true,
      body: scopeSave,
      response: outageView,
      status: 201,
      description: 'Save a named scope (the listed items, else the latest proposal’s); the same name replaces it, a fourth name is refused (409)',
      handler: async (req, res) => res.status(201).json(await saveScope(ds, scopeOf(req.actor), idParam(req), req.body)),
    },
    {
      method: 'delete',
      path: '/api/outages/:id/scopes/:scopeId',
      access: 'outages.plan',
      tenantScoped: true,
      response: outageView,
      description: 'Remove a saved scope of a draft outage (409 once the outage is approved); answers the outage',
      handler: async (req, res) => res.json(await removeScope(ds, scopeOf(req.actor), idParam(req), idParam(req, 'scopeId'))),
    },
    {
      method: 'post',
      path: '/api/outages/:id/approve',
      access: 'cases.approve',
      tenantScoped: true,
      body: outageApprove,
      response: outageView,
      description:
        'Approve the latest proposal (no body) or a saved scope (scopeId): the outage becomes a frozen snapshot; with seenUpdatedAt, 409 when the outage changed since',
      handler: async (req, res) => res.json(await approveOutage(ds, scopeOf(req.actor), idParam(req), req.body)),
    },
    file(
      'pdf',
      '/api/outages/:id/report.pdf',
      'application/pdf',
      'The outage-scope report as a PDF: window, budget, chosen items, what was left out and why, the lane chart, the approver and the cautions for the work chosen',
    ),
    file(
      'xlsx',
      '/api/outages/:id/export.xlsx',
      'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
      'The outage as a workbook: the outage, every item with its figures and reason, and the days of each lane (text cells neutralised)',
    ),
  ];
}
