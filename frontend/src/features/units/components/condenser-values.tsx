import type { CondenserSetup } from '@shared/schemas/unit-setup';
import { BWG_WALL_IN, inToMm } from '@shared/units';
import { ValueList } from '@frontend/components/ui/read-only';
import { formatStored, type FieldUnits, type UnitSystem } from '@frontend/lib/field-units';
import { formatNumber, formatPercent } from '@frontend/lib/format';
import { TUBE_MATERIAL_LABELS } from './tube-materials';

const group = 'flex flex-col gap-2';
const heading = 'text-sm font-semibold text-ink';

/** The saved condenser as text, grouped as the form groups it, for people who read the setup but may not change it. */
export function CondenserValues({ saved, units, system }: { saved: CondenserSetup | null; units: FieldUnits; system: UnitSystem }) {
  if (!saved) return <p className="text-sm text-ink-soft">The condenser has not been set up yet.</p>;
  const wallIn = BWG_WALL_IN[saved.tubeBwg];
  const wall = wallIn === undefined ? '' : `, wall ${system === 'us' ? `${formatNumber(wallIn, 3)} in` : `${formatNumber(inToMm(wallIn), 2)} mm`}`;
  return (
    <div className="flex flex-col gap-5" data-testid="condenser-values">
      <div className={group}>
        <h3 className={heading}>Geometry</h3>
        <ValueList
          label="Geometry"
          items={[
            { label: 'Shells', value: formatNumber(saved.shells) },
            { label: 'Passes', value: formatNumber(saved.passes) },
            { label: 'Tube count', value: formatNumber(saved.tubeCount) },
            { label: 'Tube outside diameter', value: formatStored(saved.tubeOdMm, units.tubeOdMm) },
            { label: 'Wall gauge', value: `${saved.tubeBwg} BWG${wall}` },
            { label: 'Tube material', value: TUBE_MATERIAL_LABELS[saved.tubeMaterial] ?? saved.tubeMaterial },
            {
              label: 'Effective tube length',
              value: saved.tubeLengthM === null ? '—' : formatStored(saved.tubeLengthM, units.tubeLengthM),
              note: 'Between the tubesheets',
            },
            { label: 'Outside surface (HEI basis)', value: formatStored(saved.surfaceM2, units.areaM2), note: 'Outside of the tubes between the tubesheets' },
          ]}
        />
      </div>
      <div className={group}>
        <h3 className={heading}>Design point</h3>
        <ValueList
          label="Design point"
          items={[
            { label: 'CW flow', value: formatStored(saved.designCwFlowM3s, units.flowM3s) },
            { label: 'CW inlet temperature', value: formatStored(saved.designCwInletC, units.temperatureC) },
            { label: 'Condenser duty', value: formatStored(saved.designDutyMw, units.powerMw) },
            { label: 'Backpressure', value: formatStored(saved.designBackpressureKpa, units.pressureKpa) },
            { label: 'Cleanliness', value: formatPercent(saved.designCleanliness, 0) },
          ]}
        />
      </div>
      <div className={group}>
        <h3 className={heading}>Plugging and reference</h3>
        <ValueList
          label="Plugging and reference"
          items={[
            { label: 'Plugged tubes now', value: formatNumber(saved.pluggedTubes), note: 'Tube-plugging events change this from their date' },
            { label: 'Plugged tubes at design', value: formatNumber(saved.designPluggedTubes) },
            {
              label: 'Reference cleanliness for fouling cost',
              value:
                saved.referenceCleanliness === null
                  ? `${formatPercent(saved.designCleanliness, 0)} (the design cleanliness)`
                  : formatPercent(saved.referenceCleanliness, 0),
            },
          ]}
        />
      </div>
    </div>
  );
}
