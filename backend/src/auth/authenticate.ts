/**
 * Turns the request into req.actor: a personal API token (Authorization: Bearer cct_…) or the session
 * cookie, with the active tenant and the membership in it. A session older than the user's
 * sessionsValidFrom (password change or reset) is ended.
 */
import type { NextFunction, Request, Response } from 'express';
import type { DataSource } from 'typeorm';
import { Membership } from '../entities/membership.entity.js';
import { Organisation } from '../entities/organisation.entity.js';
import { User } from '../entities/user.entity.js';
import { AppError } from '../http/app-error.js';
import { findLiveApiToken } from '../services/api-token.service.js';

export function createAuthenticate(dataSource: DataSource) {
  const users = dataSource.getRepository(User);
  const memberships = dataSource.getRepository(Membership);
  const organisations = dataSource.getRepository(Organisation);

  async function fromApiToken(req: Request, token: string): Promise<void> {
    const record = await findLiveApiToken(dataSource, token);
    const membership = record ? await memberships.findOneBy({ userId: record.userId, organisationId: record.organisationId }) : null;
    const user = record ? await users.findOneBy({ id: record.userId }) : null;
    if (!record || !membership || !user) throw new AppError(401, 'The API token is not valid');
    req.actor = { user, via: 'api-token', membership, organisation: await organisations.findOneBy({ id: membership.organisationId }) };
  }

  async function fromSession(req: Request): Promise<void> {
    const userId = (req.session as unknown as { passport?: { user?: string } } | undefined)?.passport?.user;
    if (!userId) return;
    const user = await users.findOneBy({ id: userId });
    const createdAt = req.session.createdAt ?? 0;
    if (!user || (user.sessionsValidFrom && createdAt < user.sessionsValidFrom.getTime())) {
      await new Promise<void>((resolve) => req.session.destroy(() => resolve()));
      return;
    }
    let membership: Membership | null = null;
    if (req.session.activeOrganisationId) membership = await memberships.findOneBy({ userId: user.id, organisationId: req.session.activeOrganisationId });
    if (!membership) {
      membership = await memberships.findOne({ where: { userId: user.id }, order: { createdAt: 'ASC' } });
      req.session.activeOrganisationId = membership?.organisationId;
    }
    const organisation = membership ? await organisations.findOneBy({ id: membership.organisationId }) : null;
    req.actor = { user, via: 'session', membership, organisation };
  }

  return async function authenticate(req: Request, _res: Response, next: NextFunction): Promise<void> {
    try {
      if (req.actor) return next();
      const header = req.get('authorization');
      if (header?.startsWith('Bearer ')) await fromApiToken(req, header.slice(7).trim());
      else await fromSession(req);
      next();
    } catch (err) {
      next(err);
    }
  };
}
