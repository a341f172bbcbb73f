/**
 * The alert mails in plain words: the unit, the condition, the unit's figures and a link to the unit built from
 * the public address. No case is named: a viewer may receive them and sees approved cases only on screen.
 */
import type { UnitCondition } from '@shared/domain/portfolio/unit-conditions.js';
import type { PortfolioUnit } from '@shared/schemas/portfolio.js';
import { CONDITION_EXPLAINED } from '@shared/schemas/notifications.js';
import { formatCurrency, formatDay, formatPercent } from '@shared/text/display-format.js';
import { KPA_PER_INHG } from '@shared/units.js';
import type { OutgoingMail } from '../../mail/mailer.js';
import { plainName } from '../../mail/plain-name.js';

/** The caution every mail that may lead to cleaning work carries. */
export const CLEANING_CAUTION =
  'Cleaning work (confined waterboxes, high-pressure water, chemicals) follows local codes, the equipment maker’s instructions and licensed practice.';

export const unitLink = (baseUrl: string, unitId: string) => `${baseUrl.replace(/\/$/, '')}/units/${unitId}`;
export const settingsLink = (baseUrl: string) => `${baseUrl.replace(/\/$/, '')}/settings/notifications`;

/** The unit's figures now, one line each; a figure not known is left out. */
export function figureLines(u: PortfolioUnit): string[] {
  const lines: string[] = [];
  if (u.cleanliness !== null) {
    const ref = u.referenceCleanliness !== null ? ` (reference ${formatPercent(u.referenceCleanliness)})` : '';
    lines.push(`Cleanliness now: ${formatPercent(u.cleanliness)}${ref}`);
  }
  if (u.excessBackpressureKpa !== null)
    lines.push(`Backpressure above clean: ${u.excessBackpressureKpa.toFixed(2)} kPa (${(u.excessBackpressureKpa / KPA_PER_INHG).toFixed(2)} inHg)`);
  if (u.foulingCostPerDay !== null && u.currency) lines.push(`Fouling costs about ${formatCurrency(u.foulingCostPerDay, u.currency)} a day`);
  if (u.nextCleaning) {
    const saving = u.nextCleaning.saving !== null && u.currency ? `, saving ${formatCurrency(u.nextCleaning.saving, u.currency)} over the coming year` : '';
    lines.push(`Next cleaning in the outlook: ${formatDay(u.nextCleaning.date)} (${u.nextCleaning.methodName})${saving}`);
  }
  lines.push(u.dataThrough ? `Data through: ${formatDay(u.dataThrough)}` : 'No data yet');
  return lines;
}

const unitTitle = (u: PortfolioUnit) => `${plainName(u.unitName, 'a unit')} at ${plainName(u.plantName, 'a plant')}`;

export function alertMail(p: { to: string; unit: PortfolioUnit; raised: UnitCondition[]; baseUrl: string }): OutgoingMail {
  const names = p.raised.map((c) => CONDITION_EXPLAINED[c.kind].title.toLowerCase());
  const lines = [`${unitTitle(p.unit)}: ${names.join(', ')}.`, ''];
  for (const c of p.raised) lines.push(c.sentence, '');
  lines.push('The unit’s figures now:', ...figureLines(p.unit).map((l) => `- ${l}`), '');
  if (p.raised.some((c) => c.kind === 'cleaning-now-pays')) lines.push(CLEANING_CAUTION, '');
  lines.push(
    `Open the unit: ${unitLink(p.baseUrl, p.unit.unitId)}`,
    '',
    'You get one mail per condition until it clears. Choose what you hear about in Settings, Notifications:',
    settingsLink(p.baseUrl),
  );
  return { to: p.to, subject: `${unitTitle(p.unit)}: ${names.join(', ')}`, text: lines.join('\n') };
}

export interface DigestUnit {
  unit: PortfolioUnit;
  /** conditions told and still open for this person */
  open: UnitCondition[];
  /** conditions that cleared in the past week */
  cleared: string[];
}

export function digestMail(p: { to: string; organisationName: string; week: string; units: DigestUnit[]; baseUrl: string }): OutgoingMail {
  const organisation = plainName(p.organisationName, 'your organisation');
  const lines = [`Your units in ${organisation}, week ${p.week}.`, ''];
  if (p.units.length === 0) lines.push('You have no units in your scope.', '');
  for (const d of p.units) {
    const u = d.unit;
    lines.push(unitTitle(u));
    lines.push(`- Conditions now: ${u.alerts.length === 0 ? 'none' : u.alerts.map((a) => CONDITION_EXPLAINED[a.kind].title.toLowerCase()).join(', ')}`);
    lines.push(`- Fouling cost a day: ${u.foulingCostPerDay !== null && u.currency ? formatCurrency(u.foulingCostPerDay, u.currency) : 'not known'}`);
    lines.push(
      `- Next cleaning: ${u.nextCleaning ? `${formatDay(u.nextCleaning.date)} (${u.nextCleaning.methodName})` : (u.nextCleaningNote ?? 'none planned')}`,
    );
    lines.push(`- Open alerts to you: ${d.open.length === 0 ? 'none' : d.open.map((c) => CONDITION_EXPLAINED[c.kind].title.toLowerCase()).join(', ')}`);
    if (d.cleared.length > 0) lines.push(`- Cleared this week: ${d.cleared.join(', ')}`);
    lines.push(`- ${unitLink(p.baseUrl, u.unitId)}`, '');
  }
  if (p.units.some((d) => d.unit.alerts.some((a) => a.kind === 'cleaning-now-pays'))) lines.push(CLEANING_CAUTION, '');
  lines.push('You chose this weekly digest. Turn it off in Settings, Notifications:', settingsLink(p.baseUrl));
  return { to: p.to, subject: `Weekly digest: ${organisation}, week ${p.week}`, text: lines.join('\n') };
}
