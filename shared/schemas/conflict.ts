import { z } from 'zod';
import { CONFLICT_STATUSES } from '../domain';
import { requiredText } from './common';

/** A person moves a conflict's status; every move carries a reason. */
export const conflictStatusSchema = z.strictObject({
  status: z.enum(CONFLICT_STATUSES),
  reason: requiredText(1000),
  version: z.number().int().positive(),
});
export type ConflictStatusInput = z.infer<typeof conflictStatusSchema>;
