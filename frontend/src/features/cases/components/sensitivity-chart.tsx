import { ResponsiveBar } from '@nivo/bar';
import type { CalcScheduleOutput } from '@shared/schemas/calc-schedule';
import { CHART_COLOURS, CHART_THEME } from '@frontend/lib/chart-palette';
import { compactMoney } from './compact-money';

export const UNCERTAIN_LABELS: Record<NonNullable<CalcScheduleOutput['sensitivity']>['bars'][number]['input'], string> = {
  foulingRate: 'Fouling rate',
  fuelPrice: 'Fuel price',
  replacementPrice: 'Replacement price',
  cleaningCost: 'Cleaning cost',
  recoveredCleanliness: 'Cleanliness after cleaning',
  discountRate: 'Discount rate',
};

type Row = { input: string; low: number; high: number };

/** How far the NPV moves from its base when each uncertain input goes to its low and its high, largest swing on top. */
export default function SensitivityChart({ sensitivity, currency }: { sensitivity: NonNullable<CalcScheduleOutput['sensitivity']>; currency: string }) {
  const rows: Row[] = [...sensitivity.bars]
    .sort((a, b) => a.swing - b.swing)
    .map((b) => ({ input: UNCERTAIN_LABELS[b.input], low: b.npvAtLow - sensitivity.baseNpv, high: b.npvAtHigh - sensitivity.baseNpv }));
  // symmetric about the base NPV, so a bar's length reads the same either side
  const reach = Math.max(1, ...rows.flatMap((r) => [Math.abs(r.low), Math.abs(r.high)])) * 1.05;
  return (
    <div className="h-56 w-full print:h-48" role="img" aria-label="Change of the NPV from its base for each input at its low and high">
      <ResponsiveBar<Row>
        data={rows}
        keys={['low', 'high']}
        indexBy="input"
        layout="horizontal"
        groupMode="stacked"
        margin={{ top: 8, right: 16, bottom: 36, left: 150 }}
        padding={0.3}
        colors={({ id }) => (id === 'low' ? CHART_COLOURS.reference : CHART_COLOURS.fitted)}
        enableLabel={false}
        valueScale={{ type: 'linear', min: -reach, max: reach }}
        axisBottom={{
          tickSize: 4,
          tickValues: 5,
          format: (v: number) => compactMoney(v, currency),
          legend: 'Change of NPV from its base',
          legendOffset: 30,
          legendPosition: 'middle',
        }}
        axisLeft={{ tickSize: 0, tickPadding: 6 }}
        markers={[{ axis: 'x', value: 0, lineStyle: { stroke: '#1d1f23', strokeWidth: 1 } }]}
        isInteractive={false}
        animate={false}
        theme={CHART_THEME}
        role="presentation"
      />
    </div>
  );
}
