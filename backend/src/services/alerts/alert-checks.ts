/**
 * The periodic alert check: every organisation with alert choices is evaluated and its weekly digests sent. Each
 * app process runs it every hour (so at least daily, and a digest early in its week); running it in several
 * processes at once is safe (evaluate-alerts.ts and weekly-digest.ts each send once). Links in the mails use the
 * public address of the running app (`useAlertLinks`, set when the routes are built with the live configuration).
 */
import type { DataSource } from 'typeorm';
import { publicUrl, loadConfig, type Config } from '../../config.js';
import { evaluateAlerts, type AlertRun } from './evaluate-alerts.js';
import { sendWeeklyDigests } from './weekly-digest.js';
import { everySoOften } from '../../jobs/every-so-often.js';

const CHECK_EVERY_MS = 60 * 60 * 1000;

let linksFrom: Config | null = null;
/** The configuration whose public address the alert links use (the app's live one: its port is known after listen). */
export function useAlertLinks(config: Config): void {
  linksFrom = config;
}
export const alertBaseUrl = (): string => publicUrl(linksFrom ?? loadConfig());

export async function runAlertChecks(ds: DataSource, now = new Date(), baseUrl = alertBaseUrl()): Promise<AlertRun & { digests: number }> {
  const total = { mails: 0, cleared: 0, digests: 0 };
  const orgs: { organisationId: string }[] = await ds.query('SELECT DISTINCT organisationId FROM alert_subscription ORDER BY organisationId');
  for (const { organisationId } of orgs) {
    const run = await evaluateAlerts(ds, { organisationId, now, baseUrl });
    total.mails += run.mails;
    total.cleared += run.cleared;
    total.digests += await sendWeeklyDigests(ds, { organisationId, now, baseUrl });
  }
  return total;
}

/** Alerts evaluated after a unit's recompute (its last step): only that unit, for the people who chose alerts on it. */
export async function alertsAfterRecompute(ds: DataSource, organisationId: string, unitId: string): Promise<AlertRun> {
  return evaluateAlerts(ds, { organisationId, unitId, baseUrl: alertBaseUrl() });
}

export function startAlertChecks(ds: DataSource, log: (line: string) => void): { stop: () => void } {
  return everySoOften(() => runAlertChecks(ds), 'alert check', log, CHECK_EVERY_MS, 10_000);
}
