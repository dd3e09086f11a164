import { z } from 'zod';
import { CLEARANCE_STATUSES, CONFLICT_STATUSES, LINE_KINDS } from '../domain';
import { conflictListQuerySchema } from './conflict';
import type { StakePointKind } from './stakeout';

/** `a,b,c` or repeated parameters → a list (query strings); blanks are dropped. */
const toList = (v: unknown): unknown =>
  typeof v === 'string' || Array.isArray(v)
    ? (Array.isArray(v) ? v : v.split(',')).map((s: unknown) => (typeof s === 'string' ? s.trim() : s)).filter((s: unknown) => s !== '')
    : v;
function listOf<T extends z.ZodType>(item: T) {
  return z.preprocess(toList, z.array(item).max(100));
}

/**
 * How identifiers are written in a CSV: `plain` (RFC 4180 text, for programs) or `spreadsheet`
 * (`="007"`, which a spreadsheet opening the file directly shows as the text 007 instead of
 * turning it into the number 7).
 */
export const CSV_ID_STYLES = ['plain', 'spreadsheet'] as const;
export type CsvIdStyle = (typeof CSV_ID_STYLES)[number];

/**
 * The conflict list export (`conflicts.csv|xlsx|pdf`): the Conflicts screen's filter as query
 * parameters (the same names as the register's list filter, `?status=open,in_review&boreId=3`);
 * no filter exports everything.
 */
export const conflictExportQuerySchema = conflictListQuerySchema.extend({ ids: z.enum(CSV_ID_STYLES).optional() }).strict();
export type ConflictExportQuery = z.infer<typeof conflictExportQuerySchema>;

/** Which stake-out points a stake-out export holds: one set per kind of point on the Stake-out screen. */
export const STAKEOUT_SETS = ['crossings', 'suggested', 'pits'] as const;
export type StakeoutSet = (typeof STAKEOUT_SETS)[number];
/** The kind of point (`STAKE_POINT_KINDS`, whose labels the screen's filter and the files' headers use) each set holds. */
export const STAKEOUT_SET_KINDS = { crossings: 'crossing', suggested: 'suggested_hole', pits: 'pit_corner' } as const satisfies Record<StakeoutSet, StakePointKind>;

/** `stakeout.csv|dxf?boreId=3&kind=water&set=crossings`: all bores, line kinds and sets by default (`kind` narrows the lines; pit corners have none). */
export const stakeoutExportQuerySchema = z.strictObject({
  boreId: listOf(z.coerce.number().int().positive()).optional(),
  kind: listOf(z.enum(LINE_KINDS)).optional(),
  set: listOf(z.enum(STAKEOUT_SETS)).optional(),
});
export type StakeoutExportQuery = z.infer<typeof stakeoutExportQuerySchema>;

export const GEOJSON_LAYERS = ['lines', 'holes', 'bores'] as const;
export type GeojsonLayer = (typeof GEOJSON_LAYERS)[number];

/** `project.geojson?layers=lines,holes&kind=gas`: every layer and kind by default. */
export const geojsonExportQuerySchema = z.strictObject({
  layers: listOf(z.enum(GEOJSON_LAYERS)).optional(),
  kind: listOf(z.enum(LINE_KINDS)).optional(),
});
export type GeojsonExportQuery = z.infer<typeof geojsonExportQuerySchema>;

/** The conflict filter as a JSON body (lists as arrays). */
export const conflictFilterBodySchema = z.strictObject({
  status: z.array(z.enum(CONFLICT_STATUSES)).max(20).optional(),
  computedStatus: z.array(z.enum(CLEARANCE_STATUSES)).max(20).optional(),
  boreId: z.array(z.number().int().positive()).max(100).optional(),
  kind: z.array(z.enum(LINE_KINDS)).max(20).optional(),
  assignee: z.array(z.union([z.literal('none'), z.number().int().positive()])).max(100).optional(),
  q: z.string().trim().max(200).optional(),
});
export type ConflictFilterBody = z.infer<typeof conflictFilterBodySchema>;

/**
 * Start preparing the project zip. The filter narrows the conflict list (every part of it), the
 * stake-out points (its bores and kinds) and the lines, holes, sheets and photos (its kinds);
 * no filter packs everything.
 */
export const bundleRequestSchema = z.strictObject({
  filter: conflictFilterBodySchema.optional(),
  /** Include the photos (named by hole number); default true. */
  photos: z.boolean().optional(),
});
export type BundleRequest = z.infer<typeof bundleRequestSchema>;
