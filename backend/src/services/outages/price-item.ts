/**
 * An item's benefit in money and the sentence saying how it was priced: typed as money; a cleanliness recovered,
 * valued with the unit's own model at its recent typical conditions (cleanliness-pricing.ts); or a cleaning from
 * an approved case of the unit, whose saving against the case's own baseline is taken from the case's stored result.
 */
import Decimal from 'decimal.js';
import type { EntityManager } from 'typeorm';
import { MAX_OUTAGE_WINDOW_DAYS, type CleanlinessBenefit, type ItemBenefit } from '@shared/schemas/outages.js';
import { daysBetween, horizonYearIndex } from '@shared/domain/calendar/plant-date.js';
import { formatCurrency, formatDay, formatPercent } from '@shared/text/display-format.js';
import type { CleaningCase } from '../../entities/cleaning-case.entity.js';
import type { GeneratingUnit } from '../../entities/generating-unit.entity.js';
import type { PricingMethod } from '../../entities/outage-item.entity.js';
import type { Outage } from '../../entities/outage.entity.js';
import { AppError, badRequest } from '../../http/app-error.js';
import type { TenantScope } from '../../policies/tenant-scope.js';
import { recentOperatingDays } from '../../repositories/outage.repository.js';
import { caseInScope } from '../cases/case-access.js';
import { unitModelOf } from '../derived/unit-context.js';
import { CONDITION_DAYS, priceCleanlinessRecovered } from './cleanliness-pricing.js';

export interface PricedBenefit {
  pricedBenefit: Decimal;
  pricingMethod: PricingMethod;
  pricingText: string;
  benefitMoney: string | null;
  cleanlinessRecovered: number | null;
  horizonDays: number | null;
}

const field = (path: string, message: string) => badRequest('Some fields need attention', { fieldErrors: [{ path, message }] });
const money = (d: Decimal) => d.toDecimalPlaces(2).toFixed(2);

export function priceMoney(amount: number, currency: string): PricedBenefit {
  const d = new Decimal(amount).toDecimalPlaces(2);
  return {
    pricedBenefit: d,
    pricingMethod: 'entered',
    pricingText: `Entered as money: ${formatCurrency(d.toNumber(), currency)}.`,
    benefitMoney: money(d),
    cleanlinessRecovered: null,
    horizonDays: null,
  };
}

export async function priceCleanliness(em: EntityManager, unit: GeneratingUnit, benefit: CleanlinessBenefit, currency: string): Promise<PricedBenefit> {
  const model = unitModelOf(unit);
  if (!model || !unit.condenser) {
    throw new AppError(409, `${unit.name} has no complete setup (condenser, turbine, economics) to price a cleanliness with: enter the benefit as money`);
  }
  const unitCurrency = unit.economics?.currency;
  if (unitCurrency && unitCurrency !== currency) {
    throw new AppError(
      409,
      `${unit.name}’s economics count money in ${unitCurrency}, this outage in ${currency}: a cleanliness priced with them cannot be added to it. ` +
        `Enter the benefit as money in ${currency}, or set the unit’s economics back to ${currency}`,
    );
  }
  const days = await recentOperatingDays(em, unit.id, CONDITION_DAYS);
  if (days.length === 0) {
    throw new AppError(409, `${unit.name} has no days of valid data to price a cleanliness with: import its data, or enter the benefit as money`);
  }
  const priced = priceCleanlinessRecovered({
    unitName: unit.name,
    model,
    cwFlowM3s: unit.condenser.designCwFlowM3s,
    pluggedTubes: unit.condenser.pluggedTubes,
    days,
    cleanlinessRecovered: benefit.cleanlinessRecovered,
    horizonDays: benefit.horizonDays,
    currency,
  });
  return {
    pricedBenefit: priced.benefit,
    pricingMethod: 'cleanliness',
    pricingText: priced.text,
    benefitMoney: null,
    cleanlinessRecovered: benefit.cleanlinessRecovered,
    horizonDays: benefit.horizonDays,
  };
}

export function priceFor(em: EntityManager, unit: GeneratingUnit, benefit: ItemBenefit, currency: string): Promise<PricedBenefit> {
  return typeof benefit === 'number' ? Promise.resolve(priceMoney(benefit, currency)) : priceCleanliness(em, unit, benefit, currency);
}

export interface CaseCleaning {
  record: CleaningCase;
  priced: PricedBenefit;
  defaults: { title: string; cost: number; durationDays: number };
}

