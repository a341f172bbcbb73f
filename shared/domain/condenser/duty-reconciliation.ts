/**
 * CW-side duty against the heat-balance duty. Gaps over 5 % are flagged: unmetered flow or a
 * stratified outlet temperature are the common causes (a 5 % flow error is a 2.5 % CF error).
 */
export interface DutyReconciliation {
  cwSideDutyMw: number;
  heatBalanceDutyMw: number;
  /** (CW-side − heat balance) / heat balance */
  gapFraction: number;
  flagged: boolean;
  message?: string;
}

export function reconcileDuty(cwSideDutyMw: number, heatBalanceDutyMw: number, thresholdFraction = 0.05): DutyReconciliation {
  if (!(heatBalanceDutyMw > 0)) throw new RangeError(`heatBalanceDutyMw must be positive, got ${heatBalanceDutyMw}`);
  if (!(cwSideDutyMw > 0)) throw new RangeError(`cwSideDutyMw must be positive, got ${cwSideDutyMw}`);
  const gapFraction = (cwSideDutyMw - heatBalanceDutyMw) / heatBalanceDutyMw;
  const flagged = Math.abs(gapFraction) > thresholdFraction;
  return {
    cwSideDutyMw,
    heatBalanceDutyMw,
    gapFraction,
    flagged,
    message: flagged
      ? `CW-side duty differs from the heat balance by ${(gapFraction * 100).toFixed(1)} % (over ${(thresholdFraction * 100).toFixed(0)} %): check the CW flow metering and the outlet temperature (stratification)`
      : undefined,
  };
}
