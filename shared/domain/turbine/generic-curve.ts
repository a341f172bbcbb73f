/**
 * Generic exhaust-pressure correction (heat-rate basis) for when the maker's curve is not entered yet.
 * Shape by common practice [cp]: about 1–2 % heat rate per inHg above design at full load, larger at
 * part load, choke near 1.2 inHgA at full load moving lower at part load. Consistent with a published
 * coal-unit sensitivity of about 2.07 %/inHg [pub: Pattanayak et al., Case Studies in Thermal
 * Engineering 14 (2019) 100484]. Zero at 2.0 inHgA. Replace with the turbine maker's curve.
 */
import { inHgToKpa } from '../../units.js';
import type { CorrectionCurve } from './correction-curve.js';

const points = (rows: [number, number][]) => rows.map(([inHgA, changePct]) => ({ backpressureKpa: inHgToKpa(inHgA), changePct }));

export const GENERIC_CORRECTION_CURVE: CorrectionCurve = {
  basis: 'heat-rate',
  label: "generic — replace with the turbine maker's curve",
  isGeneric: true,
  curves: [
    {
      loadFraction: 0.5,
      points: points([
        [0.8, -1.7],
        [1.0, -1.45],
        [1.5, -0.8],
        [2.0, 0],
        [2.5, 1.05],
        [3.0, 2.2],
        [3.5, 3.45],
        [4.0, 4.8],
        [5.0, 7.7],
      ]),
    },
    {
      loadFraction: 0.75,
      points: points([
        [1.0, -1.25],
        [1.5, -0.65],
        [2.0, 0],
        [2.5, 0.85],
        [3.0, 1.8],
        [3.5, 2.8],
        [4.0, 3.85],
        [5.0, 6.05],
      ]),
    },
    {
      loadFraction: 1.0,
      points: points([
        [1.2, -0.9],
        [1.5, -0.6],
        [2.0, 0],
        [2.5, 0.7],
        [3.0, 1.45],
        [3.5, 2.25],
        [4.0, 3.1],
        [5.0, 4.9],
      ]),
    },
  ],
};
