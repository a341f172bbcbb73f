import { ApiToken } from './api-token.entity.js';
import { AuditEvent } from './audit-event.entity.js';
import { ClientGroup } from './client-group.entity.js';
import { Invitation } from './invitation.entity.js';
import { Membership } from './membership.entity.js';
import { Organisation } from './organisation.entity.js';
import { PasswordResetToken } from './password-reset-token.entity.js';
import { User } from './user.entity.js';
import { BackgroundJob } from './background-job.entity.js';
import { CleaningMethodRecord } from './cleaning-method.entity.js';
import { DailyAggregate } from './daily-aggregate.entity.js';
import { DataImport } from './data-import.entity.js';
import { GeneratingUnit } from './generating-unit.entity.js';
import { PerformanceSample } from './performance-sample.entity.js';
import { Plant } from './plant.entity.js';
import { UnitEvent } from './unit-event.entity.js';
import { MailOutbox } from './mail-outbox.entity.js';
import { SinkMessage } from './sink-message.entity.js';
import { RateLimitCounter } from './rate-limit-counter.entity.js';
import { AddressConfirmationToken } from './address-confirmation-token.entity.js';
import { CaseCommentRecord } from './case-comment.entity.js';
import { CleaningCase } from './cleaning-case.entity.js';
import { BillingWebhookEvent } from './billing-webhook-event.entity.js';
import { Outage } from './outage.entity.js';
import { OutageItem } from './outage-item.entity.js';
import { OutageScope } from './outage-scope.entity.js';
import { OutageUnit } from './outage-unit.entity.js';
import { AlertState } from './alert-state.entity.js';
import { AlertSubscription } from './alert-subscription.entity.js';

export { ApiToken, AuditEvent, ClientGroup, Invitation, Membership, Organisation, PasswordResetToken, User };
export { BackgroundJob, CleaningMethodRecord, DailyAggregate, DataImport, GeneratingUnit, PerformanceSample, Plant, UnitEvent };
export { MailOutbox, SinkMessage };
export { RateLimitCounter };
export { AddressConfirmationToken };
export { CaseCommentRecord, CleaningCase };
export { BillingWebhookEvent };
export { Outage, OutageItem, OutageScope, OutageUnit };
export { AlertState, AlertSubscription };

export const ENTITIES = [
  Organisation,
  User,
  Membership,
  AuditEvent,
  ClientGroup,
  Invitation,
  PasswordResetToken,
  ApiToken,
  Plant,
  GeneratingUnit,
  DataImport,
  PerformanceSample,
  DailyAggregate,
  UnitEvent,
  CleaningMethodRecord,
  BackgroundJob,
  MailOutbox,
  SinkMessage,
  RateLimitCounter,
  AddressConfirmationToken,
  CleaningCase,
  CaseCommentRecord,
  Outage,
  OutageUnit,
  OutageItem,
  OutageScope,
  BillingWebhookEvent,
  AlertSubscription,
  AlertState,
];
