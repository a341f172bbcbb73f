/** The outage-scope report: an outage as a PDF document and as a workbook. */
export type { OutageReportContext } from './report-content.js';
export { renderOutagePdf } from './render-pdf.js';
export { renderOutageXlsx } from './render-xlsx.js';
