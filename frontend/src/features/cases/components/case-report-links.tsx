import { Link } from 'react-router-dom';
import { caseExportXlsxHref, caseReportPdfHref } from '../api/report-links';

/** The case as a document: the server's PDF and workbook, and the page to print. */
export function CaseReportLinks({ caseId }: { caseId: string }) {
  const link = 'rounded border border-rule bg-paper-raised px-3 py-1.5 text-sm hover:bg-paper-sunk';
  return (
    <nav aria-label="Report" className="flex flex-wrap gap-2 print:hidden">
      <a className={link} href={caseReportPdfHref(caseId)} download>
        Report (PDF)
      </a>
      <a className={link} href={caseExportXlsxHref(caseId)} download>
        Workbook (XLSX)
      </a>
      <Link className={link} to={`/cases/${caseId}/print`}>
        Printable page
      </Link>
    </nav>
  );
}
