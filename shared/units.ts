import type { LinearUnit } from './domain';

/**
 * Metres per unit. US survey foot = 1200/3937 m exactly; international foot = 0.3048 m exactly
 * (US Federal Register notice on the foot, NIST/NGS 2020).
 */
export const METRES_PER_UNIT: Record<LinearUnit, number> = {
  m: 1,
  ft: 0.3048,
  usft: 1200 / 3937,
};

/** Convert a length between linear units. */
export function convertLength(value: number, from: LinearUnit, to: LinearUnit): number {
  if (from === to) return value;
  return (value * METRES_PER_UNIT[from]) / METRES_PER_UNIT[to];
}

/** Short unit symbol printed beside numbers. */
export const UNIT_SYMBOLS: Record<LinearUnit, string> = { m: 'm', ft: 'ft', usft: 'US ft' };

/** Inches in one unit of length (for pipe sizes typed in inches on foot projects). */
export function inchesToUnit(inches: number, unit: LinearUnit): number {
  return convertLength(inches * 0.0254, 'm', unit);
}
