/**
 * Evaluates e-mail alerts in one organisation (or on one unit of it): for each person who chose alerts, each unit
 * they may see, the unit's conditions now against what was told to them (alert_state), a mail for each condition
 * newly raised and the state closed when it clears.
 *
 * Exactly once, whatever number of processes evaluate at the same moment: a condition is told only by the
 * transaction whose INSERT IGNORE creates its (person, unit, condition) row or whose UPDATE reopens a cleared one
 * (the unique key makes a second INSERT wait for the first and then do nothing; the reopen is conditional on
 * clearedAt being set, read in committed data). The mail joins the outbox in that same transaction, so a mail is
 * queued if and only if the state moved.
 */
import { randomUUID } from 'node:crypto';
import type { DataSource } from 'typeorm';
import { UNIT_CONDITION_KINDS, type UnitCondition, type UnitConditionKind } from '@shared/domain/portfolio/unit-conditions.js';
import type { PortfolioUnit } from '@shared/schemas/portfolio.js';
import { AlertState } from '../../entities/alert-state.entity.js';
import { enqueueMail } from '../../mail/outbox.js';
import { portfolioOf } from '../portfolio/portfolio.service.js';
import { alertMail } from './alert-mail.js';
import { choiceFor, conditionsFor } from './alert-rules.js';
import { affectedRows, subscribersOf, type Subscriber } from './alert-subscribers.js';

export interface AlertRun {
  /** mails queued */
  mails: number;
  /** conditions closed */
  cleared: number;
}

export async function evaluateAlerts(ds: DataSource, o: { organisationId: string; unitId?: string; now?: Date; baseUrl: string }): Promise<AlertRun> {
  const now = o.now ?? new Date();
  const run: AlertRun = { mails: 0, cleared: 0 };
  for (const s of await subscribersOf(ds.manager, o.organisationId)) {
    const { units } = await portfolioOf(ds, s.scope, now);
    const open = await ds.getRepository(AlertState).find({ where: { membershipId: s.membershipId, ...(o.unitId ? { unitId: o.unitId } : {}) } });
    for (const unit of units) {
      if (o.unitId && unit.unitId !== o.unitId) continue;
      const active = conditionsFor(unit, choiceFor(s.choices, unit.unitId));
      const told = new Set(open.filter((a) => a.unitId === unit.unitId && a.clearedAt === null).map((a) => a.kind));
      // Nothing to raise or close as far as this read shows: no statement (the statements below decide under concurrency).
      if (active.every((c) => told.has(c.kind)) && [...told].every((k) => active.some((c) => c.kind === k))) continue;
      const moved = await settleUnit(ds, s, unit, active, now, o.baseUrl);
      run.mails += moved.mailed ? 1 : 0;
      run.cleared += moved.cleared;
    }
  }
  return run;
}

async function settleUnit(
  ds: DataSource,
  s: Subscriber,
  unit: PortfolioUnit,
  active: UnitCondition[],
  now: Date,
  baseUrl: string,
): Promise<{ mailed: boolean; cleared: number }> {
  return ds.transaction('READ COMMITTED', async (em) => {
    const key = (kind: UnitConditionKind) => [s.membershipId, unit.unitId, kind];
    const raised: UnitCondition[] = [];
    let cleared = 0;
    // A fixed order of kinds: two evaluations take the rows' locks in the same order.
    for (const kind of UNIT_CONDITION_KINDS) {
      const condition = active.find((c) => c.kind === kind);
      if (condition) {
        const inserted = await em.query(
          `INSERT IGNORE INTO alert_state (id, organisationId, unitId, membershipId, kind, raisedAt, clearedAt, lastSentAt) VALUES (?, ?, ?, ?, ?, ?, NULL, ?)`,
          [randomUUID(), s.scope.organisationId, unit.unitId, s.membershipId, kind, now, now],
        );
        if (affectedRows(inserted) === 1) {
          raised.push(condition);
          continue;
        }
        const reopened = await em.query(
          `UPDATE alert_state SET raisedAt = ?, clearedAt = NULL, lastSentAt = ? WHERE membershipId = ? AND unitId = ? AND kind = ? AND clearedAt IS NOT NULL`,
          [now, now, ...key(kind)],
        );
        if (affectedRows(reopened) === 1) raised.push(condition);
      } else {
        const closed = await em.query(`UPDATE alert_state SET clearedAt = ? WHERE membershipId = ? AND unitId = ? AND kind = ? AND clearedAt IS NULL`, [
          now,
          ...key(kind),
        ]);
        cleared += affectedRows(closed);
      }
    }
    if (raised.length > 0) await enqueueMail(em, alertMail({ to: s.email, unit, raised, baseUrl }));
    return { mailed: raised.length > 0, cleared };
  });
}
