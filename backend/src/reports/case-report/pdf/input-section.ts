/** Every input with its value, unit and where it came from; the sentence on the source is printed once per input. */
import type { CaseView } from '@shared/schemas/cases.js';
import { inputRows } from '../input-rows.js';
import { heading, paragraph, table, type TableRow } from './layout.js';
import { COLOR, SIZE } from './theme.js';

const SOURCE_WORDS = { measured: 'Measured', prefilled: 'Prefilled', entered: 'Entered' } as const;

export function inputSection(doc: PDFKit.PDFDocument, view: CaseView): void {
  heading(doc, 'Inputs and where they came from');
  paragraph(
    doc,
    'Measured: from the unit’s own data. Prefilled: filled in by the product from the unit’s setup, economics or the method library. Entered: typed or changed by a person.',
    {
      size: SIZE.small,
      color: COLOR.muted,
    },
  );
  const rows: TableRow[] = [];
  let group = '';
  let lastSourceKey: string | null = null;
  for (const r of inputRows(view)) {
    if (r.group !== group) {
      group = r.group;
      lastSourceKey = null;
      rows.push({ cells: [group], band: true });
    }
    const sameAsAbove = r.sourceKey !== null && r.sourceKey === lastSourceKey;
    const source =
      r.source === null
        ? 'No source recorded'
        : sameAsAbove
          ? `${SOURCE_WORDS[r.source]} (as above)`
          : `${SOURCE_WORDS[r.source]}${r.detail ? `: ${r.detail}` : ''}`;
    lastSourceKey = r.sourceKey;
    rows.push({ cells: [r.name, r.text, r.unit, source] });
  }
  table(
    doc,
    [
      { header: 'Input', width: 30 },
      { header: 'Value', width: 25 },
      { header: 'Unit', width: 12 },
      { header: 'Source', width: 33 },
    ],
    rows,
    { size: SIZE.tiny + 0.5 },
  );
}
