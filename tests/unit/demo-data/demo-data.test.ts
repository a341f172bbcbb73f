import { createHash } from 'node:crypto';
import { mkdir, readFile } from 'node:fs/promises';
import { DateTime } from 'luxon';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { analyseCondenserPoint, backpressureAtCleanlinessKpa } from '@shared/domain/condenser/index.js';
import { saturationTemperatureC } from '@shared/domain/steam/index.js';
import { checkImportFile, importSamples, type ImportSample } from '@backend/import/parse-rows.js';
import { openTable } from '@backend/import/open-table.js';
import { guessMapping } from '@backend/import/column-mapping.js';
import { importMappingSchema } from '@shared/schemas/import-mapping.js';
import {
  DEMO_PLANTS,
  DEMO_UNITS,
  MIN_DEMO_SPAN_DAYS,
  demoImportMapping,
  demoUnit,
  generateDemoUnitData,
  writeDemoCsv,
  writeDemoFileSets,
  writeDemoXlsx,
  type DemoUnitData,
} from '@backend/seed/demo-data/index.js';
import { makeTempDir } from '../import/import-fixtures.js';

let tmp: Awaited<ReturnType<typeof makeTempDir>>;
beforeAll(async () => {
  tmp = await makeTempDir();
});
afterAll(async () => {
  await tmp.cleanup();
});

/** The day the tests make the demo on: the story then plays on the dates it is written in (2023–2025). */
const TODAY = '2026-01-01';

/**
 * Spans of history the tests play, to stay quick: the whole story (1,096 days) only where a test reads its
 * early years; SPAN_DAYS holds a planned cleaning of every unit (the last one ends 2025-05-25 as written);
 * SHORT_DAYS is the least the generator makes.
 */
const SPAN_DAYS = 280;
const SHORT_DAYS = MIN_DEMO_SPAN_DAYS;

const generated = new Map<string, DemoUnitData>();
/** The default-seed data of a unit made on TODAY (the whole story, or its last `days`), generated once per test file. */
const dataOf = (key: string, days?: number): DemoUnitData => {
  const id = `${key}:${days ?? 'all'}`;
  if (!generated.has(id)) generated.set(id, generateDemoUnitData(demoUnit(key), { today: TODAY, days }));
  return generated.get(id)!;
};
/** The plant-local day of an hour of a unit's data. */
const localDay = (data: DemoUnitData, ms: number) => DateTime.fromMillis(ms, { zone: data.timeZone }).toISODate();

const sha256 = async (file: string) =>
  createHash('sha256')
    .update(await readFile(file))
    .digest('hex');

const imported = new Map<string, ReturnType<typeof importDemoFile>>();
/** A unit's data written as a CSV or XLSX file and imported, once per data and kind. */
function importDemo(data: DemoUnitData, kind: 'csv' | 'xlsx') {
  const id = `${data.unit.key}:${data.hours.length}:${kind}`;
  if (!imported.has(id)) imported.set(id, importDemoFile(data, kind));
  return imported.get(id)!;
}

async function importDemoFile(data: DemoUnitData, kind: 'csv' | 'xlsx') {
  const file = tmp.file(`${data.unit.key}-${data.hours.length}-${kind}-import.${kind}`);
  await (kind === 'csv' ? writeDemoCsv(data, file) : writeDemoXlsx(data, file));
  const mapping = demoImportMapping(data, kind);
  const check = await checkImportFile(file, { mapping });
  const samples: ImportSample[] = [];
  const summary = check.ok
    ? await importSamples(file, {
        mapping,
        fileOrder: check.order,
        steadiness: { ratingMw: data.unit.turbine.ratingMw },
        onBatch: (b) => void samples.push(...b),
      })
    : null;
  return { check, summary, samples };
}

