import type { AuditEventView } from '@shared/schemas/accounts';
import { formatCurrency, formatDay, ROLE_LABELS } from '@frontend/lib/format';

/** Names the log's ids stand for, from lists the page already reads; an id not found (a record since deleted) is said in words. */
export interface AuditNames {
  /** unit id → "Plant — Unit" */
  units: ReadonlyMap<string, string>;
  /** client group id → name */
  groups: ReadonlyMap<string, string>;
}

export const NO_NAMES: AuditNames = { units: new Map(), groups: new Map() };

/** The areas of the log a person can filter by; each value is the start of the action codes it covers. */
export const AUDIT_AREAS: { prefix: string; label: string }[] = [
  { prefix: 'plant.', label: 'Plants' },
  { prefix: 'unit.', label: 'Units and their setup' },
  { prefix: 'import.', label: 'Imports' },
  { prefix: 'event.', label: 'Events' },
  { prefix: 'cleaning-method.', label: 'Cleaning methods' },
  { prefix: 'case.', label: 'Cleaning cases' },
  { prefix: 'outage.', label: 'Outages' },
  { prefix: 'member.', label: 'Members' },
  { prefix: 'invitation.', label: 'Invitations' },
  { prefix: 'client-group.', label: 'Client groups' },
  { prefix: 'api-token.', label: 'API tokens' },
  { prefix: 'organisation.', label: 'The organisation' },
];

const EVENT_WORDS: Record<string, string> = {
  cleaning: 'cleaning',
  'tube-plugging': 'tube plugging',
  'air-leak-repair': 'air in-leakage repair',
  outage: 'outage',
  other: 'event',
};

const SETUP_WORDS: Record<string, string> = { condenser: 'condenser', turbine: 'turbine', economics: 'economics' };

type Details = Record<string, unknown>;

const text = (v: unknown): string | null => (typeof v === 'string' && v.trim() ? v : null);
const quoted = (v: unknown, otherwise: string): string => (text(v) ? `“${text(v)}”` : otherwise);
const record = (v: unknown): Details => (v && typeof v === 'object' && !Array.isArray(v) ? (v as Details) : {});
const role = (v: unknown): string => (typeof v === 'string' && v in ROLE_LABELS ? ROLE_LABELS[v as keyof typeof ROLE_LABELS].toLowerCase() : 'member');
const eventWord = (v: unknown): string => (typeof v === 'string' && EVENT_WORDS[v]) || 'event';

function groupsText(ids: unknown, names: AuditNames): string {
  if (ids === null || ids === undefined) return 'all';
  if (!Array.isArray(ids) || ids.length === 0) return 'none';
  const named = ids.map((id) => names.groups.get(String(id)) ?? 'a client group since deleted');
  return `only ${named.join(', ')}`;
}

const titles = (v: unknown): string[] =>
  Array.isArray(v) ? v.map((x) => (typeof x === 'string' ? x : text(record(x).title))).filter((x): x is string => !!x) : [];
const count = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;
const amount = (v: unknown, currency: unknown): string | null => {
  const n = typeof v === 'number' ? v : typeof v === 'string' ? Number(v) : Number.NaN;
  return Number.isFinite(n) ? formatCurrency(n, text(currency) ?? 'USD') : null;
};
const OUTAGE_CHANGE_WORDS: Record<string, string> = { name: 'its name', window: 'its window', budget: 'its budget', units: 'its units' };
const ITEM_CHANGE_WORDS: Record<string, string> = {
  title: 'title',
  cost: 'cost',
  durationDays: 'days',
  lane: 'lane',
  benefit: 'benefit',
  needs: 'needs',
  forced: 'in or out by hand',
};
const changedWords = (changes: unknown, words: Record<string, string>): string => {
  const keys = Object.keys(record(changes)).map((k) => words[k] ?? 'a detail');
  return keys.length ? ` (${[...new Set(keys)].join(', ')})` : '';
};

