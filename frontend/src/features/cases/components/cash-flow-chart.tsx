import { ResponsiveBar } from '@nivo/bar';
import type { CalcScheduleOutput } from '@shared/schemas/calc-schedule';
import { CHART_COLOURS, CHART_THEME } from '@frontend/lib/chart-palette';
import { compactMoney } from './compact-money';

type Row = { year: string; savings: number; costs: number };

const COLOURS = { savings: CHART_COLOURS.measured, costs: CHART_COLOURS.cost };

/** Each horizon year's fouling savings against the baseline (up) and the extra cleaning and downtime cost (down). */
export default function CashFlowChart({ businessCase, currency }: { businessCase: CalcScheduleOutput['businessCase']; currency: string }) {
  const rows: Row[] = businessCase.foulingSavings.map((s, i) => ({ year: `Year ${i + 1}`, savings: s, costs: -(businessCase.extraCleaningCosts[i] ?? 0) }));
  return (
    <div className="h-52 w-full print:h-44" role="img" aria-label="Yearly cash flows of the recommended schedule against the baseline">
      <ResponsiveBar<Row>
        data={rows}
        keys={['savings', 'costs']}
        indexBy="year"
        groupMode="stacked"
        margin={{ top: 12, right: 16, bottom: 32, left: 76 }}
        padding={0.35}
        colors={({ id }) => COLOURS[id as keyof typeof COLOURS]}
        enableLabel={false}
        valueScale={{ type: 'linear', min: 'auto', max: 'auto', nice: true }}
        axisBottom={{ tickSize: 4 }}
        axisLeft={{ tickSize: 4, tickValues: 5, format: (v: number) => compactMoney(v, currency) }}
        markers={[{ axis: 'y', value: 0, lineStyle: { stroke: '#1d1f23', strokeWidth: 1 } }]}
        isInteractive={false}
        animate={false}
        theme={CHART_THEME}
        role="presentation"
      />
    </div>
  );
}