describe('demo scenario metadata', () => {
  it('uses only the fictional organisations and plants, with their time zones', () => {
    expect(DEMO_PLANTS.map((p) => [p.name, p.organisation, p.client ?? null, p.timeZone])).toEqual([
      ['Harrow Creek Station', 'Northmere Power Cooperative', null, 'America/Chicago'],
      ['Fenwick Ridge', 'Tidewater Performance Partners', 'Calder Valley Energy', 'Europe/Berlin'],
      ['Saltmarsh Point', 'Tidewater Performance Partners', 'Brightwater Municipal Utility', 'America/New_York'],
    ]);
  });

  it('states a surface that agrees with tube count, OD and length (A = N·π·OD·L, HEI outside-surface basis)', () => {
    for (const u of DEMO_UNITS) {
      const a = u.geometry.tubeCount * Math.PI * (u.geometry.tubeOdMm / 1000) * u.tubeEffectiveLengthM;
      expect(Math.abs(u.geometry.surfaceM2 - a)).toBeLessThan(1);
    }
  });

  it('has design tube velocities within the 6–8 ft/s the trade expects [common practice, ENGINEERING.md §3]', () => {
    for (const u of DEMO_UNITS) {
      const p = analyseCondenserPoint({
        backpressureKpa: 8,
        cwInletC: u.design.cwInletC,
        cwOutletC: u.design.cwInletC + 10,
        cwFlowM3s: u.design.cwFlowM3s,
        pluggedTubes: u.pluggedTubes,
        geometry: u.geometry,
        referenceCleanliness: 0.85,
      });
      expect(p.velocityMs / 0.3048).toBeGreaterThan(5.5);
      expect(p.velocityMs / 0.3048).toBeLessThan(8.5);
    }
  });
});

