/**
 * Writes a demo unit's hours as a historian export would look: CSV (streamed) or XLSX (exceljs
 * streaming writer), in US customary or SI columns according to the unit's file style, and gives the
 * matching column mapping so the seed can import the file through the normal import pipeline.
 */
import { once } from 'node:events';
import { createWriteStream } from 'node:fs';
import ExcelJS from 'exceljs';
import { DateTime } from 'luxon';
import { cToF, kpaToInHg, m3sToGpm, m3sToM3h } from '@shared/units.js';
import type { ImportMappingInput } from '@shared/schemas/import-mapping.js';
import { massFlowToKgS } from '../../import/quantity-conversion.js';
import type { DemoHour, DemoUnitData } from './generate-demo-data.js';
import type { DemoFileStyle } from './demo-scenario.js';

const KGS_PER_SCFM = massFlowToKgS(1, 'scfm');
const EXCEL_SERIAL_UNIX_EPOCH = 25_569;

interface DemoColumn {
  header: string;
  value: (h: DemoHour) => number;
  decimals: number;
}

const US_COMMON_TAIL: DemoColumn[] = [
  { header: 'Hotwell Temp °F', value: (h) => cToF(h.hotwellC), decimals: 2 },
  { header: 'Cond DO ppb', value: (h) => h.dissolvedOxygenPpb, decimals: 1 },
  { header: 'Air Removal SCFM', value: (h) => h.airRemovalKgS / KGS_PER_SCFM, decimals: 1 },
];

/** Number columns of each style (the timestamp column comes first). */
export const DEMO_FILE_COLUMNS: Record<DemoFileStyle, { timestampHeader: string; columns: DemoColumn[] }> = {
  'us-absolute': {
    timestampHeader: 'Timestamp',
    columns: [
      { header: 'Gross MW', value: (h) => h.loadMw, decimals: 1 },
      { header: 'BP (inHgA)', value: (h) => kpaToInHg(h.backpressureKpa), decimals: 3 },
      { header: 'CW In Temp °F', value: (h) => cToF(h.cwInletC), decimals: 2 },
      { header: 'CW Out Temp °F', value: (h) => cToF(h.cwOutletC), decimals: 2 },
      { header: 'Circ Water Flow gpm', value: (h) => m3sToGpm(h.cwFlowM3s), decimals: 0 },
      ...US_COMMON_TAIL,
    ],
  },
  'us-vacuum': {
    timestampHeader: 'Date/Time',
    columns: [
      { header: 'Gross Load MW', value: (h) => h.loadMw, decimals: 1 },
      { header: 'Condenser Vacuum inHg', value: (h) => kpaToInHg(h.barometerKpa - h.backpressureKpa), decimals: 3 },
      { header: 'Barometric Pressure inHg', value: (h) => kpaToInHg(h.barometerKpa), decimals: 3 },
      { header: 'CW Inlet Temp degF', value: (h) => cToF(h.cwInletC), decimals: 2 },
      { header: 'CW Outlet Temp degF', value: (h) => cToF(h.cwOutletC), decimals: 2 },
      { header: 'CW Flow gpm', value: (h) => m3sToGpm(h.cwFlowM3s), decimals: 0 },
      ...US_COMMON_TAIL,
    ],
  },
  'si-semicolon': {
    timestampHeader: 'Time (ISO 8601)',
    columns: [
      { header: 'Generator output [MW]', value: (h) => h.loadMw, decimals: 1 },
      { header: 'Condenser pressure [mbar]', value: (h) => h.backpressureKpa * 10, decimals: 2 },
      { header: 'CW inlet temperature [°C]', value: (h) => h.cwInletC, decimals: 2 },
      { header: 'CW outlet temperature [°C]', value: (h) => h.cwOutletC, decimals: 2 },
      { header: 'CW flow [m³/h]', value: (h) => m3sToM3h(h.cwFlowM3s), decimals: 0 },
      { header: 'Hotwell temperature [°C]', value: (h) => h.hotwellC, decimals: 2 },
      { header: 'Dissolved O2 [ppb]', value: (h) => h.dissolvedOxygenPpb, decimals: 1 },
      { header: 'Air removal [kg/h]', value: (h) => h.airRemovalKgS * 3600, decimals: 2 },
    ],
  },
  'us-unmetered-flow': {
    timestampHeader: 'Timestamp',
    columns: [
      { header: 'Gross MW', value: (h) => h.loadMw, decimals: 1 },
      { header: 'BP (inHgA)', value: (h) => kpaToInHg(h.backpressureKpa), decimals: 3 },
      { header: 'CW In Temp °F', value: (h) => cToF(h.cwInletC), decimals: 2 },
      { header: 'CW Out Temp °F', value: (h) => cToF(h.cwOutletC), decimals: 2 },
      ...US_COMMON_TAIL,
    ],
  },
};

/** Timestamp text of a style: US text in local time, ISO with offset for the SI file. */
function timestampText(style: DemoFileStyle, ms: number, zone: string): string {
  const local = DateTime.fromMillis(ms, { zone });
  if (style === 'si-semicolon') return local.toFormat("yyyy-MM-dd'T'HH:mm:ssZZ");
  if (style === 'us-unmetered-flow') return local.toFormat('yyyy-MM-dd HH:mm');
  return local.toFormat('MM/dd/yyyy HH:mm');
}

/** Local wall-clock time as an Excel serial date (1900 system). */
export function excelSerialLocal(ms: number, zone: string): number {
  const offsetMin = DateTime.fromMillis(ms, { zone }).offset;
  return (ms + offsetMin * 60_000) / 86_400_000 + EXCEL_SERIAL_UNIX_EPOCH;
}

