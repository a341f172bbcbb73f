import type { CalcScheduleInput, CalcScheduleOutput } from '@shared/schemas/calc-schedule';
import { GENERAL_CAUTION } from '@shared/schemas/cleaning-method';
import { DataTable, td, th, tr } from '@frontend/components/ui/data-table';
import { SafetyCautions } from '@frontend/components/ui/safety-cautions';
import { CHART_COLOURS } from '@frontend/lib/chart-palette';
import { formatCurrency, formatDay, formatNumber, formatPercent } from '@frontend/lib/format';
import CashFlowChart from './cash-flow-chart';
import { CaseFigure, Swatch } from './case-figure';
import IntervalChart from './interval-chart';
import { casePhysicalSentence } from '@shared/text/case-physical-text';
import { intervalCurve } from './interval-curve';
import MonteCarloChart from './monte-carlo-chart';
import ScheduleChart from './schedule-chart';
import SensitivityChart from './sensitivity-chart';

export interface CaseResultsProps {
  results: CalcScheduleOutput;
  inputs: CalcScheduleInput;
  currency: string;
  /** the uncertainty of these inputs is still being computed (the charts show the previous one, faded) */
  uncertaintyUpdating?: boolean;
  /** sensitivity and Monte Carlo from the last full computation, while `results` has none yet */
  previousUncertainty?: Pick<CalcScheduleOutput, 'sensitivity' | 'monteCarlo'> | null;
  narrow?: boolean;
  /** what the case rests on (the case's own warnings), shown with the calculation's */
  caseWarnings?: string[];
}

function Figure({ label, value, note, testId }: { label: string; value: string; note?: string; testId?: string }) {
  return (
    <div className="flex flex-col rounded border border-rule bg-paper-raised px-3 py-2">
      <span className="text-xs text-ink-soft">{label}</span>
      <span className="text-lg font-semibold tabular-nums" data-testid={testId}>
        {value}
      </span>
      {note && <span className="text-2xs text-ink-faint">{note}</span>}
    </div>
  );
}

const years = (v: number | null) => (v === null ? 'not within the horizon' : `${formatNumber(v, 1)} years`);

