/** Named limits used by both sides. */

/** Largest historian file accepted (PRODUCT.md: up to 200 MB). */
export const MAX_UPLOAD_BYTES = 200 * 1024 * 1024;

/** File errors kept on an import and shown/downloaded (the count beyond is reported). */
export const MAX_LISTED_IMPORT_ERRORS = 10_000;

/** Points per chart series after downsampling (LTTB). */
export const MAX_SERIES_POINTS = 2_000;

/**
 * Most tubes a condenser setup may have. From memory: the largest single-unit condensers (nuclear units above
 * 1,300 MW) carry on the order of 100,000 tubes; twice that refuses typing slips, not unusual plants.
 */
export const MAX_TUBE_COUNT = 200_000;
