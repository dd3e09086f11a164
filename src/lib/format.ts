import type { LinearUnit, Side, StationStyle } from '@shared/domain';
import { UNIT_SYMBOLS } from '@shared/units';

/**
 * Display formatting. The station formatter here is a small stand-in; a shared one
 * (shared/geometry/station.ts, with parsing) will replace it — keep callers on `formatStation`.
 */

const STATION_SHAPE: Record<StationStyle, { base: number; digits: number; decimals: number }> = {
  '100': { base: 100, digits: 2, decimals: 2 },
  '1000': { base: 1000, digits: 3, decimals: 3 },
};

/** `1234.56` → `12+34.56` (100-style) or `1+234.560` (1000-style); negatives as `-0+12.34`. */
export function formatStation(value: number, style: StationStyle): string {
  if (!Number.isFinite(value)) return '—';
  const { base, digits, decimals } = STATION_SHAPE[style];
  const scale = 10 ** decimals;
  const scaled = Math.round(Math.abs(value) * scale);
  const baseScaled = base * scale;
  const major = Math.floor(scaled / baseScaled);
  const minor = (scaled % baseScaled) / scale;
  const sign = value < 0 && scaled !== 0 ? '-' : '';
  return `${sign}${major}+${minor.toFixed(decimals).padStart(digits + 1 + decimals, '0')}`;
}

/** Decimals shown for lengths in each unit (mm in metres, hundredths in feet). */
const LENGTH_DECIMALS: Record<LinearUnit, number> = { m: 3, ft: 2, usft: 2 };

/** A number with a fixed count of decimals and thousands separators. */
export function formatNumber(value: number, decimals: number): string {
  return value.toLocaleString('en-US', { minimumFractionDigits: decimals, maximumFractionDigits: decimals });
}

/** `1.234 m`, `3.50 US ft`; a dash for a missing value. */
export function formatLength(value: number | null | undefined, unit: LinearUnit, decimals = LENGTH_DECIMALS[unit]): string {
  if (value == null || !Number.isFinite(value)) return '—';
  return `${formatNumber(value, decimals)} ${UNIT_SYMBOLS[unit]}`;
}

/** A pipe or box size in the project unit, with the trade's usual size after it: `0.667 ft (8.0 in)`, `0.200 m (200 mm)`. */
export function formatSize(value: number | null | undefined, unit: LinearUnit): string {
  if (value == null || !Number.isFinite(value)) return '—';
  const usual = unit === 'm' ? `${formatNumber(value * 1000, 0)} mm` : `${formatNumber(value * 12, 1)} in`;
  return `${formatLength(value, unit, 3)} (${usual})`;
}

/** An elevation with unit and vertical datum: `102.35 ft NAVD 88`. */
export function formatElevation(value: number | null | undefined, unit: LinearUnit, datum: string): string {
  if (value == null || !Number.isFinite(value)) return '—';
  return `${formatLength(value, unit)} ${datum}`;
}

/** A grid coordinate (easting or northing) in the project unit. */
export function formatCoordinate(value: number | null | undefined, unit: LinearUnit): string {
  return formatLength(value, unit, unit === 'm' ? 3 : 2);
}

/** Offset stored as a distance and a side: `3.20 ft R`; zero offset has no side. */
export function formatOffset(distance: number | null | undefined, side: Side | null | undefined, unit: LinearUnit): string {
  if (distance == null || !Number.isFinite(distance)) return '—';
  if (distance === 0) return `${formatLength(0, unit)} (on line)`;
  return `${formatLength(distance, unit)} ${side ?? '?'}`;
}

const dateTime = new Intl.DateTimeFormat('en-US', { dateStyle: 'medium', timeStyle: 'short' });
const dateOnly = new Intl.DateTimeFormat('en-US', { dateStyle: 'medium' });

/** `Mar 4, 2026, 9:12 AM` in the browser's time zone. */
export function formatDateTime(iso: string | null | undefined): string {
  if (!iso) return '—';
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? '—' : dateTime.format(date);
}

/** `Mar 4, 2026`. */
export function formatDate(iso: string | null | undefined): string {
  if (!iso) return '—';
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? '—' : dateOnly.format(date);
}

/** Plan length of a grid polyline, in its own unit. */
export function polylineLength(points: readonly (readonly [number, number])[]): number {
  let total = 0;
  for (let i = 1; i < points.length; i++) {
    const a = points[i - 1]!;
    const b = points[i]!;
    total += Math.hypot(b[0] - a[0], b[1] - a[1]);
  }
  return total;
}
