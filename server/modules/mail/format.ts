import type { LinearUnit, Side, StationStyle } from '@shared/domain';
import { formatStation } from '@shared/geometry';
import { UNIT_SYMBOLS } from '@shared/units';

/** Plain-text figures for messages and attachments: unit beside every number, unambiguous dates. */
export const DECIMALS: Record<LinearUnit, number> = { m: 3, ft: 2, usft: 2 };

export function textLength(v: number | null | undefined, unit: LinearUnit): string {
  return v == null || !Number.isFinite(v) ? '—' : `${v.toFixed(DECIMALS[unit])} ${UNIT_SYMBOLS[unit]}`;
}

export function textStation(v: number | null | undefined, style: StationStyle): string {
  return v == null || !Number.isFinite(v) ? '—' : formatStation(v, style);
}

export function textOffset(distance: number | null | undefined, side: Side | null | undefined, unit: LinearUnit): string {
  if (distance == null || !Number.isFinite(distance)) return '—';
  return distance === 0 ? `${textLength(0, unit)} (on the alignment)` : `${textLength(distance, unit)} ${side ?? ''}`.trim();
}

/** `2027-03-04`. */
export function textDate(d: Date | string | null | undefined): string {
  if (!d) return '—';
  const date = typeof d === 'string' ? new Date(d) : d;
  return Number.isNaN(date.getTime()) ? '—' : date.toISOString().slice(0, 10);
}

/** `2027-03-04 14:05 UTC`. */
export function textDateTime(d: Date | string | null | undefined): string {
  if (!d) return '—';
  const date = typeof d === 'string' ? new Date(d) : d;
  return Number.isNaN(date.getTime()) ? '—' : `${date.toISOString().slice(0, 16).replace('T', ' ')} UTC`;
}

/** The cautions every message about conflicts ends with (SPEC §7). */
export const MAIL_CAUTION =
  'Clearances are a design aid: a licensed engineer checks every figure against the line owner’s and the local authority’s requirements. ' +
  'Notify the one-call centre before any digging; inside the locate tolerance zone expose lines by vacuum or hand methods only.';
