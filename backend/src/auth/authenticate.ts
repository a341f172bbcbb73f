/**
 * Turns the session (or, later, an API token) into req.actor: the user, the active tenant and the
 * membership in it. A session older than the user's sessionsValidFrom (password change) is ended.
 */
import type { NextFunction, Request, Response } from 'express';
import type { DataSource } from 'typeorm';
import { Membership } from '../entities/membership.entity.js';
import { Organisation } from '../entities/organisation.entity.js';
import { User } from '../entities/user.entity.js';

export function createAuthenticate(dataSource: DataSource) {
  return async function authenticate(req: Request, _res: Response, next: NextFunction): Promise<void> {
    try {
      if (req.actor) return next();
      const userId = (req.session as unknown as { passport?: { user?: string } } | undefined)?.passport?.user;
      if (!userId) return next();
      const user = await dataSource.getRepository(User).findOneBy({ id: userId });
      const createdAt = req.session.createdAt ?? 0;
      if (!user || (user.sessionsValidFrom && createdAt < user.sessionsValidFrom.getTime())) {
        await new Promise<void>((resolve) => req.session.destroy(() => resolve()));
        return next();
      }
      const memberships = dataSource.getRepository(Membership);
      let membership: Membership | null = null;
      if (req.session.activeOrganisationId) {
        membership = await memberships.findOneBy({ userId: user.id, organisationId: req.session.activeOrganisationId });
      }
      if (!membership) {
        membership = await memberships.findOne({ where: { userId: user.id }, order: { createdAt: 'ASC' } });
        if (membership) req.session.activeOrganisationId = membership.organisationId;
      }
      const organisation = membership ? await dataSource.getRepository(Organisation).findOneBy({ id: membership.organisationId }) : null;
      req.actor = { user, via: 'session', membership, organisation };
      next();
    } catch (err) {
      next(err);
    }
  };
}
