import type { LinearUnit } from '@shared/domain';
import { UNIT_LABELS } from '@shared/domain';

/**
 * Grid coordinates are stored in the project's unit, so the CRS's own unit should match it.
 * Returns a warning when a proj4 definition names a different unit, else null.
 */
export function crsUnitWarning(proj4: string | undefined, unit: LinearUnit | undefined): string | null {
  if (!proj4 || !unit) return null;
  let crsUnit: LinearUnit | null = null;
  const units = /\+units=(\S+)/.exec(proj4)?.[1];
  const toMeter = /\+to_meter=([\d.]+)/.exec(proj4)?.[1];
  if (units === 'm') crsUnit = 'm';
  else if (units === 'ft') crsUnit = 'ft';
  else if (units === 'us-ft') crsUnit = 'usft';
  else if (toMeter) {
    const f = Number(toMeter);
    if (Math.abs(f - 0.3048) < 1e-9) crsUnit = 'ft';
    else if (Math.abs(f - 1200 / 3937) < 1e-9) crsUnit = 'usft';
    else if (f === 1) crsUnit = 'm';
  } else if (/\+proj=(longlat|latlong)/.test(proj4)) {
    return 'This definition is geographic (latitude/longitude). Threadline works in a projected grid; choose the projected CRS your survey uses.';
  }
  if (crsUnit && crsUnit !== unit) {
    return `The proj4 definition is in ${UNIT_LABELS[crsUnit]} but the project unit is ${UNIT_LABELS[unit]}. Grid coordinates are stored in the project unit, so these should match.`;
  }
  return null;
}
