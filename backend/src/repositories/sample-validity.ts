/**
 * Which stored samples the derived-data code reads, in one place.
 *
 * A sample's `validity` is set twice. The import sets it from the row alone (`ok`, or the reason it is left
 * out: outside the steady load band, a gap, a sensor out of range…); that verdict never changes. The
 * recompute then runs the condenser model on the import's `ok` rows and either keeps `ok` or records why the
 * model rejected the point as `model:<reason>`; that verdict depends on the unit's setup, so it is undone by
 * the next recompute. Hence two sets:
 *  - re-analysable: `ok` or `model:…` — every row the model is run on again (a setup change may accept a
 *    point it rejected before, or reject one it accepted);
 *  - valid for the calculations: `ok` with a measured cleanliness — the rows daily figures, trends and costs
 *    are built from (a `model:…` row has no analysis; an `ok` row without cleanliness was never analysed,
 *    e.g. while the unit has no setup).
 * A chart of hourly points marks a third, wider set: the points that passed the checks (`ok`), analysed or not.
 */

/** SQL condition on `performance_sample` (alias-free): rows the model is run on again at each recompute. */
export const REANALYSABLE_SAMPLE_SQL = `(validity = 'ok' OR validity LIKE 'model:%')`;

/** SQL condition on `performance_sample` (alias-free): rows the daily figures, trends and costs use. */
export const VALID_FOR_CALCULATIONS_SQL = `(validity = 'ok' AND cleanliness IS NOT NULL)`;

/** SQL condition on `performance_sample` (alias-free): rows that passed the import's and the model's checks. */
export const PASSED_CHECKS_SQL = `(validity = 'ok')`;

/** The same rule as REANALYSABLE_SAMPLE_SQL, for a row already read. */
export function reanalysable(validity: string): boolean {
  return validity === 'ok' || validity.startsWith('model:');
}

/** The same rule as VALID_FOR_CALCULATIONS_SQL, for a row already read. */
export function validForCalculations(row: { validity?: unknown; cleanliness?: unknown }): boolean {
  return row.validity === 'ok' && row.cleanliness !== null && row.cleanliness !== undefined;
}

/** The reason a row read is left out of the calculations (`not-analysed` for an `ok` row without analysis). */
export function reasonLeftOut(row: { validity?: unknown }): string {
  return row.validity === 'ok' ? 'not-analysed' : String(row.validity);
}

/** The validity the recompute records for a point its model rejected. */
export function modelRejection(reason: string | null): string {
  return reason === null ? 'model:error' : `model:${reason}`.slice(0, 32);
}
