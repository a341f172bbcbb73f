/**
 * A made-up mid-size unit for the monitoring tests (not plant data) and physically consistent samples:
 * duty from the unit's heat balance, the CW rise from Q = W·cp·Δt and the backpressure from the condenser
 * model at a chosen cleanliness, so the sample's measured cleanliness is the one it was made with.
 */
import { backpressureAtCleanlinessKpa, cwRiseK } from '@shared/domain/condenser/index.js';
import { buildUnitModel, type SampleSi, type UnitModel, type UnitSetupSi } from '@shared/domain/monitoring/index.js';
import { liquidDensityKgM3 } from '@shared/domain/steam/index.js';

export const SETUP: UnitSetupSi = {
  condenser: {
    passes: 2,
    tubeCount: 18000,
    tubeOdMm: 25.4,
    tubeBwg: 22,
    tubeMaterial: 'titanium',
    surfaceM2: 16950,
    pluggedTubes: 120,
    designCwFlowM3s: 15,
    designCwInletC: 20,
    designDutyMw: 520,
    designBackpressureKpa: 6.8,
    designCleanliness: 0.9,
    designPluggedTubes: 0,
    referenceCleanliness: null,
  },
  turbine: {
    ratingMw: 340,
    designHeatRateBtuKwh: 9400,
    heatBalanceDuty: [
      { loadFraction: 0.4, dutyMw: 230 },
      { loadFraction: 1, dutyMw: 520 },
    ],
    correctionCurve: null,
    minimumLoadFraction: 0.4,
  },
  economics: { co2KgPerMmbtu: 93.28, fuelPricePerMmbtu: 2.8, replacementPricePerMwh: 55, capacityLimitedShare: 0.2, co2PricePerTonne: 0, discountRate: 0.08 },
};

export const MODEL: UnitModel = buildUnitModel(SETUP);

export interface SampleConditions {
  cleanliness: number;
  loadFraction?: number;
  cwInletC?: number;
  cwFlowM3s?: number;
  pluggedTubes?: number;
  /** measured CW-side duty over the heat-balance duty (1 = the two agree) */
  dutyRatio?: number;
}

/** A sample whose measured cleanliness is `cleanliness` under the given conditions. */
export function sampleAt(model: UnitModel, c: SampleConditions): SampleSi {
  const loadFraction = c.loadFraction ?? 0.88;
  const cwInletC = c.cwInletC ?? 22;
  const cwFlowM3s = c.cwFlowM3s ?? 14.5;
  const dutyMw = model.heatBalanceDutyMw(loadFraction) * (c.dutyRatio ?? 1);
  const rise = cwRiseK(cwInletC, liquidDensityKgM3(cwInletC) * cwFlowM3s, dutyMw);
  const backpressureKpa = backpressureAtCleanlinessKpa({
    geometry: model.geometry,
    cwInletC,
    cwFlowM3s,
    dutyMw,
    pluggedTubes: c.pluggedTubes ?? SETUP.condenser.pluggedTubes,
    cleanliness: c.cleanliness,
  });
  return { loadMw: loadFraction * model.ratingMw, backpressureKpa, cwInletC, cwOutletC: cwInletC + rise, cwFlowM3s };
}
