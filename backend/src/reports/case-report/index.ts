/** The case report: the approved (or draft) cleaning case as a PDF document and as a workbook. */
export type { CaseReportContext } from './report-context.js';
export { renderCasePdf } from './pdf/render-pdf.js';
export { renderCaseXlsx } from './xlsx/render-xlsx.js';
