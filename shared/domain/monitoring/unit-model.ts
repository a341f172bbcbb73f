/**
 * A unit's setup turned into what the monitoring calculation needs, in SI: condenser geometry and design
 * state, turbine curve, heat-balance duty against load, and prices. Built once per setup version.
 */
import { DEFAULT_HEI_TABLES, type CondenserGeometry, type HeiTables, type TubeMaterial } from '../condenser/index.js';
import { liquidDensityKgM3 } from '../steam/index.js';
import { GENERIC_CORRECTION_CURVE, type CorrectionCurve } from '../turbine/index.js';

export interface UnitSetupSi {
  condenser: {
    passes: number;
    tubeCount: number;
    tubeOdMm: number;
    tubeBwg: number;
    tubeMaterial: TubeMaterial;
    surfaceM2: number;
    pluggedTubes: number;
    designCwFlowM3s: number;
    designCwInletC: number;
    designDutyMw: number;
    designBackpressureKpa: number;
    designCleanliness: number;
    designPluggedTubes: number;
    referenceCleanliness: number | null;
  };
  turbine: {
    ratingMw: number;
    designHeatRateBtuKwh: number;
    heatBalanceDuty: { loadFraction: number; dutyMw: number }[];
    correctionCurve: CorrectionCurve | null;
    minimumLoadFraction: number;
  };
  economics: {
    co2KgPerMmbtu: number;
    fuelPricePerMmbtu: number;
    replacementPricePerMwh: number;
    capacityLimitedShare: number;
    co2PricePerTonne: number;
    discountRate: number;
  };
}

export interface UnitModel {
  geometry: CondenserGeometry;
  heiTables: HeiTables;
  design: { cwInletC: number; cwMassFlowKgS: number; dutyMw: number; pluggedTubes: number; cleanliness: number; backpressureKpa: number };
  referenceCleanliness: number;
  curve: CorrectionCurve;
  curveIsGeneric: boolean;
  ratingMw: number;
  heatRateBtuKwh: number;
  minimumLoadFraction: number;
  economics: UnitSetupSi['economics'];
  /** Heat-balance condenser duty at a load fraction, MW (linear between the given points, extended linearly). */
  heatBalanceDutyMw: (loadFraction: number) => number;
}

function linearTable(points: { loadFraction: number; dutyMw: number }[]): (x: number) => number {
  const sorted = [...points].sort((a, b) => a.loadFraction - b.loadFraction);
  if (sorted.length < 2) throw new RangeError('the heat-balance duty needs at least two load points');
  return (x) => {
    let i = 0;
    while (i < sorted.length - 2 && x > sorted[i + 1]!.loadFraction) i++;
    const a = sorted[i]!;
    const b = sorted[i + 1]!;
    return a.dutyMw + ((b.dutyMw - a.dutyMw) * (x - a.loadFraction)) / (b.loadFraction - a.loadFraction);
  };
}

export function buildUnitModel(setup: UnitSetupSi, heiTables: HeiTables = DEFAULT_HEI_TABLES): UnitModel {
  const c = setup.condenser;
  return {
    geometry: { surfaceM2: c.surfaceM2, tubeCount: c.tubeCount, passes: c.passes, tubeOdMm: c.tubeOdMm, tubeBwg: c.tubeBwg, tubeMaterial: c.tubeMaterial },
    heiTables,
    design: {
      cwInletC: c.designCwInletC,
      cwMassFlowKgS: c.designCwFlowM3s * liquidDensityKgM3(c.designCwInletC),
      dutyMw: c.designDutyMw,
      pluggedTubes: c.designPluggedTubes,
      cleanliness: c.designCleanliness,
      backpressureKpa: c.designBackpressureKpa,
    },
    referenceCleanliness: c.referenceCleanliness ?? c.designCleanliness,
    curve: setup.turbine.correctionCurve ?? GENERIC_CORRECTION_CURVE,
    curveIsGeneric: !setup.turbine.correctionCurve,
    ratingMw: setup.turbine.ratingMw,
    heatRateBtuKwh: setup.turbine.designHeatRateBtuKwh,
    minimumLoadFraction: setup.turbine.minimumLoadFraction,
    economics: setup.economics,
    heatBalanceDutyMw: linearTable(setup.turbine.heatBalanceDuty),
  };
}