describe('demo data generator', () => {
  it('with the same seed writes the same bytes; with another seed, different ones', async () => {
    const unit = demoUnit('fenwick-ridge-1');
    const a = tmp.file('a.csv');
    const b = tmp.file('b.csv');
    const c = tmp.file('c.csv');
    await writeDemoCsv(generateDemoUnitData(unit, { today: TODAY, seed: 7, days: SHORT_DAYS }), a);
    await writeDemoCsv(generateDemoUnitData(unit, { today: TODAY, seed: 7, days: SHORT_DAYS }), b);
    await writeDemoCsv(generateDemoUnitData(unit, { today: TODAY, seed: 8, days: SHORT_DAYS }), c);
    expect(await sha256(a)).toBe(await sha256(b));
    expect(await sha256(c)).not.toBe(await sha256(a));
  });

  it('makes three years of hourly rows with every value present and finite', () => {
    const data = dataOf('harrow-creek-1');
    // 2023-01-01 to 2026-01-01 local: 1096 days; the DST changes cancel out over whole years
    expect(data.hours).toHaveLength(1096 * 24);
    expect(localDay(data, data.hours[0]!.timestampUtc)).toBe('2023-01-01');
    for (const h of data.hours) {
      for (const v of [h.loadMw, h.backpressureKpa, h.cwInletC, h.cwOutletC, h.cwFlowM3s, h.hotwellC, h.dissolvedOxygenPpb, h.airRemovalKgS, h.barometerKpa])
        expect(Number.isFinite(v)).toBe(true);
    }
  });

  it('with a shorter span plays the story’s last days: the same true cleanliness hour by hour, and only the cleanings and outages in them', () => {
    const whole = dataOf('harrow-creek-1');
    const short = dataOf('harrow-creek-1', SPAN_DAYS);
    const first = localDay(short, short.hours[0]!.timestampUtc)!;
    expect(first).toBe(DateTime.fromISO(TODAY).minus({ days: SPAN_DAYS }).toISODate());
    const tail = whole.hours.slice(-short.hours.length);
    expect(short.hours.map((h) => [h.timestampUtc, h.truth.cleanliness, h.truth.offline])).toEqual(
      tail.map((h) => [h.timestampUtc, h.truth.cleanliness, h.truth.offline]),
    );
    expect(short.cleanings).toEqual(whole.cleanings.filter((c) => c.date >= first));
    expect(short.cleanings.length).toBeGreaterThan(0);
    expect(short.outages).toEqual(whole.outages.filter((o) => o.end >= first));
  });

  it('refuses a span shorter than the faults it injects need, or longer than the story', () => {
    for (const days of [MIN_DEMO_SPAN_DAYS - 1, 1097, 100.5]) {
      expect(() => generateDemoUnitData(demoUnit('harrow-creek-1'), { today: TODAY, days })).toThrow(/whole number of days from 60 to 1096/);
    }
  });

  it('restores cleanliness at each cleaning it reports, inside a planned outage', () => {
    for (const u of DEMO_UNITS) {
      const data = dataOf(u.key, SPAN_DAYS);
      const first = localDay(data, data.hours[0]!.timestampUtc)!;
      expect(data.cleanings.length).toBeGreaterThan(0);
      expect(data.cleanings.length).toBe(data.unit.plannedOutages.filter((o) => o.cleaning && o.end >= first).length);
      for (const c of data.cleanings) {
        expect(c.cfAfter).toBeGreaterThan(c.cfBefore + 0.15);
        expect(data.unit.plannedOutages.some((o) => o.start <= c.date && c.date <= o.end)).toBe(true);
      }
    }
  });

  it('fouls asymptotically: cleanliness falls fast after a cleaning, then levels off', () => {
    const data = dataOf('harrow-creek-1');
    const byDay = (iso: string) => data.hours.find((h) => h.timestampUtc >= Date.parse(`${iso}T12:00:00Z`))!.truth.cleanliness;
    const early = byDay('2023-10-30') - byDay('2023-12-29'); // first 60 days after the October 2023 cleaning
    const late = byDay('2024-08-26') - byDay('2024-10-25'); // 60 days starting 300 days later
    expect(early).toBeGreaterThan(3 * late);
  });

  it('during the air in-leakage episode, raises backpressure above what fouling explains, with subcooling, dissolved O2 and air-removal flow', () => {
    const u = demoUnit('harrow-creek-1');
    const data = dataOf(u.key);
    const online = data.hours.filter((h) => !h.truth.offline && h.truth.fault === null);
    const inLeak = online.filter((h) => h.timestampUtc >= data.airLeak.startUtc + 86_400_000 && h.timestampUtc < data.airLeak.endUtc);
    const nearby = online.filter((h) => Math.abs(h.timestampUtc - data.airLeak.startUtc) < 60 * 86_400_000 && !h.truth.airLeak);
    const mean = (xs: number[]) => xs.reduce((a, b) => a + b, 0) / xs.length;
    const subcooling = (h: (typeof online)[number]) => saturationTemperatureC(h.backpressureKpa) - h.hotwellC;
    const unexplained = (h: (typeof online)[number]) =>
      h.truth.backpressureKpa -
      backpressureAtCleanlinessKpa({
        geometry: u.geometry,
        cwInletC: h.cwInletC,
        cwFlowM3s: h.truth.cwFlowM3s,
        dutyMw: h.truth.dutyMw,
        pluggedTubes: u.pluggedTubes,
        cleanliness: h.truth.cleanliness,
      });
    expect(inLeak.length).toBeGreaterThan(19 * 24 * 0.9);
    expect(mean(inLeak.map(subcooling))).toBeGreaterThan(2);
    expect(mean(nearby.map(subcooling))).toBeLessThan(1);
    expect(mean(inLeak.map((h) => h.dissolvedOxygenPpb))).toBeGreaterThan(3 * mean(nearby.map((h) => h.dissolvedOxygenPpb)));
    expect(mean(inLeak.map((h) => h.airRemovalKgS))).toBeGreaterThan(3 * mean(nearby.map((h) => h.airRemovalKgS)));
    expect(mean(inLeak.map(unexplained))).toBeGreaterThan(0.3);
    expect(Math.abs(mean(nearby.map(unexplained)))).toBeLessThan(0.05);
  });
});

