/** Condenser tube-bundle geometry (HEI basis: outside surface between the tubesheets). */
import { bwgWallMm } from '../../units.js';
import { TUBE_MATERIALS, type TubeMaterial } from './hei-tables.js';

export interface CondenserGeometry {
  /** Effective outside surface A = N·π·OD·L_eff, m² (not the inside area). */
  surfaceM2: number;
  tubeCount: number;
  passes: number;
  tubeOdMm: number;
  tubeBwg: number;
  tubeMaterial: TubeMaterial;
}

const positive = (name: string, v: number): void => {
  if (!(Number.isFinite(v) && v > 0)) throw new RangeError(`${name} must be a positive number, got ${v}`);
};

/** Checks the geometry and the plugged-tube count; throws a RangeError naming the field. */
export function assertGeometry(g: CondenserGeometry, pluggedTubes: number): void {
  positive('surfaceM2', g.surfaceM2);
  if (!(Number.isInteger(g.tubeCount) && g.tubeCount > 0)) throw new RangeError(`tubeCount must be a positive integer, got ${g.tubeCount}`);
  if (!(Number.isInteger(g.passes) && g.passes >= 1 && g.passes <= 4)) throw new RangeError(`passes must be an integer from 1 to 4, got ${g.passes}`);
  positive('tubeOdMm', g.tubeOdMm);
  if (!TUBE_MATERIALS.includes(g.tubeMaterial)) {
    throw new RangeError(`tubeMaterial must be one of ${TUBE_MATERIALS.join(', ')}, got ${String(g.tubeMaterial)}`);
  }
  const wall = bwgWallMm(g.tubeBwg);
  if (g.tubeOdMm <= 2 * wall) throw new RangeError(`tubeOdMm ${g.tubeOdMm} is too small for BWG ${g.tubeBwg} (wall ${wall.toFixed(3)} mm)`);
  if (!(Number.isInteger(pluggedTubes) && pluggedTubes >= 0 && pluggedTubes < g.tubeCount)) {
    throw new RangeError(`pluggedTubes must be an integer from 0 to tubeCount − 1 (${g.tubeCount - 1}), got ${pluggedTubes}`);
  }
}

export function tubeInsideDiameterM(g: CondenserGeometry): number {
  return (g.tubeOdMm - 2 * bwgWallMm(g.tubeBwg)) / 1000;
}

/** Active surface A·(1 − Np/N), m². */
export function activeSurfaceM2(g: CondenserGeometry, pluggedTubes: number): number {
  return g.surfaceM2 * (1 - pluggedTubes / g.tubeCount);
}

/** Mean tube velocity, m/s: volume flow over the open flow area of one pass. */
export function tubeVelocityMs(g: CondenserGeometry, cwFlowM3s: number, pluggedTubes: number): number {
  const di = tubeInsideDiameterM(g);
  const tubesPerPass = (g.tubeCount - pluggedTubes) / g.passes;
  return cwFlowM3s / ((tubesPerPass * Math.PI * di * di) / 4);
}
