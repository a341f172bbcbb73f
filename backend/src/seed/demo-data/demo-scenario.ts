/**
 * The fictional demo scenario's plants and units. Every number here is a DEMO VALUE, invented to be
 * plausible for a steam surface condenser of that size; none describes a real plant.
 */
import type { CondenserGeometry } from '@shared/domain/condenser/index.js';

/** How a unit's historian export looks (column names, units, timestamps, delimiter). */
export type DemoFileStyle = 'us-absolute' | 'us-vacuum' | 'si-semicolon' | 'us-unmetered-flow';

export interface DemoPlant {
  key: string;
  name: string;
  /** Owner organisation (by name) and, for a consultancy, the client it belongs to. */
  organisation: string;
  client?: string;
  timeZone: string;
}

export interface DemoUnitSpec {
  key: string;
  plantKey: string;
  name: string;
  /** DEMO VALUES: condenser geometry on the HEI basis (outside surface between the tubesheets). */
  geometry: CondenserGeometry;
  tubeEffectiveLengthM: number;
  pluggedTubes: number;
  turbine: { ratingMw: number; designHeatRateBtuKwh: number; fuel: 'bituminous-coal' | 'natural-gas' | 'sub-bituminous-coal' };
  design: { cwInletC: number; cwFlowM3s: number; cleanliness: number };
  /** Heat rejected to the CW per MW of output at full load [common practice for steam units: about 1.1–1.4]. */
  dutyPerMwFullLoad: number;
  climate: { meanInletC: number; amplitudeK: number; coldestDayOfYear: number; weatherSdK: number };
  /** Mean site barometer, kPa (lower at altitude). */
  barometerKpa: number;
  fouling: { cleanCf: number; asymptoticCf: number; timeConstantDays: number; daysSinceCleaningAtStart: number };
  /** Planned outages (local dates, inclusive); a cleaning is done in those marked so. */
  /** `cleaning.method` is the id of a method in the organisation's library (the typical methods new organisations start with). */
  plannedOutages: { start: string; end: string; cleaning?: { method: string; cfAfter: number } }[];
  /** The one air in-leakage episode (local dates): extra backpressure, subcooling, dissolved O2 and air-removal flow. */
  airLeak: { start: string; end: string; cfLossFraction: number };
  /** Winter pump line-up: below this inlet temperature one pump in four is secured. */
  winterFlowFraction: number;
  fileStyle: DemoFileStyle;
  seed: number;
}

/** The calendar the story below is written in; it is played moved to end the day before today (demo-calendar.ts). */
export const DEMO_START_LOCAL = '2023-01-01';
export const DEMO_END_LOCAL = '2026-01-01'; // exclusive
export const DEMO_SCENARIO_SEED = 20_260_101;

export const DEMO_PLANTS: DemoPlant[] = [
  { key: 'harrow-creek', name: 'Harrow Creek Station', organisation: 'Northmere Power Cooperative', timeZone: 'America/Chicago' },
  { key: 'fenwick-ridge', name: 'Fenwick Ridge', organisation: 'Tidewater Performance Partners', client: 'Calder Valley Energy', timeZone: 'Europe/Berlin' },
  {
    key: 'saltmarsh-point',
    name: 'Saltmarsh Point',
    organisation: 'Tidewater Performance Partners',
    client: 'Brightwater Municipal Utility',
    timeZone: 'America/New_York',
  },
];

/** A = N·π·OD·L, m². */
const surface = (tubes: number, odMm: number, lengthM: number): number => Math.round(tubes * Math.PI * (odMm / 1000) * lengthM);

