/** Where the server's outage report files are downloaded (the browser follows these with the session cookie). */
export const outageReportPdfHref = (outageId: string) => `/api/outages/${outageId}/report.pdf`;
export const outageExportXlsxHref = (outageId: string) => `/api/outages/${outageId}/export.xlsx`;
