/** Where the server's case report files are downloaded (the browser follows these with the session cookie). */
export const caseReportPdfHref = (caseId: string) => `/api/cases/${caseId}/report.pdf`;
export const caseExportXlsxHref = (caseId: string) => `/api/cases/${caseId}/export.xlsx`;
