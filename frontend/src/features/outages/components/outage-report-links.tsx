import { Link } from 'react-router-dom';
import { outageExportXlsxHref, outageReportPdfHref } from '../api/report-links';

/** The outage as a document: the server's PDF and workbook, and the page to print. */
export function OutageReportLinks({ outageId }: { outageId: string }) {
  const link = 'rounded border border-rule bg-paper-raised px-3 py-1.5 text-sm hover:bg-paper-sunk';
  return (
    <nav aria-label="Report" className="flex flex-wrap gap-2 print:hidden">
      <a className={link} href={outageReportPdfHref(outageId)} download>
        Report (PDF)
      </a>
      <a className={link} href={outageExportXlsxHref(outageId)} download>
        Workbook (XLSX)
      </a>
      <Link className={link} to={`/outages/${outageId}/print`}>
        Printable page
      </Link>
    </nav>
  );
}