export const DEMO_UNITS: DemoUnitSpec[] = [
  {
    key: 'harrow-creek-1',
    plantKey: 'harrow-creek',
    name: 'Unit 1',
    geometry: { surfaceM2: surface(22_000, 25.4, 13.7), tubeCount: 22_000, passes: 2, tubeOdMm: 25.4, tubeBwg: 22, tubeMaterial: 'titanium' },
    tubeEffectiveLengthM: 13.7,
    pluggedTubes: 140,
    turbine: { ratingMw: 520, designHeatRateBtuKwh: 9650, fuel: 'sub-bituminous-coal' },
    design: { cwInletC: 23.9, cwFlowM3s: 10.4, cleanliness: 0.9 },
    dutyPerMwFullLoad: 1.15,
    climate: { meanInletC: 16, amplitudeK: 11, coldestDayOfYear: 35, weatherSdK: 1.2 },
    barometerKpa: 98.9,
    fouling: { cleanCf: 0.92, asymptoticCf: 0.6, timeConstantDays: 160, daysSinceCleaningAtStart: 150 },
    plannedOutages: [
      { start: '2023-10-14', end: '2023-10-29', cleaning: { method: 'hp-water-lancing', cfAfter: 0.92 } },
      { start: '2024-10-12', end: '2024-10-24' },
      { start: '2025-04-05', end: '2025-04-20', cleaning: { method: 'hp-water-lancing', cfAfter: 0.93 } },
    ],
    airLeak: { start: '2024-07-22', end: '2024-08-12', cfLossFraction: 0.14 },
    winterFlowFraction: 0.75,
    fileStyle: 'us-absolute',
    seed: 1,
  },
  {
    key: 'harrow-creek-2',
    plantKey: 'harrow-creek',
    name: 'Unit 2',
    geometry: { surfaceM2: surface(18_500, 25.4, 13.0), tubeCount: 18_500, passes: 2, tubeOdMm: 25.4, tubeBwg: 18, tubeMaterial: 'cuni-90-10' },
    tubeEffectiveLengthM: 13.0,
    pluggedTubes: 310,
    turbine: { ratingMw: 450, designHeatRateBtuKwh: 9820, fuel: 'sub-bituminous-coal' },
    design: { cwInletC: 23.9, cwFlowM3s: 8.6, cleanliness: 0.85 },
    dutyPerMwFullLoad: 1.18,
    climate: { meanInletC: 16, amplitudeK: 11, coldestDayOfYear: 35, weatherSdK: 1.2 },
    barometerKpa: 98.9,
    fouling: { cleanCf: 0.86, asymptoticCf: 0.55, timeConstantDays: 120, daysSinceCleaningAtStart: 60 },
    plannedOutages: [
      { start: '2023-04-01', end: '2023-04-16', cleaning: { method: 'shot-tube-cleaners', cfAfter: 0.86 } },
      { start: '2024-04-06', end: '2024-04-19', cleaning: { method: 'shot-tube-cleaners', cfAfter: 0.85 } },
      { start: '2025-03-29', end: '2025-04-13', cleaning: { method: 'shot-tube-cleaners', cfAfter: 0.86 } },
    ],
    airLeak: { start: '2025-01-13', end: '2025-02-02', cfLossFraction: 0.12 },
    winterFlowFraction: 0.75,
    fileStyle: 'us-vacuum',
    seed: 2,
  },
  {
    key: 'fenwick-ridge-1',
    plantKey: 'fenwick-ridge',
    name: 'Block A',
    geometry: { surfaceM2: surface(16_800, 25.4, 12.2), tubeCount: 16_800, passes: 2, tubeOdMm: 25.4, tubeBwg: 22, tubeMaterial: 'stainless' },
    tubeEffectiveLengthM: 12.2,
    pluggedTubes: 90,
    turbine: { ratingMw: 410, designHeatRateBtuKwh: 9400, fuel: 'bituminous-coal' },
    design: { cwInletC: 18, cwFlowM3s: 8.2, cleanliness: 0.9 },
    dutyPerMwFullLoad: 1.12,
    climate: { meanInletC: 12.5, amplitudeK: 7.5, coldestDayOfYear: 40, weatherSdK: 0.9 },
    barometerKpa: 100.2,
    fouling: { cleanCf: 0.9, asymptoticCf: 0.62, timeConstantDays: 200, daysSinceCleaningAtStart: 240 },
    plannedOutages: [
      { start: '2023-06-03', end: '2023-06-18', cleaning: { method: 'hp-water-lancing', cfAfter: 0.9 } },
      { start: '2025-05-10', end: '2025-05-25', cleaning: { method: 'hp-water-lancing', cfAfter: 0.91 } },
    ],
    airLeak: { start: '2024-03-04', end: '2024-03-22', cfLossFraction: 0.13 },
    winterFlowFraction: 0.8,
    fileStyle: 'si-semicolon',
    seed: 3,
  },
  {
    key: 'saltmarsh-point-1',
    plantKey: 'saltmarsh-point',
    name: 'Unit 1',
    geometry: { surfaceM2: surface(12_400, 22.225, 11.6), tubeCount: 12_400, passes: 1, tubeOdMm: 22.225, tubeBwg: 18, tubeMaterial: 'cuni-90-10' },
    tubeEffectiveLengthM: 11.6,
    pluggedTubes: 220,
    turbine: { ratingMw: 290, designHeatRateBtuKwh: 10_150, fuel: 'natural-gas' },
    design: { cwInletC: 21, cwFlowM3s: 7.0, cleanliness: 0.85 },
    dutyPerMwFullLoad: 1.2,
    climate: { meanInletC: 13.5, amplitudeK: 8.5, coldestDayOfYear: 50, weatherSdK: 0.8 },
    barometerKpa: 101.2,
    fouling: { cleanCf: 0.85, asymptoticCf: 0.5, timeConstantDays: 90, daysSinceCleaningAtStart: 30 },
    plannedOutages: [
      { start: '2023-05-06', end: '2023-05-14', cleaning: { method: 'shot-tube-cleaners', cfAfter: 0.84 } },
      { start: '2023-11-04', end: '2023-11-12', cleaning: { method: 'hp-water-lancing', cfAfter: 0.85 } },
      { start: '2024-05-04', end: '2024-05-12', cleaning: { method: 'hp-water-lancing', cfAfter: 0.85 } },
      { start: '2024-11-02', end: '2024-11-10', cleaning: { method: 'hp-water-lancing', cfAfter: 0.85 } },
      { start: '2025-05-03', end: '2025-05-11', cleaning: { method: 'hp-water-lancing', cfAfter: 0.86 } },
    ],
    airLeak: { start: '2025-08-11', end: '2025-08-29', cfLossFraction: 0.15 },
    winterFlowFraction: 1,
    fileStyle: 'us-unmetered-flow',
    seed: 4,
  },
];

export function demoUnit(key: string): DemoUnitSpec {
  const unit = DEMO_UNITS.find((u) => u.key === key);
  if (!unit) throw new RangeError(`no demo unit "${key}"; known: ${DEMO_UNITS.map((u) => u.key).join(', ')}`);
  return unit;
}

export function demoPlant(key: string): DemoPlant {
  const plant = DEMO_PLANTS.find((p) => p.key === key);
  if (!plant) throw new RangeError(`no demo plant "${key}"`);
  return plant;
}