/**
 * The cleaning of an approved case of the unit. Its benefit is the case's discounted saving against its own
 * baseline (baseline total cost less the plan's, both as stored in the approved result) with the first cleaning's
 * cost added back, since that cost is the item's cost and counts against the outage budget: the value of the
 * cleaning before paying for it. The cost is added back discounted as the case discounted it (end-of-year factor
 * (1 + r)^−(k+1) for horizon year k from the case's start, shared/domain/decision/schedule/schedule-problem.ts), so
 * both halves are in the same money. Title, cost and duration default to the case's first cleaning.
 */
export async function caseCleaning(em: EntityManager, scope: TenantScope, outage: Outage, unitId: string, caseId: string): Promise<CaseCleaning> {
  const noCase = () => field('caseId', 'No such approved case of this unit');
  let record: CleaningCase;
  try {
    record = (await caseInScope(em, scope, caseId)).record;
  } catch (err) {
    if (err instanceof AppError && err.status === 404) throw noCase();
    throw err;
  }
  if (record.unitId !== unitId) throw field('caseId', 'This case is for another unit: choose the unit the case was built on');
  if (record.status !== 'approved') throw field('caseId', `Only an approved case’s cleaning can be added; this case is ${record.status}`);
  if (record.currency !== outage.currency) {
    throw field('caseId', `The case counts money in ${record.currency}, the outage in ${outage.currency}: they cannot be added together`);
  }
  return caseCleaningPriced(record, outage);
}

/** The case's discount factor on a day of its horizon: (1 + r)^−(k+1), k the horizon year the day falls in (as the case books money). */
export function caseDiscountFactor(startDate: string, day: string, discountRate: number): number {
  const offset = daysBetween(startDate, day);
  const year = offset < 0 ? 0 : horizonYearIndex(startDate, offset + 1)[offset]!;
  return Math.pow(1 + discountRate, -(year + 1));
}

/** The pricing of an approved case's first cleaning as an outage item (the case already checked). */
export function caseCleaningPriced(record: CleaningCase, outage: Pick<Outage, 'startDate' | 'endDate'>): CaseCleaning {
  const r = record.results;
  const first = r.cleanings[0];
  if (!first) throw new AppError(409, 'This case plans no cleaning over its horizon: there is nothing to add to the outage');
  const saving = new Decimal(r.baseline.discountedTotals.total).minus(r.discountedTotals.total);
  const factor = caseDiscountFactor(record.inputs.startDate, first.date, record.inputs.discountRate);
  const costBack = new Decimal(first.cleaningCost).times(factor).toDecimalPlaces(2);
  const benefit = saving.plus(costBack).toDecimalPlaces(2);
  const baselineWords = BASELINE_WORDS[record.inputs.baseline.kind];
  const outside =
    first.date < outage.startDate || first.date > outage.endDate
      ? ` The case planned it for ${formatDay(first.date)}, outside this outage’s window: the figure assumes doing it in this outage saves about as much.`
      : '';
  const whole =
    r.cleanings.length > 1
      ? `the case’s whole plan of ${r.cleanings.length} cleanings against its baseline, not this cleaning alone`
      : 'the case’s whole plan against its baseline, not this cleaning alone';
  const text =
    `From the approved case “${record.title}”: the benefit is ${whole}. The plan costs ${formatCurrency(saving.toNumber(), record.currency)} less than ` +
    `the baseline (${baselineWords}) over ${record.inputs.horizonDays} days, discounted at ${formatPercent(record.inputs.discountRate)}; the first cleaning’s cost ` +
    `(${formatCurrency(first.cleaningCost, record.currency)}, ${first.methodName} on ${formatDay(first.date)}; ${formatCurrency(costBack.toNumber(), record.currency)} ` +
    `discounted likewise) is added back, since it counts as this item’s cost: ${formatCurrency(benefit.toNumber(), record.currency)}.${outside}`;
  return {
    record,
    priced: { pricedBenefit: benefit, pricingMethod: 'case', pricingText: text, benefitMoney: null, cleanlinessRecovered: null, horizonDays: null },
    defaults: {
      title: `${first.methodName} (case “${record.title}”)`.slice(0, 120),
      cost: first.cleaningCost,
      durationDays: Math.min(MAX_OUTAGE_WINDOW_DAYS, Math.max(1, daysBetween(first.date, first.endDate) + 1)),
    },
  };
}

const BASELINE_WORDS: Record<CleaningCase['inputs']['baseline']['kind'], string> = {
  never: 'never cleaning',
  'next-planned-outage': 'cleaning at the next planned outage',
  'every-planned-outage': 'cleaning at every planned outage',
  fixed: 'the fixed cleaning dates it names',
};
