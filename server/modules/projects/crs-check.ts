import proj4 from 'proj4';
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
