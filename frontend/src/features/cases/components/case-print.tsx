import type { CaseView } from '@shared/schemas/cases';
import type { UnitSystem } from '@frontend/lib/field-units';
import { formatCurrency, formatDateTime, formatDay, formatPercent } from '@frontend/lib/format';
import { CaseInputs } from './case-inputs';
import { CaseResults } from './case-results';
import { STATUS_WORDS } from './case-status-badge';
import { caseUnits } from './case-units';

/** The recommendation in one paragraph, from the stored figures. */
export function recommendation(view: CaseView): string {
  const r = view.results;
  const money = (v: number) => formatCurrency(v, view.currency);
  const [first] = r.cleanings;
  if (!first) return `No cleaning pays for itself on ${view.unitName} within the horizon; the baseline costs ${money(r.baseline.totals.total)} over it.`;
  const more = r.cleanings.length > 1 ? `, then ${r.cleanings.length - 1} more cleaning${r.cleanings.length > 2 ? 's' : ''} over the horizon` : '';
  return `Clean ${view.unitName}’s condenser by ${first.methodName.toLowerCase()} from ${formatDay(first.date)}${more}. Against the baseline this is worth ${money(r.businessCase.npv)} in today’s money at a ${formatPercent(view.inputs.discountRate, 1)} discount rate${r.businessCase.paybackYears !== null ? `, paying back in ${r.businessCase.paybackYears.toFixed(1)} years` : ''}.`;
}

/** The case report for paper: title block, recommendation, every input with its source, the figures and cautions. */
export function CasePrint({ view, system }: { view: CaseView; system: UnitSystem }) {
  return (
    <article className="flex flex-col gap-4 text-sm" data-testid="case-print">
      <style>{'@page { size: A4; margin: 14mm } @media print { body { background: #fff } .case-figure, fieldset { break-inside: avoid } }'}</style>
      <header className="flex flex-col gap-1 border-b border-rule pb-3">
        <p className="text-xs text-ink-soft">
          Cleaning case · {view.plantName} — {view.unitName}
        </p>
        <h1>{view.title}</h1>
        <dl className="grid grid-cols-2 gap-x-6 gap-y-0.5 text-xs sm:grid-cols-4">
          <dt className="text-ink-soft">Status</dt>
          <dd>
            {STATUS_WORDS[view.status]}
            {view.status !== 'approved' && ' — not approved'}
          </dd>
          <dt className="text-ink-soft">Author</dt>
          <dd>{view.author.name}</dd>
          <dt className="text-ink-soft">Decided by</dt>
          <dd>{view.decidedBy ? `${view.decidedBy.name}, ${formatDateTime(view.decidedAt)}` : '—'}</dd>
          <dt className="text-ink-soft">Submitted</dt>
          <dd>{formatDateTime(view.submittedAt)}</dd>
          <dt className="text-ink-soft">Data to</dt>
          <dd>{formatDay(view.builtFrom.lastDataDay)}</dd>
          <dt className="text-ink-soft">Engine</dt>
          <dd>{view.engineVersion}</dd>
        </dl>
      </header>
      <section>
        <h2 className="text-base font-semibold">Recommendation</h2>
        <p data-testid="case-recommendation">{recommendation(view)}</p>
      </section>
      <section className="flex flex-col gap-2">
        <h2 className="text-base font-semibold">Figures</h2>
        <CaseResults results={view.results} inputs={view.inputs} currency={view.currency} caseWarnings={view.caseWarnings} />
      </section>
      <section className="flex flex-col gap-2">
        <h2 className="text-base font-semibold">Inputs and where they came from</h2>
        <CaseInputs
          inputs={view.inputs}
          saved={view.inputs}
          sources={view.inputSources}
          editable={false}
          units={caseUnits(system, view.currency)}
          change={() => undefined}
        />
      </section>
    </article>
  );
}
