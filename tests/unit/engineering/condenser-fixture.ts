/**
 * A plausible single-pressure condenser for the tests: 1 in OD titanium 22 BWG tubes, two passes,
 * sized so that at 75 °F inlet, 15 m³/s and 625 MW it runs near 1.94 inHgA at CF 0.85
 * (a typical HEI-style design point; figures made up for the tests, not a real plant).
 */
import type { CondenserGeometry } from '@shared/domain/condenser/index.js';

export const GEOMETRY: CondenserGeometry = {
  surfaceM2: 28500,
  tubeCount: 31200,
  passes: 2,
  tubeOdMm: 25.4,
  tubeBwg: 22,
  tubeMaterial: 'titanium',
};

export const DESIGN = {
  cwInletC: 23.9,
  cwFlowM3s: 15,
  dutyMw: 625,
  pluggedTubes: 0,
  cleanliness: 0.85,
};
