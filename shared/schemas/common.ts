import { z } from 'zod';

/** A finite number (zod 4 already refuses NaN and ±Infinity). */
export const finite = z.number();
export const length = z.number().min(0, 'must be zero or more');
export const positiveLength = z.number().gt(0, 'must be greater than zero');
export const text = (max = 200) => z.string().trim().max(max);
export const requiredText = (max = 200) => z.string().trim().min(1, 'is required').max(max);
export const optionalText = (max = 2000) => z.string().trim().max(max).nullish();

/** A grid point [easting, northing] in the project's unit. */
export const gridPoint = z.tuple([finite, finite]);
export type GridPoint = z.infer<typeof gridPoint>;

/** A polyline of at least two grid points. */
export const polyline = z.array(gridPoint).min(2, 'needs at least two vertices').max(10000);

/** A closed polygon ring given as at least three distinct grid points (closure implied). */
export const ring = z.array(gridPoint).min(3, 'needs at least three corners').max(1000);

/** Station-elevation pair, for bore and ground profiles. */
export const profilePoint = z.strictObject({ station: finite, elevation: finite });
export type ProfilePoint = z.infer<typeof profilePoint>;

export const idParam = z.coerce.number().int().positive();
export const isoDate = z.iso.datetime({ offset: true });
export const email = z.email().max(254);
