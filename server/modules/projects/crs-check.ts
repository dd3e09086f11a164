import proj4 from 'proj4';
import type { LinearUnit } from '@shared/domain';
import { UNIT_LABELS } from '@shared/domain';
import { findCrs, validateProj4 } from '@shared/geometry/crs';
import { badRequest } from '../../errors';

/** Refuse a projection definition proj4 cannot use, naming the field. */
export function assertValidCrs(def: string): void {
  try {
    const converter = proj4(def, 'EPSG:4326');
    const probe = converter.forward([0, 0]);
    if (!probe.every(Number.isFinite)) throw new Error('not finite');
  } catch {
    throw badRequest('The coordinate reference system is not valid.', [
      { path: 'crsProj4', message: 'proj4 cannot read this definition' },
    ]);
  }
}

/**
 * Grid coordinates are stored in the project's unit, so the grid's own unit must be the same:
 * a catalogue code's unit, and the unit its proj4 definition names. A mismatch would place every
 * point 3.28 times off (or 2 ppm, US survey against international feet). Refused, naming `unit`.
 */
export function assertCrsUnit(code: string | undefined, def: string, unit: LinearUnit): void {
  const known = code ? findCrs(code) : undefined;
  let defUnit: LinearUnit | null = null;
  try {
    defUnit = validateProj4(def).unit;
  } catch {
    defUnit = null; // assertValidCrs names the definition's own problem
  }
  const grid = known?.unit ?? defUnit;
  if (grid && grid !== unit) {
    const source = known ? `${known.code} (${known.name}) is` : 'The proj4 definition is';
    throw badRequest('The project unit must be the unit of its grid.', [
      { path: 'unit', message: `${source} in ${UNIT_LABELS[grid]}; grid coordinates are stored in the project unit, so choose ${UNIT_LABELS[grid]}` },
    ]);
  }
  if (known && defUnit && defUnit !== known.unit) {
    throw badRequest('The proj4 definition does not match the CRS code.', [
      { path: 'crsProj4', message: `${known.code} is in ${UNIT_LABELS[known.unit]} but this definition is in ${UNIT_LABELS[defUnit]}` },
    ]);
  }
}
