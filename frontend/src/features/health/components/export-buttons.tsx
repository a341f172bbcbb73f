/** Downloads of the period's figures; plain links, so the browser saves the file the server names. */
export function ExportButtons({ unitId, from, to }: { unitId: string; from: string | null; to: string | null }) {
  const href = (dataset: 'daily' | 'breakdown', format: 'csv' | 'xlsx') => {
    const q = new URLSearchParams({ dataset, format });
    if (from) q.set('from', from);
    if (to) q.set('to', to);
    return `/api/units/${unitId}/export?${q.toString()}`;
  };
  const link = 'inline-flex items-center rounded border border-rule bg-paper-raised px-2.5 py-1 text-sm text-ink hover:bg-paper-sunk';
  return (
    <div className="no-print flex flex-wrap items-center gap-2" data-testid="exports">
      <span className="text-sm font-medium text-ink-soft">Downloads</span>
      <a className={link} href={href('daily', 'csv')} download>
        Daily figures (CSV)
      </a>
      <a className={link} href={href('daily', 'xlsx')} download>
        Daily figures (XLSX)
      </a>
      <a className={link} href={href('breakdown', 'csv')} download>
        Breakdown (CSV)
      </a>
      <a className={link} href={href('breakdown', 'xlsx')} download>
        Breakdown (XLSX)
      </a>
    </div>
  );
}
