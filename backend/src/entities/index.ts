import { AuditEvent } from './audit-event.entity.js';
import { Membership } from './membership.entity.js';
import { Organisation } from './organisation.entity.js';
import { User } from './user.entity.js';

export { AuditEvent, Membership, Organisation, User };

export const ENTITIES = [Organisation, User, Membership, AuditEvent];
