import type { Request } from 'express';
import type { User } from '../entities/user.entity.js';

/** Signs the user in on a fresh session id (passport's req.login regenerates it: no fixation). */
export function establishSession(req: Request, user: User, activeOrganisationId?: string): Promise<void> {
  return new Promise((resolve, reject) => {
    req.login(user, (err) => {
      if (err) return reject(err);
      req.session.createdAt = Date.now();
      req.session.activeOrganisationId = activeOrganisationId;
      req.actor = undefined;
      req.session.save((saveErr) => (saveErr ? reject(saveErr) : resolve()));
    });
  });
}

export function endSession(req: Request): Promise<void> {
  return new Promise((resolve, reject) => {
    req.logout((err) => {
      if (err) return reject(err);
      req.session.destroy(() => resolve());
    });
  });
}
