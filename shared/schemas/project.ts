import { z } from 'zod';
import { LINEAR_UNITS, LINE_KINDS, QUALITY_LEVELS, STATION_STYLES } from '../domain';
import { length, optionalText, positiveLength, requiredText } from './common';

/** Per-project settings of the clearance computation, in the project's unit. */
export const projectSettingsSchema = z.strictObject({
  /** A dug hole within this plan distance of a crossing or closest point verifies it. */
  verificationDistance: positiveLength,
  /** Horizontal location uncertainty of a line by quality level. */
  qualityLevelUncertainty: z.strictObject({ A: length, B: length, C: length, D: length }),
  /** Extra uncertainty per unit of extrapolation distance beyond the outermost hole. */
  extrapolationFactor: z.number().min(0).max(1),
  /** Phone GPS fixes with a horizontal accuracy worse than this are refused. */
  maxGpsAccuracy: positiveLength,
});
export type ProjectSettings = z.infer<typeof projectSettingsSchema>;

const crsCode = z
  .string()
  .trim()
  .regex(/^(EPSG:\d{4,6}|CUSTOM)$/, 'must be EPSG:<code> or CUSTOM');

export const projectCreateSchema = z.strictObject({
  name: requiredText(160),
  client: requiredText(160),
  description: optionalText(4000),
  crsCode,
  crsProj4: requiredText(1000),
  unit: z.enum(LINEAR_UNITS),
  verticalDatum: requiredText(60),
  stationStyle: z.enum(STATION_STYLES),
  settings: projectSettingsSchema.optional(),
});
export type ProjectCreateInput = z.infer<typeof projectCreateSchema>;

export const projectUpdateSchema = projectCreateSchema
  .omit({ unit: true })
  .partial()
  .extend({ version: z.number().int().positive() })
  .strict();
export type ProjectUpdateInput = z.infer<typeof projectUpdateSchema>;

export const memberAddSchema = z.strictObject({ userId: z.number().int().positive() });
export type MemberAddInput = z.infer<typeof memberAddSchema>;

export const clearanceRuleSchema = z.strictObject({
  kind: z.enum(LINE_KINDS),
  vertical: length,
  horizontal: length,
  source: optionalText(300),
});
export type ClearanceRuleInput = z.infer<typeof clearanceRuleSchema>;

export const clearanceRuleUpdateSchema = clearanceRuleSchema
  .omit({ kind: true })
  .partial()
  .extend({ version: z.number().int().positive() })
  .strict();
export type ClearanceRuleUpdateInput = z.infer<typeof clearanceRuleUpdateSchema>;

export { QUALITY_LEVELS };
