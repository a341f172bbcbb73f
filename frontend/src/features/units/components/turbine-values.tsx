import { lazy, Suspense } from 'react';
import { GENERIC_CORRECTION_CURVE } from '@shared/domain/turbine/generic-curve';
import type { TurbineSetup } from '@shared/schemas/unit-setup';
import { DataTable, td, th, tr } from '@frontend/components/ui/data-table';
import { ValueList } from '@frontend/components/ui/read-only';
import { formatStored, type FieldUnits } from '@frontend/lib/field-units';
import { formatNumber, formatPercent } from '@frontend/lib/format';
import { chartSeries, GENERIC_LABEL } from './correction-curve-draft';

const CorrectionCurveChart = lazy(() => import('./correction-curve-chart'));

const heading = 'text-sm font-semibold text-ink';

/** The saved turbine as text: rating, heat rate, the heat-balance duty and the correction curve with its chart. */
export function TurbineValues({ saved, units }: { saved: TurbineSetup | null; units: FieldUnits }) {
  if (!saved) return <p className="text-sm text-ink-soft">The turbine has not been set up yet.</p>;
  const curve = saved.correctionCurve && !saved.correctionCurve.isGeneric ? saved.correctionCurve : GENERIC_CORRECTION_CURVE;
  const basisLabel = curve.basis === 'output' ? 'Output change' : 'Heat-rate change';
  const series = chartSeries(curve, units.pressureKpa);
  return (
    <div className="flex flex-col gap-5" data-testid="turbine-values">
      <ValueList
        label="Turbine"
        items={[
          { label: 'Rating', value: formatStored(saved.ratingMw, units.powerMw) },
          { label: 'Design heat rate', value: formatStored(saved.designHeatRateBtuKwh, units.heatRateBtuKwh) },
          {
            label: 'Minimum load for a valid point',
            value: `${formatPercent(saved.minimumLoadFraction, 0)} of rating`,
            note: 'Points below it are stored but left out',
          },
        ]}
      />
      <div className="flex flex-col gap-2">
        <h3 className={heading}>Condenser duty from the heat balance</h3>
        <div className="max-w-md">
          <DataTable
            caption="Heat-balance duty against load"
            head={
              <>
                <th className={`${th} text-right`}>Load (% of rating)</th>
                <th className={`${th} text-right`}>
                  Duty <span className="normal-case">({units.powerMw.label})</span>
                </th>
              </>
            }
          >
            {saved.heatBalanceDuty.map((d) => (
              <tr key={d.loadFraction} className={tr} data-testid="duty-row">
                <td className={`${td} text-right tabular-nums`}>{formatNumber(d.loadFraction * 100, 0)}</td>
                <td className={`${td} text-right tabular-nums`}>{formatNumber(units.powerMw.fromSi(d.dutyMw), units.powerMw.decimals)}</td>
              </tr>
            ))}
          </DataTable>
        </div>
      </div>
      <div className="flex flex-col gap-2">
        <h3 className={heading}>Exhaust-pressure correction curves</h3>
        {curve.isGeneric ? (
          <p className="text-sm text-ink-soft">
            The generic curve <span className="rounded bg-ledger-50 px-1.5 py-0.5 text-xs text-warn">{GENERIC_LABEL}</span>: a typical shape, not this
            turbine’s, so the costs built on it are rough.
          </p>
        ) : (
          <p className="text-sm text-ink-soft">
            {curve.label}: % change of {curve.basis === 'output' ? 'output' : 'heat rate'} against backpressure, {curve.curves.length} load
            {curve.curves.length === 1 ? '' : 's'}.
          </p>
        )}
        <div className={`grid gap-4 ${curve.isGeneric ? 'lg:grid-cols-2' : 'lg:grid-cols-[minmax(0,1fr)_minmax(0,1.1fr)]'}`}>
          {/* the generic curve's points are the same for every unit: its chart says enough */}
          {!curve.isGeneric && (
            <DataTable
              caption="Correction curve points"
              head={
                <>
                  <th className={`${th} text-right`}>Load (% of rating)</th>
                  <th className={`${th} text-right`}>
                    Backpressure <span className="normal-case">({units.pressureKpa.label})</span>
                  </th>
                  <th className={`${th} text-right`}>Change (%)</th>
                </>
              }
            >
              {curve.curves.flatMap((c) =>
                c.points.map((p) => (
                  <tr key={`${c.loadFraction}-${p.backpressureKpa}`} className={tr} data-testid="curve-point">
                    <td className={`${td} text-right tabular-nums`}>{formatNumber(c.loadFraction * 100, 0)}</td>
                    <td className={`${td} text-right tabular-nums`}>{formatNumber(units.pressureKpa.fromSi(p.backpressureKpa), units.pressureKpa.decimals)}</td>
                    <td className={`${td} text-right tabular-nums`}>{formatNumber(p.changePct, 2)}</td>
                  </tr>
                )),
              )}
            </DataTable>
          )}
          <div className="rounded border border-rule bg-paper-raised p-2">
            <p className="px-1 text-xs font-medium text-ink-soft">{basisLabel} against backpressure</p>
            <Suspense fallback={<div className="h-72 animate-pulse rounded bg-paper-sunk" aria-label="Loading the chart" />}>
              <CorrectionCurveChart series={series} pressureLabel={units.pressureKpa.label} basisLabel={basisLabel} />
            </Suspense>
          </div>
        </div>
      </div>
    </div>
  );
}