export async function writeDemoCsv(data: DemoUnitData, filePath: string): Promise<void> {
  const style = data.unit.fileStyle;
  const { timestampHeader, columns } = DEMO_FILE_COLUMNS[style];
  const semicolon = style === 'si-semicolon';
  const sep = semicolon ? ';' : ',';
  const out = createWriteStream(filePath, { encoding: 'utf8' });
  const finished = once(out, 'finish');
  const write = async (line: string) => {
    if (!out.write(`${line}\r\n`)) await once(out, 'drain');
  };
  await write([timestampHeader, ...columns.map((c) => c.header)].join(sep));
  for (const h of data.hours) {
    const cells = columns.map((c) => {
      const text = c.value(h).toFixed(c.decimals);
      return semicolon ? text.replace('.', ',') : text;
    });
    await write([timestampText(style, h.timestampUtc, data.timeZone), ...cells].join(sep));
  }
  out.end();
  await finished;
}

/** XLSX variant: the timestamp as an Excel serial date in plant-local time, the values as numbers. */
export async function writeDemoXlsx(data: DemoUnitData, filePath: string): Promise<void> {
  const { timestampHeader, columns } = DEMO_FILE_COLUMNS[data.unit.fileStyle];
  const workbook = new ExcelJS.stream.xlsx.WorkbookWriter({ filename: filePath, useStyles: false, useSharedStrings: false });
  const sheet = workbook.addWorksheet('Historian export');
  sheet.addRow([timestampHeader, ...columns.map((c) => c.header)]).commit();
  for (const h of data.hours) {
    const serial = Math.round(excelSerialLocal(h.timestampUtc, data.timeZone) * 86_400) / 86_400;
    sheet.addRow([serial, ...columns.map((c) => Number(c.value(h).toFixed(c.decimals)))]).commit();
  }
  sheet.commit();
  await workbook.commit();
}

/** The column mapping that reads a demo file of this unit (CSV or XLSX). */
export function demoImportMapping(data: DemoUnitData, kind: 'csv' | 'xlsx'): ImportMappingInput {
  const style = data.unit.fileStyle;
  const { timestampHeader } = DEMO_FILE_COLUMNS[style];
  const timestamp =
    kind === 'xlsx'
      ? { column: timestampHeader, format: 'excel-serial' as const, timeZone: data.timeZone }
      : style === 'si-semicolon'
        ? { column: timestampHeader, format: 'iso-8601-offset' as const }
        : {
            column: timestampHeader,
            format: 'local-text' as const,
            timeZone: data.timeZone,
            dateOrder: style === 'us-unmetered-flow' ? ('ymd' as const) : ('mdy' as const),
          };
  const usTail = {
    hotwellTemperature: { column: 'Hotwell Temp °F', unit: 'degF' },
    dissolvedOxygen: { column: 'Cond DO ppb', unit: 'ppb' },
    airRemovalFlow: { column: 'Air Removal SCFM', unit: 'scfm' },
  };
  switch (style) {
    case 'us-absolute':
      return {
        timestamp,
        columns: {
          grossLoad: { column: 'Gross MW', unit: 'MW' },
          backpressure: { column: 'BP (inHgA)', unit: 'inHg' },
          cwInletTemperature: { column: 'CW In Temp °F', unit: 'degF' },
          cwOutletTemperature: { column: 'CW Out Temp °F', unit: 'degF' },
          cwFlow: { column: 'Circ Water Flow gpm', unit: 'gpm' },
          ...usTail,
        },
      };
    case 'us-vacuum':
      return {
        timestamp,
        columns: {
          grossLoad: { column: 'Gross Load MW', unit: 'MW' },
          condenserVacuum: { column: 'Condenser Vacuum inHg', unit: 'inHg' },
          barometer: { column: 'Barometric Pressure inHg', unit: 'inHg' },
          cwInletTemperature: { column: 'CW Inlet Temp degF', unit: 'degF' },
          cwOutletTemperature: { column: 'CW Outlet Temp degF', unit: 'degF' },
          cwFlow: { column: 'CW Flow gpm', unit: 'gpm' },
          ...usTail,
        },
      };
    case 'si-semicolon':
      return {
        timestamp,
        decimalSeparator: kind === 'csv' ? ',' : '.',
        columns: {
          grossLoad: { column: 'Generator output [MW]', unit: 'MW' },
          backpressure: { column: 'Condenser pressure [mbar]', unit: 'mbar' },
          cwInletTemperature: { column: 'CW inlet temperature [°C]', unit: 'degC' },
          cwOutletTemperature: { column: 'CW outlet temperature [°C]', unit: 'degC' },
          cwFlow: { column: 'CW flow [m³/h]', unit: 'm3/h' },
          hotwellTemperature: { column: 'Hotwell temperature [°C]', unit: 'degC' },
          dissolvedOxygen: { column: 'Dissolved O2 [ppb]', unit: 'ppb' },
          airRemovalFlow: { column: 'Air removal [kg/h]', unit: 'kg/h' },
        },
      };
    case 'us-unmetered-flow':
      return {
        timestamp,
        designCwFlowM3s: data.unit.design.cwFlowM3s,
        columns: {
          grossLoad: { column: 'Gross MW', unit: 'MW' },
          backpressure: { column: 'BP (inHgA)', unit: 'inHg' },
          cwInletTemperature: { column: 'CW In Temp °F', unit: 'degF' },
          cwOutletTemperature: { column: 'CW Out Temp °F', unit: 'degF' },
          ...usTail,
        },
      };
  }
}
