import { ApiToken } from './api-token.entity.js';
import { AuditEvent } from './audit-event.entity.js';
import { ClientGroup } from './client-group.entity.js';
import { Invitation } from './invitation.entity.js';
import { Membership } from './membership.entity.js';
import { Organisation } from './organisation.entity.js';
import { PasswordResetToken } from './password-reset-token.entity.js';
import { User } from './user.entity.js';

export { ApiToken, AuditEvent, ClientGroup, Invitation, Membership, Organisation, PasswordResetToken, User };

export const ENTITIES = [Organisation, User, Membership, AuditEvent, ClientGroup, Invitation, PasswordResetToken, ApiToken];
