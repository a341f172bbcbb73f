export { REJECTION_REASONS, BACKPRESSURE_BOUNDS_KPA, PointRejectedError, type RejectionReason } from './rejection-reasons.js';
export { checkPointValidity, DEFAULT_POINT_RANGES, type DataPoint, type ValidityContext, type ValidityResult } from './point-validity.js';
