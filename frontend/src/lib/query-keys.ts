/**
 * The roots of the query keys, general → specific: invalidating a key invalidates every query under it.
 * Each feature's query-options factory builds its key from these, and a change that touches another
 * feature's data invalidates through them (features do not import each other).
 */
export const organisationKey = (organisationId: string) => ['organisations', organisationId] as const;

/** The organisation's plants and units list. */
export const plantsKey = (organisationId: string) => [...organisationKey(organisationId), 'plants'] as const;

/** One unit, and under it everything read about it (its events, imports, health). */
export const unitKey = (organisationId: string, unitId: string) => [...organisationKey(organisationId), 'units', unitId] as const;
