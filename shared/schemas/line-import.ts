import { z } from 'zod';
import { LINE_KINDS, LINE_STATUSES, QUALITY_LEVELS } from '../domain';
import { length, optionalText, positiveLength } from './common';

/** File formats a line import reads. */
export const LINE_IMPORT_FORMATS = ['geojson', 'dxf', 'csv'] as const;
export type LineImportFormat = (typeof LINE_IMPORT_FORMATS)[number];

export const LINE_IMPORT_FORMAT_LABELS: Record<LineImportFormat, string> = {
  geojson: 'GeoJSON (LineString / MultiLineString features)',
  dxf: 'DXF drawing (LWPOLYLINE, POLYLINE, LINE)',
  csv: 'CSV point file (point, northing, easting, elevation, description)',
};

/** The largest file an import takes, in characters (the request body limit follows it). */
export const LINE_IMPORT_MAX_CHARS = 15_000_000;
/** The most lines one import may create. */
export const LINE_IMPORT_MAX_LINES = 5_000;

/** What a group of the file (a DXF layer, a GeoJSON property value, a CSV code) becomes. */
export const lineImportGroupMappingSchema = z.strictObject({
  /** The line kind, or `skip` to leave the group out. */
  kind: z.enum([...LINE_KINDS, 'skip']),
  /** Owner for the group's lines that name none themselves. */
  owner: optionalText(160),
  /** Outside diameter (project unit) for the group's lines that give none themselves. */
  diameter: positiveLength.nullish(),
});
export type LineImportGroupMapping = z.infer<typeof lineImportGroupMappingSchema>;

/** Values for every imported line that neither the file nor its group gives. */
export const lineImportDefaultsSchema = z.strictObject({
  owner: optionalText(160),
  diameter: positiveLength.nullish(),
  qualityLevel: z.enum(QUALITY_LEVELS).optional(),
  status: z.enum(LINE_STATUSES).optional(),
  /** Assumed depth to top where no test hole exists yet. */
  recordDepth: length.optional(),
});
export type LineImportDefaults = z.infer<typeof lineImportDefaultsSchema>;

/**
 * A line import, for the preview (writes nothing; mapping and defaults optional, checked when
 * given) and the commit (every group with lines needs a mapping; all lines or none are written).
 *
 * Coordinates: GeoJSON in its `crs` member's EPSG code, else WGS 84 longitude/latitude (RFC 7946);
 * DXF and CSV in the project's grid and unit. `sourceCrs` (an EPSG code of the catalogue, or
 * `EPSG:4326` for longitude/latitude) overrides both.
 */
export const lineImportSchema = z.strictObject({
  format: z.enum(LINE_IMPORT_FORMATS),
  fileName: z.string().trim().max(200).optional(),
  content: z
    .string()
    .min(1, 'the file is empty')
    .max(LINE_IMPORT_MAX_CHARS, `the file is larger than ${LINE_IMPORT_MAX_CHARS / 1_000_000} million characters`),
  sourceCrs: z
    .string()
    .trim()
    .regex(/^EPSG:\d{4,6}$/i, 'must be an EPSG code such as EPSG:2278')
    .optional(),
  /** GeoJSON only: the feature property whose values are the groups (default `kind`, else `layer`). */
  groupBy: z.string().trim().min(1).max(60).optional(),
  mapping: z.record(z.string().max(200), lineImportGroupMappingSchema).optional(),
  defaults: lineImportDefaultsSchema.optional(),
});
export type LineImportInput = z.infer<typeof lineImportSchema>;
