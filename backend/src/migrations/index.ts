/** Every migration, oldest first. A new migration file is added here too (explicit imports work under tsx, vitest and bundlers alike). */
import { Foundation1764633600000 } from './1764633600000-foundation.js';
import { TenantsAndUsers1796163844986 } from './1796163844986-tenants-and-users.js';
import { Accounts1796164373459 } from './1796164373459-accounts.js';
import { UnitsAndData1796165772820 } from './1796165772820-units-and-data.js';
import { HealthFigures1796166427505 } from './1796166427505-health-figures.js';
import { MailOutboxAndSink1796190627120 } from './1796190627120-mail-outbox-and-sink.js';
import { RateLimitCounters1796190929629 } from './1796190929629-rate-limit-counters.js';
import { AddressConfirmation1796194524192 } from './1796194524192-address-confirmation.js';
import { CleaningCases1796200402325 } from './1796200402325-cleaning-cases.js';
import { CaseDecisionGuards1796210000000 } from './1796210000000-case-decision-guards.js';
import { CaseDecisionGuardsBackfill1796210000001 } from './1796210000001-case-decision-guards-backfill.js';
import { Outages1796220000000 } from './1796220000000-outages.js';
import { Subscriptions1796230000000 } from './1796230000000-subscriptions.js';
import { AlertsByMail1796240000000 } from './1796240000000-alerts-by-mail.js';
import { UnitDataVersion1796250000000 } from './1796250000000-unit-data-version.js';
import { HistorianShapes1796260000000 } from './1796260000000-historian-shapes.js';
import { OpenCheckout1796280000000 } from './1796280000000-open-checkout.js';

export const MIGRATIONS = [
  Foundation1764633600000,
  TenantsAndUsers1796163844986,
  Accounts1796164373459,
  UnitsAndData1796165772820,
  HealthFigures1796166427505,
  MailOutboxAndSink1796190627120,
  RateLimitCounters1796190929629,
  AddressConfirmation1796194524192,
  CleaningCases1796200402325,
  CaseDecisionGuards1796210000000,
  CaseDecisionGuardsBackfill1796210000001,
  Outages1796220000000,
  Subscriptions1796230000000,
  AlertsByMail1796240000000,
  UnitDataVersion1796250000000,
  HistorianShapes1796260000000,
  OpenCheckout1796280000000,
];