/** The outage's own entries: the outage by name and what was done, with figures where they were recorded. */
function outageHappened(e: AuditEventView, d: Details): string | null {
  const outage = quoted(d.outage ?? d.name, 'an outage');
  const item = quoted(d.title, 'an item');
  const figures = (items: unknown) => {
    const cost = amount(d.totalCost, d.currency);
    const benefit = amount(d.totalBenefit, d.currency);
    return `: ${count(titles(items).length, 'item', 'items')}${cost ? `, cost ${cost}` : ''}${benefit ? `, benefit ${benefit}` : ''}`;
  };
  switch (e.action) {
    case 'outage.created':
      return `planned the outage ${outage}${text(d.startDate) && text(d.endDate) ? ` from ${formatDay(String(d.startDate))} to ${formatDay(String(d.endDate))}` : ''}`;
    case 'outage.changed':
      return `changed the outage ${outage}${changedWords(d.changes, OUTAGE_CHANGE_WORDS)}`;
    case 'outage.deleted':
      return `deleted the ${d.status === 'approved' ? 'approved ' : ''}outage ${outage}`;
    case 'outage.item-added':
      return `added ${item} to the outage ${outage}`;
    case 'outage.item-changed':
      return `changed ${item} in the outage ${outage}${changedWords(d.changes, ITEM_CHANGE_WORDS)}`;
    case 'outage.item-removed':
      return `removed ${item} from the outage ${outage}`;
    case 'outage.optimised':
      return `proposed a scope for the outage ${outage}${figures(d.chosen)}`;
    case 'outage.scope-saved':
      return `${d.replaced ? 'replaced' : 'saved'} the scope ${quoted(d.scope, 'a scope')} of the outage ${outage}`;
    case 'outage.scope-removed':
      return `removed the saved scope ${quoted(d.scope, 'a scope')} of the outage ${outage}`;
    case 'outage.approved':
      return `approved the ${text(d.scope) ? `scope ${quoted(d.scope, '')} of the ` : 'proposed scope of the '}outage ${outage}${figures(d.items)}`;
    case 'outage.unit-removed':
      return `took ${count(Array.isArray(d.units) ? d.units.length : 0, 'unit', 'units')} and ${count(titles(d.itemsRemoved).length, 'item', 'items')} out of the outage ${outage} when ${text(d.reason) ?? 'a unit was deleted'}`;
    default:
      return null;
  }
}

function unitText(id: string | null, names: AuditNames): string {
  const name = id ? names.units.get(id) : undefined;
  return name ? `of ${name}` : 'of a unit since deleted';
}

function plantChanges(d: Details, names: AuditNames): string {
  const from = record(d.from);
  const to = record(d.to);
  const changes: string[] = [];
  if (text(from.name) && text(to.name) && from.name !== to.name) changes.push(`renamed it from “${from.name}”`);
  if (text(from.timeZone) && text(to.timeZone) && from.timeZone !== to.timeZone) changes.push(`moved its clock from ${from.timeZone} to ${to.timeZone}`);
  if ('clientGroupId' in to && (from.clientGroupId ?? null) !== (to.clientGroupId ?? null)) {
    const group = (id: unknown) => (id ? (names.groups.get(String(id)) ?? 'a client group since deleted') : 'no client group');
    changes.push(`moved it from ${group(from.clientGroupId)} to ${group(to.clientGroupId)}`);
  }
  return changes.length ? `: ${changes.join('; ')}` : '';
}

function memberChanges(d: Details, names: AuditNames): string {
  const from = record(d.from);
  const to = record(d.to);
  const changes: string[] = [];
  if (from.role !== to.role) changes.push(`role ${role(from.role)} → ${role(to.role)}`);
  if (JSON.stringify(from.clientGroupIds ?? null) !== JSON.stringify(to.clientGroupIds ?? null)) {
    changes.push(`plants ${groupsText(from.clientGroupIds, names)} → ${groupsText(to.clientGroupIds, names)}`);
  }
  return changes.length ? ` (${changes.join('; ')})` : '';
}

