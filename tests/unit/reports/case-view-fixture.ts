/**
 * A cleaning case as the API answers it, for report tests: the inputs run through the real `schedule`
 * calculation, with case details of our own fictional scenario (Kestrel Valley Power Cooperative, Larkspur Bend
 * Station, Unit 2).
 */
import { runScheduleCommand } from '@shared/domain/decision/schedule/schedule-command.js';
import { calcScheduleInput } from '@shared/schemas/calc-schedule.js';
import type { CaseComment, CaseView } from '@shared/schemas/cases.js';

export const RAW_INPUT = {
  startDate: '2027-01-01',
  horizonDays: 730,
  drivers: {
    cwInletC: { monthly: [8, 9, 12, 16, 20, 25, 28, 28, 24, 18, 12, 9] },
    loadFraction: 0.85,
    fuelPricePerMmbtu: 3.5,
    replacementPricePerMwh: 60,
  },
  unit: {
    ratingMw: 300,
    heatRateBtuKwh: 9500,
    condenser: { surfaceM2: 17000, tubeCount: 18000, passes: 2, tubeOdMm: 25.4, tubeBwg: 22, tubeMaterial: 'titanium', cwFlowM3s: 15, designDutyMw: 480 },
  },
  fouling: { model: 'linear', ratePerDay: 0.004 },
  initial: { daysSinceCleaning: 30, cleanlinessAfterCleaning: 0.9 },
  methods: [
    'hp-water-lancing',
    'half-condenser-online',
    {
      id: 'larkspur-brush-crew',
      name: 'Brush crew, Larkspur contract',
      fixedCost: 22_000,
      costPerTube: 3.5,
      durationDays: 4,
      unitDuringCleaning: 'outage',
      deratePct: 0,
      recoveredCleanliness: 0.93,
      foulingRateMultiplier: 1,
      cautions: ['confined-space', 'lockout-tagout'],
      typical: false,
      note: 'Quote 2026-117 from the station’s cleaning contractor (fictional); recovery from the 2025 cleaning record.',
    },
  ],
  plannedOutages: [
    { from: '2027-04-05', to: '2027-04-25' },
    { from: '2028-04-03', to: '2028-04-20' },
  ],
  minSpacingDays: 30,
  discountRate: 0.08,
  baseline: { kind: 'next-planned-outage', methodId: 'hp-water-lancing' },
  uncertainty: { trials: 1000, seed: 7 },
};

export const SOURCES: CaseView['inputSources'] = {
  startDate: { source: 'prefilled', detail: 'the day after the case was made' },
  horizonDays: { source: 'prefilled', detail: 'two years, the product’s usual horizon' },
  'drivers.cwInletC': { source: 'measured', detail: 'monthly means of the CW inlet readings from 2023 to 2026' },
  'drivers.loadFraction': { source: 'measured', detail: 'mean load over the last 365 days with the unit on line' },
  'drivers.fuelPricePerMmbtu': { source: 'entered', detail: 'changed by the analyst from 3.20 to 3.50' },
  'drivers.replacementPricePerMwh': { source: 'prefilled', detail: 'from the unit’s economics' },
  'drivers.co2PricePerTonne': { source: 'prefilled', detail: 'from the unit’s economics (no carbon price)' },
  unit: { source: 'prefilled', detail: 'from the unit’s setup, version 4' },
  fouling: { source: 'measured', detail: 'fitted to 212 days since the cleaning of 3 Mar 2026 (linear, R² 0.91)' },
  initial: { source: 'measured', detail: 'days and cleanliness since the cleaning of 3 Mar 2026' },
  methods: { source: 'prefilled', detail: 'the organisation’s cleaning-method library' },
  plannedOutages: { source: 'prefilled', detail: 'the unit’s planned outages' },
  minSpacingDays: { source: 'entered', detail: 'at least a month between crews' },
  discountRate: { source: 'prefilled', detail: 'the organisation’s discount rate' },
  baseline: { source: 'entered', detail: 'what the station would do without this case' },
  uncertainty: { source: 'prefilled', detail: 'the engine’s typical ranges' },
};

export function caseViewFixture(overrides: Partial<CaseView> = {}, input: unknown = RAW_INPUT): CaseView {
  const inputs = calcScheduleInput.parse(input);
  return {
    id: '6f1c2a7e-3b8d-4e0a-9c51-2d4f8a7b9e10',
    organisationId: '0b7d4c11-5a2e-4f3b-8d61-7e9a0c2b4f55',
    unitId: 'a3e5f7b9-1c2d-4e6f-8a0b-9c8d7e6f5a4b',
    unitName: 'Unit 2',
    plantId: 'c4d5e6f7-8a9b-4c0d-9e1f-2a3b4c5d6e7f',
    plantName: 'Larkspur Bend Station',
    timeZone: 'America/Chicago',
    currency: 'USD',
    title: 'Unit 2 condenser cleaning, 2027–2028',
    status: 'draft',
    inputs,
    inputSources: SOURCES,
    results: runScheduleCommand(inputs),
    engineVersion: '1.0.0',
    builtFrom: { lastDataDay: '2026-09-30', setupVersion: 4 },
    newerData: null,
    author: { id: 'u-1', name: 'Ines Calloway' },
    decidedBy: null,
    returnReason: null,
    createdAt: '2026-10-01T14:05:00.000Z',
    updatedAt: '2026-10-02T09:30:00.000Z',
    submittedAt: null,
    decidedAt: null,
    archivedAt: null,
    copiedFromId: null,
    actions: { edit: true, submit: true, approve: false, return: false, archive: true, copy: true, comment: true },
    ...overrides,
  };
}

export const APPROVED: Partial<CaseView> = {
  status: 'approved',
  submittedAt: '2026-10-03T15:00:00.000Z',
  decidedAt: '2026-10-06T16:20:00.000Z',
  decidedBy: { id: 'u-2', name: 'Tobias Renwick' },
};

export const COMMENTS: CaseComment[] = [
  {
    id: 'c-1',
    author: { id: 'u-2', name: 'Tobias Renwick' },
    text: 'Check the brush crew quote against last spring’s invoice.',
    createdAt: '2026-10-04T13:00:00.000Z',
  },
  { id: 'c-2', author: { id: 'u-1', name: 'Ines Calloway' }, text: '=HYPERLINK("http://example.invalid","click")', createdAt: '2026-10-05T08:10:00.000Z' },
];

export const CONTEXT = { organisationName: 'Kestrel Valley Power Cooperative', generatedAt: new Date('2026-10-07T12:00:00.000Z'), comments: COMMENTS };
