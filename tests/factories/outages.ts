/**
 * Outages written straight to the database: a draft (or approved) outage on given units with items whose benefit is
 * typed as money, and a unit's daily figures for pricing a recovered cleanliness. Values invented for tests.
 */
import type { DataSource } from 'typeorm';
import type { ApprovedSnapshot } from '../../shared/schemas/outages.js';
import type { GeneratingUnit } from '../../backend/src/entities/generating-unit.entity.js';
import { OutageItem } from '../../backend/src/entities/outage-item.entity.js';
import { OutageUnit } from '../../backend/src/entities/outage-unit.entity.js';
import { Outage } from '../../backend/src/entities/outage.entity.js';

export interface TestItem {
  title: string;
  cost: number;
  durationDays: number;
  lane: string;
  benefit: number;
  unit?: GeneratingUnit;
}

export async function createOutageRecord(
  ds: DataSource,
  units: GeneratingUnit[],
  createdById: string,
  options: { status?: 'draft' | 'approved'; name?: string; budget?: number; startDate?: string; endDate?: string; items?: TestItem[] } = {},
): Promise<{ outage: Outage; items: OutageItem[] }> {
  const now = new Date();
  const first = units[0]!;
  const outage = await ds.getRepository(Outage).save({
    organisationId: first.organisationId,
    name: options.name ?? 'Test outage',
    startDate: options.startDate ?? '2026-10-05',
    endDate: options.endDate ?? '2026-10-18',
    budget: (options.budget ?? 500_000).toFixed(2),
    currency: 'USD',
    status: 'draft',
    planVersion: 1,
    version: 1,
    proposal: null,
    approved: null,
    approvedById: null,
    approvedAt: null,
    createdById,
    updatedAt: now,
  });
  await ds.getRepository(OutageUnit).insert(units.map((u) => ({ outageId: outage.id, unitId: u.id })));
  const items: OutageItem[] = [];
  for (const it of options.items ?? []) {
    items.push(
      await ds.getRepository(OutageItem).save({
        outageId: outage.id,
        unitId: (it.unit ?? first).id,
        kind: 'other',
        title: it.title,
        cost: it.cost.toFixed(2),
        durationDays: it.durationDays,
        lane: it.lane,
        benefitMoney: it.benefit.toFixed(2),
        cleanlinessRecovered: null,
        horizonDays: null,
        caseId: null,
        pricedBenefit: it.benefit.toFixed(2),
        pricingMethod: 'entered',
        pricingText: 'Entered as money (test).',
        needs: [],
        forced: null,
        updatedAt: now,
      }),
    );
  }
  if (options.status === 'approved') {
    const snapshot: ApprovedSnapshot = {
      scopeName: 'Proposal',
      scopeId: null,
      startDate: outage.startDate,
      endDate: outage.endDate,
      windowDays: 14,
      budget: Number(outage.budget),
      currency: 'USD',
      items: [],
      selectedItemIds: [],
      totalBenefit: 0,
      totalCost: 0,
      laneDays: {},
      reasons: {},
    };
    await ds.getRepository(Outage).update({ id: outage.id }, { status: 'approved', approved: snapshot, approvedById: createdById, approvedAt: now });
  }
  return { outage: await ds.getRepository(Outage).findOneByOrFail({ id: outage.id }), items };
}

/** `days` daily figures ending on `lastDay`, every day at the same cleanliness, CW inlet temperature and load. */
export async function writeSteadyDays(
  ds: DataSource,
  unit: GeneratingUnit,
  figures: { lastDay: string; days: number; cleanliness: number; cwInletC: number; loadMw: number },
): Promise<void> {
  const end = Date.parse(`${figures.lastDay}T00:00:00Z`);
  for (let d = figures.days - 1; d >= 0; d--) {
    const day = new Date(end - d * 86_400_000).toISOString().slice(0, 10);
    await ds.query(
      'INSERT INTO daily_aggregate (unitId, day, pointsUsed, pointsDropped, medianCleanliness, meanCwInletC, meanLoadMw) VALUES (?, ?, ?, ?, ?, ?, ?)',
      [unit.id, day, 24, 0, figures.cleanliness, figures.cwInletC, figures.loadMw],
    );
  }
}
