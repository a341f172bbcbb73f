import type { Membership } from '../entities/membership.entity.js';
import type { Organisation } from '../entities/organisation.entity.js';
import type { User } from '../entities/user.entity.js';

export interface Actor {
  user: User;
  via: 'session' | 'api-token';
  /** The active tenant's membership; null when the user has none (yet). */
  membership: Membership | null;
  organisation: Organisation | null;
}

declare global {
  namespace Express {
    interface Request {
      actor?: Actor;
      validQuery?: unknown;
    }
  }
}

declare module 'express-session' {
  interface SessionData {
    activeOrganisationId?: string;
    createdAt?: number;
  }
}
