/**
 * One error type for the geometry and clearance code, with a stable machine-readable code.
 * The server maps it to a 400 (bad input) problem; the client shows the message as is.
 */

/** Stable codes of geometry errors; never renamed once released. */
export const GEOMETRY_ERROR_CODES = [
  'INVALID_NUMBER',
  'INVALID_INPUT',
  'DEGENERATE_ALIGNMENT',
  'DEGENERATE_POLYLINE',
  'PROFILE_TOO_SHORT',
  'PROFILE_NOT_ORDERED',
  'STATION_OUTSIDE_PROFILE',
  'INVALID_STATION',
  'INVALID_OFFSET',
  'INVALID_PROJ4',
  'UNKNOWN_CRS',
  'OUTSIDE_AREA_OF_USE',
  'INVALID_SETTINGS',
  'INVALID_RULE',
  'DUPLICATE_ID',
] as const;
export type GeometryErrorCode = (typeof GEOMETRY_ERROR_CODES)[number];

/** A clear, typed failure of a geometry computation; `code` is stable, `message` is for people. */
export class GeometryError extends Error {
  readonly code: GeometryErrorCode;
  readonly details: Readonly<Record<string, unknown>> | undefined;

  constructor(code: GeometryErrorCode, message: string, details?: Record<string, unknown>) {
    super(message);
    this.name = 'GeometryError';
    this.code = code;
    this.details = details;
  }
}

/** True when `value` is a GeometryError (also across realms / bundles, by name and code). */
export function isGeometryError(value: unknown): value is GeometryError {
  return (
    value instanceof GeometryError ||
    (value instanceof Error && value.name === 'GeometryError' && typeof (value as { code?: unknown }).code === 'string')
  );
}

/** Throw INVALID_NUMBER unless `value` is a finite number; `what` names the field in the message. */
export function assertFinite(value: number, what: string): void {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new GeometryError('INVALID_NUMBER', `${what} must be a finite number (got ${String(value)})`, { what });
  }
}