/** The case's figures: what to do and when, what it is worth, and how sure that is. */
export function CaseResults({ results, inputs, currency, uncertaintyUpdating, previousUncertainty, narrow, caseWarnings = [] }: CaseResultsProps) {
  const warnings = [...caseWarnings, ...results.warnings];
  const bc = results.businessCase;
  const money = (v: number) => formatCurrency(v, currency);
  const first = results.cleanings[0];
  const sensitivity = results.sensitivity ?? previousUncertainty?.sensitivity;
  const monteCarlo = results.monteCarlo ?? previousUncertainty?.monteCarlo;
  const curve = intervalCurve(results, inputs);
  const methodCautions = new Map<string, string[]>();
  for (const c of results.cleanings)
    if (!methodCautions.has(c.methodName))
      methodCautions.set(
        c.methodName,
        c.cautions.filter((t) => t !== GENERAL_CAUTION),
      );
  const cautions = [GENERAL_CAUTION, ...[...methodCautions].flatMap(([name, texts]) => texts.map((t) => `${name}: ${t}`))];
  const yearlyCash = bc.cashflows.map((net, i) => ({ net, cumulative: bc.cashflows.slice(0, i + 1).reduce((a, b) => a + b, 0) }));
  return (
    <div className="flex flex-col gap-4">
      <div className="grid grid-cols-2 gap-2 sm:grid-cols-3 xl:grid-cols-3">
        <Figure label="Net present value" value={money(bc.npv)} note={`at ${formatPercent(inputs.discountRate, 1)} against the baseline`} testId="case-npv" />
        <Figure label="First cleaning" value={first ? formatDay(first.date) : 'none in the horizon'} note={first?.methodName} testId="case-first-cleaning" />
        <Figure label="Internal rate of return" value={bc.irr === null ? '—' : formatPercent(bc.irr, 1)} note={bc.irrReason} />
        <Figure label="Payback" value={years(bc.paybackYears)} note={`discounted: ${years(bc.discountedPaybackYears)}`} />
        <Figure label="Benefit–cost ratio" value={bc.benefitCostRatio === null ? '—' : formatNumber(bc.benefitCostRatio, 2)} note={bc.benefitCostReason} />
        <Figure label="Cost over the horizon" value={money(results.totals.total)} note={`baseline ${money(results.baseline.totals.total)}`} />
      </div>
      <p className="text-sm text-ink-soft" data-testid="case-physical">
        {casePhysicalSentence(inputs, results.totals.foulingCost, results.baseline.totals.foulingCost)}
      </p>

      <CaseFigure
        title="Recommended schedule"
        what={
          <span className="flex flex-wrap gap-x-4 gap-y-1">
            <Swatch colour={CHART_COLOURS.fitted} label="cleanliness along the schedule" />
            <Swatch colour="rgba(184, 102, 28, 0.35)" label="cleaning" />
            <Swatch colour="rgba(107, 111, 120, 0.16)" label="planned outage" />
          </span>
        }
        testId="case-schedule"
      >
        <ScheduleChart results={results} startDate={inputs.startDate} horizonDays={inputs.horizonDays} outages={inputs.plannedOutages ?? []} narrow={narrow} />
        {results.cleanings.length > 0 ? (
          <DataTable
            caption="Cleanings of the recommended schedule"
            head={
              <>
                <th className={th}>#</th>
                <th className={th}>Dates</th>
                <th className={th}>Method</th>
                <th className={`${th} text-right`}>Cleaning</th>
                <th className={`${th} text-right`}>Downtime</th>
                <th className={`${th} text-right`}>Cleanliness</th>
              </>
            }
          >
            {results.cleanings.map((c, i) => (
              <tr key={c.date} className={tr}>
                <td className={`${td} tabular-nums text-ink-soft`}>{i + 1}</td>
                <td className={`${td} whitespace-nowrap`}>
                  {formatDay(c.date)}
                  {c.endDate !== c.date && ` – ${formatDay(c.endDate)}`}
                  {c.daysInPlannedOutage > 0 && <span className="block text-2xs text-ink-faint">{c.daysInPlannedOutage} days in a planned outage</span>}
                </td>
                <td className={td}>{c.methodName}</td>
                <td className={`${td} text-right tabular-nums`}>{money(c.cleaningCost)}</td>
                <td className={`${td} text-right tabular-nums`}>{money(c.downtimeCost)}</td>
                <td className={`${td} text-right tabular-nums whitespace-nowrap`}>
                  {formatPercent(c.cleanlinessBefore, 0)} → {formatPercent(c.cleanlinessAfter, 0)}
                </td>
              </tr>
            ))}
          </DataTable>
        ) : (
          <p className="text-sm text-ink-soft">No cleaning pays for itself within the horizon.</p>
        )}
      </CaseFigure>

      <div className="grid gap-4 lg:grid-cols-2">
        <CaseFigure
          title="Cost against cleaning interval"
          what={curve.ok ? `Average cost per day if the ${curve.methodName} were repeated every so many days.` : undefined}
          note={
            curve.ok
              ? `Fouling cost per day from this schedule's own days after its first cleaning (${curve.cycleDays} days from ${formatDay(curve.from)}, with their seasons and prices); cleaning and downtime cost of that cleaning. A steady repeating cycle, not the calendar above.`
              : undefined
          }
          testId="case-interval"
        >
          {curve.ok ? <IntervalChart curve={curve} currency={currency} /> : <p className="text-sm text-ink-soft">{curve.reason}</p>}
        </CaseFigure>
        <CaseFigure
          title="Yearly cash flows"
          what={
            <span className="flex flex-wrap gap-x-4">
              <Swatch colour={CHART_COLOURS.measured} label="fouling savings against the baseline" />
              <Swatch colour={CHART_COLOURS.cost} label="extra cleaning and downtime cost" />
            </span>
          }
          testId="case-cash-flows"
        >
          <CashFlowChart businessCase={bc} currency={currency} />
          <DataTable
            caption="Cash flows by year"
            head={
              <>
                <th className={th}>Year</th>
                <th className={`${th} text-right`}>Net</th>
                <th className={`${th} text-right`}>Cumulative</th>
              </>
            }
          >
            {yearlyCash.map(({ net, cumulative }, i) => (
              <tr key={i === 0 ? 'start' : `y${i}`} className={tr}>
                <td className={td}>{i === 0 ? 'Start (up-front)' : `Year ${i}`}</td>
                <td className={`${td} text-right tabular-nums`}>{money(net)}</td>
                <td className={`${td} text-right tabular-nums`}>{money(cumulative)}</td>
              </tr>
            ))}
          </DataTable>
        </CaseFigure>
      </div>

      {(sensitivity || monteCarlo || uncertaintyUpdating) && (
        <div className="grid gap-4 lg:grid-cols-2">
          <CaseFigure
            title="Sensitivity"
            what="Each uncertain input at its low (grey) and high (blue), the others at base."
            testId="case-sensitivity"
            updating={uncertaintyUpdating}
          >
            {sensitivity ? <SensitivityChart sensitivity={sensitivity} currency={currency} /> : <p className="text-sm text-ink-soft">Computing…</p>}
          </CaseFigure>
          <CaseFigure
            title="Uncertainty of the NPV"
            what={
              monteCarlo
                ? `${formatNumber(monteCarlo.trials)} trials (seed ${monteCarlo.seed}): P10 ${money(monteCarlo.p10Npv)}, P50 ${money(monteCarlo.p50Npv)}, P90 ${money(monteCarlo.p90Npv)}; NPV above zero in ${formatPercent(monteCarlo.probabilityNpvPositive, 0)} of them.`
                : undefined
            }
            testId="case-monte-carlo"
            updating={uncertaintyUpdating}
          >
            {monteCarlo ? <MonteCarloChart monteCarlo={monteCarlo} currency={currency} /> : <p className="text-sm text-ink-soft">Computing…</p>}
          </CaseFigure>
        </div>
      )}

      <SafetyCautions texts={cautions} testId="case-cautions" />
      {warnings.length > 0 && (
        <div className="rounded border border-warn/40 bg-ledger-50 px-3 py-2 text-xs text-warn" data-testid="case-warnings">
          <p className="font-semibold">Read these with the figures</p>
          <ul className="mt-1 list-disc space-y-0.5 pl-5">
            {warnings.map((w) => (
              <li key={w}>{w}</li>
            ))}
          </ul>
        </div>
      )}
      <p className="text-xs text-ink-faint">Estimates from the data and assumptions shown.</p>
    </div>
  );
}