describe('the demo made on a given day', () => {
  const LATER = '2026-12-02';

  it.each(['harrow-creek-1', 'fenwick-ridge-1'])(
    '%s made on 2 Dec 2026 ends with the hour before midnight of 1 Dec on the plant’s clock and starts its span earlier',
    (key) => {
      // the last 60 days hold the end of summer time on both sides of the Atlantic (25 Oct and 1 Nov 2026)
      const data = generateDemoUnitData(demoUnit(key), { today: LATER, days: SHORT_DAYS });
      const first = DateTime.fromMillis(data.hours[0]!.timestampUtc, { zone: data.timeZone });
      const last = DateTime.fromMillis(data.hours.at(-1)!.timestampUtc, { zone: data.timeZone });
      expect(last.toISODate()).toBe('2026-12-01');
      expect(last.hour).toBe(23);
      expect(first.toISODate()).toBe(DateTime.fromISO(LATER).minus({ days: SHORT_DAYS }).toISODate());
      expect(first.hour).toBe(0);
      // one row an hour throughout
      for (let i = 1; i < data.hours.length; i++) expect(data.hours[i]!.timestampUtc - data.hours[i - 1]!.timestampUtc).toBe(3_600_000);
    },
  );

  it('plays the same story moved: cleanings, outages and the air leak keep their distance from the end', () => {
    const written = dataOf('harrow-creek-1');
    const moved = generateDemoUnitData(demoUnit('harrow-creek-1'), { today: LATER });
    // the whole story by default: 1,096 days up to the day before
    expect(localDay(moved, moved.hours[0]!.timestampUtc)).toBe(DateTime.fromISO(LATER).minus({ days: 1096 }).toISODate());
    const days = DateTime.fromISO(LATER).diff(DateTime.fromISO(TODAY), 'days').days;
    const plus = (day: string) => DateTime.fromISO(day).plus({ days }).toISODate();
    expect(moved.cleanings.map((c) => [c.date, c.method, c.cfAfter])).toEqual(written.cleanings.map((c) => [plus(c.date), c.method, c.cfAfter]));
    expect(moved.outages).toEqual(written.outages.map((o) => ({ ...o, start: plus(o.start), end: plus(o.end) })));
    expect([moved.airLeak.start, moved.airLeak.end]).toEqual([plus(written.airLeak.start), plus(written.airLeak.end)]);
    // the hours of the leak and of the outages are where the moved dates say
    const leakDays = new Set(moved.hours.filter((h) => h.truth.airLeak).map((h) => localDay(moved, h.timestampUtc)));
    expect([...leakDays].sort()).toEqual(Array.from({ length: leakDays.size }, (_, i) => DateTime.fromISO(moved.airLeak.start).plus({ days: i }).toISODate()));
    for (const o of moved.outages) {
      const inside = moved.hours.filter((h) => {
        const d = localDay(moved, h.timestampUtc)!;
        return d >= o.start && d <= o.end;
      });
      expect(inside.length).toBeGreaterThan(0);
      expect(inside.every((h) => h.truth.offline)).toBe(true);
    }
  });

  it('with the same seed and day gives the same rows; on another day, the rows of other dates', () => {
    const a = generateDemoUnitData(demoUnit('saltmarsh-point-1'), { today: LATER, days: SHORT_DAYS });
    const b = generateDemoUnitData(demoUnit('saltmarsh-point-1'), { today: LATER, days: SHORT_DAYS });
    expect(b.hours).toEqual(a.hours);
    expect(a.hours[0]?.timestampUtc).not.toBe(dataOf('saltmarsh-point-1', SHORT_DAYS).hours[0]!.timestampUtc);
  });

  it('made at one instant, ends each plant’s history with the day before that plant’s own today', async () => {
    // 05:30 UTC on 2 Dec 2026: still 1 Dec in Chicago (CST = UTC−6), already 2 Dec in Berlin (CET = UTC+1)
    const dir = tmp.file('at-an-instant');
    await mkdir(dir);
    const sets = await writeDemoFileSets(dir, { now: new Date('2026-12-02T05:30:00Z'), units: ['harrow-creek-1', 'fenwick-ridge-1'], days: SHORT_DAYS });
    expect(sets.map((s) => [s.data.unit.key, localDay(s.data, s.data.hours.at(-1)!.timestampUtc)])).toEqual([
      ['harrow-creek-1', '2026-11-30'],
      ['fenwick-ridge-1', '2026-12-01'],
    ]);
  });

  it('refuses a day that is not a calendar day', () => {
    expect(() => generateDemoUnitData(demoUnit('harrow-creek-1'), { today: '2026-13-01' })).toThrow(/not a calendar day/);
  });
});