/** What happened, after the person's name: "added the plant “Larchmoor Station”". */
function whatHappened(e: AuditEventView, names: AuditNames): string {
  const d = e.details ?? {};
  const setupPart = /^unit\.(condenser|turbine|economics)-saved$/.exec(e.action)?.[1];
  if (setupPart) return `saved the ${SETUP_WORDS[setupPart]} setup ${unitText(e.entityId, names)}`;
  switch (e.action) {
    case 'organisation.created':
      return 'started the organisation';
    case 'plant.created':
      return `added the plant ${quoted(d.name, 'a plant')}`;
    case 'plant.updated':
      return `changed the plant ${quoted(record(d.to).name, 'a plant')}${plantChanges(d, names)}`;
    case 'plant.deleted':
      return `deleted the plant ${quoted(d.name, 'a plant')} with its units and their data`;
    case 'unit.created':
      return `added the unit ${quoted(d.name, 'a unit')}${text(d.plant) ? ` to ${quoted(d.plant, '')}` : ''}`;
    case 'unit.renamed':
      return `renamed the unit ${quoted(d.from, 'a unit')} to ${quoted(d.to, 'a new name')}`;
    case 'unit.deleted':
      return `deleted the unit ${quoted(d.name, 'a unit')} with its data`;
    case 'import.started':
      return `imported the file ${quoted(d.fileName, 'a historian file')}`;
    case 'import.undone':
      return `undid the import of ${quoted(d.fileName, 'a historian file')}, removing its rows`;
    case 'event.added':
      return `recorded a ${eventWord(d.kind)}${text(d.startDate) ? ` on ${formatDay(String(d.startDate))}` : ''}`;
    case 'event.updated':
      return `changed a recorded ${eventWord(d.kind)}`;
    case 'event.deleted':
      return `deleted the ${eventWord(d.kind)}${text(d.startDate) ? ` of ${formatDay(String(d.startDate))}` : ''}`;
    case 'cleaning-method.created':
      return `added the cleaning method ${quoted(d.name, 'a cleaning method')}`;
    case 'cleaning-method.updated':
      return `changed the cleaning method ${quoted(record(d.to).name, 'a cleaning method')}`;
    case 'cleaning-method.deleted':
      return `deleted the cleaning method ${quoted(d.name, 'a cleaning method')}`;
    case 'client-group.created':
      return `created the client group ${quoted(d.name, 'a client group')}`;
    case 'client-group.renamed':
      return `renamed the client group ${quoted(d.from, 'a client group')} to ${quoted(d.to, 'a new name')}`;
    case 'client-group.deleted':
      return `deleted the client group ${quoted(d.name, 'a client group')}`;
    case 'invitation.sent':
      return `invited ${text(d.email) ?? 'someone'} to join as ${role(d.role)}`;
    case 'invitation.revoked':
      return `withdrew the invitation to ${text(d.email) ?? 'someone'}`;
    case 'invitation.accepted':
      return `accepted the invitation to ${text(d.email) ?? 'their address'} and joined as ${role(d.role)}`;
    case 'member.updated':
      return `changed a member’s access${memberChanges(d, names)}`;
    case 'member.removed':
      return `removed a member (${role(d.role)}) from the organisation`;
    case 'api-token.created':
      return `created the API token ${quoted(d.name, 'an API token')}`;
    case 'api-token.revoked':
      return `revoked the API token ${quoted(d.name, 'an API token')}`;
    case 'case.created':
      return `started the cleaning case ${quoted(d.title, 'a cleaning case')}`;
    case 'case.copied':
      return `copied a cleaning case as ${quoted(d.title, 'a new case')}`;
    case 'case.updated':
      return `changed the cleaning case ${quoted(d.title, 'a cleaning case')}`;
    case 'case.commented':
      return `commented on ${quoted(d.title, 'a cleaning case')}`;
    case 'case.submitted':
      return `submitted the cleaning case ${quoted(d.title, 'a cleaning case')} for approval`;
    case 'case.approved':
      return `approved the cleaning case ${quoted(d.title, 'a cleaning case')}`;
    case 'case.returned':
      return `sent back the cleaning case ${quoted(d.title, 'a cleaning case')}${text(d.reason) ? `: ${text(d.reason)}` : ''}`;
    case 'case.archived':
      return `archived the cleaning case ${quoted(d.title, 'a cleaning case')}`;
    case 'organisation.status-words-changed': {
      const words = Array.isArray(d.words) ? d.words.filter((w): w is string => typeof w === 'string') : [];
      return words.length
        ? `set the organisation’s historian status words to ${words.map((w) => `“${w}”`).join(', ')}`
        : 'set the organisation’s historian status words back to the standard list';
    }
    default: {
      const outageWords = e.action.startsWith('outage.') ? outageHappened(e, d) : null;
      if (outageWords) return outageWords;
      const area = AUDIT_AREAS.find((a) => e.action.startsWith(a.prefix));
      return `changed something under ${area ? area.label.toLowerCase() : 'the organisation’s records'}`;
    }
  }
}

/** One entry of the log as a sentence with names, e.g. "Priya Ramanathan imported the file “june.csv”." */
export function auditSentence(e: AuditEventView, names: AuditNames = NO_NAMES): string {
  const who = e.userName ?? (e.userId ? 'A former member' : 'Cleancase');
  return `${who} ${whatHappened(e, names)}.`;
}
