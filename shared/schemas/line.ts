import { z } from 'zod';
import { LINE_KINDS, LINE_SHAPES, LINE_STATUSES, QUALITY_LEVELS } from '../domain';
import { email, length, optionalText, polyline, positiveLength, requiredText } from './common';

const lineFields = z.strictObject({
  label: requiredText(120),
  owner: requiredText(160),
  kind: z.enum(LINE_KINDS),
  shape: z.enum(LINE_SHAPES),
  /** Outside diameter of a round line, in the project's unit. */
  diameter: positiveLength.nullish(),
  /** Width and height of a box (duct bank), in the project's unit. */
  width: positiveLength.nullish(),
  height: positiveLength.nullish(),
  material: optionalText(80),
  status: z.enum(LINE_STATUSES),
  qualityLevel: z.enum(QUALITY_LEVELS),
  path: polyline,
  /** Assumed depth to top where no hole exists. */
  recordDepth: length,
  /** Owner's required clearances; override the project rule for the kind. */
  requiredVertical: length.nullish(),
  requiredHorizontal: length.nullish(),
  contactEmail: email.nullish().or(z.literal('')),
  notes: optionalText(),
});

function sizeCheck(value: { shape?: string; diameter?: number | null; width?: number | null; height?: number | null }, ctx: z.RefinementCtx) {
  if (value.shape === 'round' && value.diameter == null) {
    ctx.addIssue({ code: 'custom', path: ['diameter'], message: 'a round line needs its outside diameter' });
  }
  if (value.shape === 'box') {
    if (value.width == null) ctx.addIssue({ code: 'custom', path: ['width'], message: 'a box needs its width' });
    if (value.height == null) ctx.addIssue({ code: 'custom', path: ['height'], message: 'a box needs its height' });
  }
}

export const lineCreateSchema = lineFields.superRefine(sizeCheck);
export type LineCreateInput = z.infer<typeof lineCreateSchema>;

export const lineUpdateSchema = lineFields
  .partial()
  .extend({ version: z.number().int().positive() })
  .strict()
  .superRefine(sizeCheck);
export type LineUpdateInput = z.infer<typeof lineUpdateSchema>;