describe('demo files through the import pipeline', () => {
  it.each(DEMO_UNITS.map((u) => [u.key, u.fileStyle]))('%s (%s CSV) imports without a file error, keeping its bad rows with reasons', async (key) => {
    const data = dataOf(key, SPAN_DAYS);
    const { check, summary, samples } = await importDemo(data, 'csv');
    expect(check.fileError).toBeUndefined();
    expect(check.errors).toEqual([]);
    expect(check.dataRows).toBe(data.hours.length);
    expect(summary!.rowsRead).toBe(data.hours.length);
    const truth = new Map(data.hours.map((h) => [h.timestampUtc, h]));
    const codes = (fault: string) => samples.filter((s) => truth.get(s.timestampUtc)!.truth.fault === fault).map((s) => s.validity);
    expect(codes('outlet-not-above-inlet')).toEqual(Array(4).fill('rise-not-positive'));
    expect(codes('outlet-above-saturation')).toEqual(Array(3).fill('ttd-not-positive'));
    expect(codes('pressure-spike')).toEqual(Array(2).fill('out-of-range'));
    // some low-load nights in any span: more than the 100 rows once asked of three years, per hour played
    expect(summary!.rowsByReason['low-load']).toBeGreaterThan((100 / (1096 * 24)) * data.hours.length);
    expect(summary!.rowsOk / summary!.rowsRead).toBeGreaterThan(0.85);
  });

  it('recomputes, through the engineering core, a cleanliness within the sensor noise of the generator’s true one', async () => {
    const data = dataOf('harrow-creek-1', SPAN_DAYS);
    const { samples } = await importDemo(data, 'csv');
    const truth = new Map(data.hours.map((h) => [h.timestampUtc, h]));
    const relErrors: number[] = [];
    for (const s of samples) {
      const h = truth.get(s.timestampUtc)!;
      if (s.validity !== 'ok' || h.truth.fault !== null || h.truth.airLeak) continue;
      const point = analyseCondenserPoint({
        backpressureKpa: s.backpressureKpa,
        cwInletC: s.cwInletC,
        cwOutletC: s.cwOutletC,
        cwFlowM3s: s.cwFlowM3s,
        pluggedTubes: data.unit.pluggedTubes,
        geometry: data.unit.geometry,
        referenceCleanliness: 0.9,
      });
      relErrors.push(point.cleanliness / h.truth.cleanliness - 1);
    }
    relErrors.sort((a, b) => a - b);
    const q = (p: number) => relErrors[Math.floor(p * (relErrors.length - 1))]!;
    // noise: ±0.06 K on each CW temperature, 0.3 % on backpressure, 0.6 % on flow → a few per cent on CF
    // most of the hours, so that the 2.5 % and 97.5 % quantiles rest on thousands of points
    expect(relErrors.length).toBeGreaterThan(0.75 * data.hours.length);
    expect(Math.abs(q(0.5))).toBeLessThan(0.003);
    expect(q(0.025)).toBeGreaterThan(-0.05);
    expect(q(0.975)).toBeLessThan(0.05);
  });

  it('imports the XLSX variant to the same samples as the CSV', async () => {
    const data = dataOf('harrow-creek-2', SHORT_DAYS);
    const csv = await importDemo(data, 'csv');
    const xlsx = await importDemo(data, 'xlsx');
    expect(xlsx.check.ok).toBe(true);
    expect(xlsx.summary!.rowsByReason).toEqual(csv.summary!.rowsByReason);
    expect(xlsx.samples.length).toBe(csv.samples.length);
    for (let i = 0; i < csv.samples.length; i += 97) {
      const a = csv.samples[i]!;
      const b = xlsx.samples[i]!;
      expect(b.timestampUtc).toBe(a.timestampUtc);
      expect(b.backpressureKpa).toBeCloseTo(a.backpressureKpa, 9);
      expect(b.cwOutletC).toBeCloseTo(a.cwOutletC, 9);
    }
  });
});

describe('demo file sets for the seed', () => {
  it('writes one CSV per unit whose mapping is valid, names the file’s columns and matches what the guesser proposes', async () => {
    const sets = await writeDemoFileSets(tmp.dir, { today: TODAY, days: SHORT_DAYS });
    expect(sets.map((s) => s.data.unit.key)).toEqual(DEMO_UNITS.map((u) => u.key));
    for (const set of sets) {
      const mapping = importMappingSchema.parse(set.csvMapping);
      const table = await openTable(set.csvPath);
      await table.close();
      const mapped = [mapping.timestamp.column, ...Object.values(mapping.columns).map((c) => c!.column)];
      for (const column of mapped) expect(table.headers).toContain(column);
      const guess = guessMapping(table.headers, table.sampleRows, { timeZone: set.plant.timeZone });
      expect(guess.complete || !('cwFlow' in mapping.columns)).toBe(true);
      expect(guess.mapping.columns).toMatchObject(mapping.columns);
    }
  });
});
