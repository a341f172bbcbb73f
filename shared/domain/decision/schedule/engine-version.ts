/**
 * Version of the schedule calculation (`runScheduleCommand`). Raise it whenever the same input would give
 * different results (a model, a default or a rounding changes), so a stored case tells which engine built it.
 */
export const ENGINE_VERSION = '1.0.0';
