import type { Request, Response } from 'express';
import type { DataSource } from 'typeorm';
import { acceptInvitationRequest, invitationLinkView, invitationsResponse, invitationView, inviteRequest } from '@shared/schemas/accounts.js';
import { establishSession } from '../auth/establish-session.js';
import type { Config } from '../config.js';
import { baseUrl } from '../http/base-url.js';
import { idParam, tokenParam } from '../http/params.js';
import { inviteLimiter } from '../http/rate-limits.js';
import type { RouteSpec } from '../http/route-registry.js';
import type { Mailer } from '../mail/mailer.js';
import { scopeOf } from '../policies/tenant-scope.js';
import { acceptInvitation, describeInvitation, invite, listPendingInvitations, revokeInvitation } from '../services/invitation.service.js';
import { sessionResponse } from '@shared/schemas/session.js';

export function invitationRoutes(ds: DataSource, mailer: Mailer, config: Config, answerSession: (req: Request, res: Response) => Promise<void>): RouteSpec[] {
  return [
    {
      method: 'get',
      path: '/api/invitations',
      response: invitationsResponse,
      access: 'members.manage',
      tenantScoped: true,
      description: 'Pending invitations of the organisation',
      handler: async (req, res) => res.json({ invitations: await listPendingInvitations(ds, scopeOf(req.actor)) }),
    },
    {
      method: 'post',
      path: '/api/invitations',
      response: invitationView,
      status: 201,
      access: 'members.manage',
      tenantScoped: true,
      allowsPrivilegedFields: true,
      rateLimit: inviteLimiter(ds),
      body: inviteRequest,
      description: 'Invite someone by e-mail with a role, optionally limited to client groups',
      handler: async (req, res) => {
        const view = await invite(ds, mailer, scopeOf(req.actor), req.actor!.user.name, req.body, baseUrl(config, req));
        res.status(201).json(view);
      },
    },
    {
      method: 'delete',
      path: '/api/invitations/:id',
      response: 'empty',
      access: 'members.manage',
      tenantScoped: true,
      description: 'Withdraw a pending invitation',
      handler: async (req, res) => {
        await revokeInvitation(ds, scopeOf(req.actor), idParam(req));
        res.status(204).end();
      },
    },
    {
      method: 'get',
      path: '/api/invitation-links/:token',
      response: invitationLinkView,
      access: 'public',
      tenantScoped: false,
      description: 'What an invitation link offers (organisation, role, whether the account exists)',
      handler: async (req, res) => res.json(await describeInvitation(ds, tokenParam(req))),
    },
    {
      method: 'post',
      path: '/api/invitation-links/:token/accept',
      response: sessionResponse,
      access: 'public',
      tenantScoped: false,
      body: acceptInvitationRequest,
      description: 'Accept an invitation: links the signed-in account, or creates one with name and password',
      handler: async (req, res) => {
        const { user, organisationId } = await acceptInvitation(ds, tokenParam(req), req.actor?.user, req.body);
        if (req.actor?.user.id === user.id) req.session.activeOrganisationId = organisationId;
        else await establishSession(req, user, organisationId);
        await answerSession(req, res);
      },
    },
  ];
}
