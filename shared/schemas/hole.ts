import { z } from 'zod';
import { parseBearing } from '../bearing';
import { DEPTH_REFERENCES, EXCAVATION_METHODS, POSITION_SOURCES, SIDES } from '../domain';
import { finite, isoDate, length, optionalText, positiveLength, requiredText } from './common';

/**
 * Fields a crew logs on a test hole. The position is either grid E/N, or station + offset
 * on a bore (converted to grid by the server), or a phone GPS fix already converted to grid.
 */
const holeFields = z.strictObject({
  number: requiredText(40),
  lineId: z.number().int().positive(),
  positionSource: z.enum(POSITION_SOURCES),
  easting: finite.nullish(),
  northing: finite.nullish(),
  boreId: z.number().int().positive().nullish(),
  station: finite.nullish(),
  offset: length.nullish(),
  offsetSide: z.enum(SIDES).nullish(),
  gpsAccuracy: positiveLength.nullish(),
  groundElevation: finite.nullish(),
  depthToTop: length.nullish(),
  depthReference: z.enum(DEPTH_REFERENCES).default('top'),
  measuredSize: positiveLength.nullish(),
  boxWidth: positiveLength.nullish(),
  boxHeight: positiveLength.nullish(),
  depthToBottom: length.nullish(),
  material: optionalText(80),
  condition: optionalText(200),
  direction: optionalText(80),
  method: z.enum(EXCAVATION_METHODS).nullish(),
  ticketNumber: optionalText(40),
  surfaceType: optionalText(80),
  markerSet: z.boolean().nullish(),
  crew: optionalText(120),
  dugAt: isoDate.nullish(),
  notes: optionalText(4000),
  soil: optionalText(200),
  groundwater: optionalText(200),
  restoration: optionalText(200),
});

function positionCheck(
  v: Partial<z.infer<typeof holeFields>>,
  ctx: z.RefinementCtx,
) {
  if (v.positionSource === 'station') {
    if (v.boreId == null) ctx.addIssue({ code: 'custom', path: ['boreId'], message: 'choose the bore the station is on' });
    if (v.station == null) ctx.addIssue({ code: 'custom', path: ['station'], message: 'is required for a station/offset position' });
    if (v.offset == null) ctx.addIssue({ code: 'custom', path: ['offset'], message: 'is required for a station/offset position' });
    if (v.offset != null && v.offset > 0 && v.offsetSide == null) {
      ctx.addIssue({ code: 'custom', path: ['offsetSide'], message: 'is required: choose L or R' });
    }
  } else if (v.positionSource !== undefined) {
    if (v.easting == null) ctx.addIssue({ code: 'custom', path: ['easting'], message: 'is required' });
    if (v.northing == null) ctx.addIssue({ code: 'custom', path: ['northing'], message: 'is required' });
  }
  if (v.positionSource === 'gps' && v.gpsAccuracy == null) {
    ctx.addIssue({ code: 'custom', path: ['gpsAccuracy'], message: 'a GPS position needs its accuracy' });
  }
  // The bottom of a line is never above the point its depth was measured to (top, centre or bottom).
  if (v.depthToTop != null && v.depthToBottom != null && v.depthToBottom < v.depthToTop) {
    ctx.addIssue({ code: 'custom', path: ['depthToBottom'], message: `is less than the depth to ${v.depthReference ?? 'top'} (${v.depthToTop}): the bottom of a line is below its top` });
  }
}

/** Half-length of the stub drawn for a new unidentified line: 5 m each side of the hole (in the project unit when drawn). */
export const NEW_LINE_STUB_HALF_METRES = 5;

/**
 * A line on no record, exposed by this hole and added with it. The server makes it kind
 * unidentified (`unknown`), owner and status unknown, quality level A, drawn as a short stub
 * through the hole along the hole's `direction`; its size, material and depth are the hole's
 * own (`measuredSize` or `boxWidth`/`boxHeight`, `material`, `depthToTop`), so they are not repeated here.
 */
export const newLineSchema = z.strictObject({
  label: requiredText(120),
});
export type NewLineInput = z.infer<typeof newLineSchema>;

/** Exactly one of `lineId` / `newLine`; a new line needs what it is drawn and sized from. */
function lineCheck(v: { lineId?: number | null; newLine?: NewLineInput | null; direction?: string | null; depthToTop?: number | null; measuredSize?: number | null; boxWidth?: number | null; boxHeight?: number | null }, ctx: z.RefinementCtx) {
  const hasLine = v.lineId != null;
  const hasNew = v.newLine != null;
  if (hasLine && hasNew) {
    ctx.addIssue({ code: 'custom', path: ['newLine'], message: 'send either lineId (a line on record) or newLine (a line on no record), not both' });
  } else if (!hasLine && !hasNew) {
    ctx.addIssue({ code: 'custom', path: ['lineId'], message: 'is required (or send newLine for a line on no record)' });
  }
  if (!hasNew || hasLine) return;
  if (parseBearing(v.direction) == null) {
    ctx.addIssue({ code: 'custom', path: ['direction'], message: 'is needed to draw the new line: write a bearing such as N 83° E, an azimuth such as 83, or E-W' });
  }
  if (v.depthToTop == null) ctx.addIssue({ code: 'custom', path: ['depthToTop'], message: 'is needed to place the new line in depth' });
  const box = v.boxWidth != null || v.boxHeight != null;
  if (box) {
    if (v.boxWidth == null) ctx.addIssue({ code: 'custom', path: ['boxWidth'], message: 'is needed to add the new line' });
    if (v.boxHeight == null) ctx.addIssue({ code: 'custom', path: ['boxHeight'], message: 'is needed to add the new line' });
  } else if (v.measuredSize == null) {
    ctx.addIssue({ code: 'custom', path: ['measuredSize'], message: 'is needed to add the new line' });
  }
}

export const holeCreateSchema = holeFields
  .extend({
    /** Client-made id: a retried create returns the record it already made. */
    clientId: z.uuid(),
    /** The line exposed, on record. Send this or `newLine`, not both. */
    lineId: z.number().int().positive().optional(),
    /** A line on no record found by this hole, made with it in one go (see {@link newLineSchema}). */
    newLine: newLineSchema.optional(),
  })
  .strict()
  .superRefine((v, ctx) => {
    positionCheck(v, ctx);
    lineCheck(v, ctx);
  });
export type HoleCreateInput = z.infer<typeof holeCreateSchema>;

export const holeUpdateSchema = holeFields
  .partial()
  .extend({ version: z.number().int().positive() })
  .strict()
  .superRefine(positionCheck);
export type HoleUpdateInput = z.infer<typeof holeUpdateSchema>;

/** The surveyor's as-surveyed values; these win over ground − depth. */
export const holeSurveySchema = z.strictObject({
  surveyedEasting: finite.nullish(),
  surveyedNorthing: finite.nullish(),
  surveyedTopElevation: finite.nullish(),
  surveyedGroundElevation: finite.nullish(),
  version: z.number().int().positive(),
});
export type HoleSurveyInput = z.infer<typeof holeSurveySchema>;

export const holeReviewSchema = z.discriminatedUnion('decision', [
  z.strictObject({ decision: z.literal('accept'), version: z.number().int().positive() }),
  z.strictObject({ decision: z.literal('send_back'), reason: requiredText(500), version: z.number().int().positive() }),
  z.strictObject({ decision: z.literal('reopen'), reason: requiredText(500), version: z.number().int().positive() }),
]);
export type HoleReviewInput = z.infer<typeof holeReviewSchema>;
