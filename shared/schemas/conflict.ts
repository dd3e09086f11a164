import { z } from 'zod';
import { CLEARANCE_STATUSES, CONFLICT_STATUSES, LINE_KINDS } from '../domain';
import { isoDate, optionalText, requiredText } from './common';

/** A person moves a conflict's status; every move carries a reason. */
export const conflictStatusSchema = z.strictObject({
  status: z.enum(CONFLICT_STATUSES),
  reason: requiredText(1000),
  /** Optional resolution note; a closing move with none keeps the reason as the note when the conflict has none yet. */
  resolutionNote: optionalText(2000),
  version: z.number().int().positive(),
});
export type ConflictStatusInput = z.infer<typeof conflictStatusSchema>;

/** A calendar date `2027-03-04` (stored as midnight UTC), or null to clear it. */
const calendarDate = z.iso.date({ message: 'must be a date like 2027-03-04' }).nullable();

/** The manager assigns a conflict to a person with a due date; the assignee is told by e-mail. */
export const conflictAssignmentSchema = z.strictObject({
  assigneeId: z.number().int().positive().nullable(),
  dueDate: calendarDate,
  version: z.number().int().positive(),
});
export type ConflictAssignmentInput = z.infer<typeof conflictAssignmentSchema>;

/** The register's working fields: who answers, when the owner was told and must answer, notes. */
export const conflictDetailsSchema = z.strictObject({
  responsibleParty: optionalText(160),
  /** A date, or a date and time (set automatically when the owner is e-mailed the list). */
  ownerNotifiedAt: z.union([z.iso.date(), isoDate], { message: 'must be a date like 2027-03-04' }).nullish(),
  answerDueAt: calendarDate.optional(),
  resolutionNote: optionalText(2000),
  notes: optionalText(4000),
  version: z.number().int().positive(),
});
export type ConflictDetailsInput = z.infer<typeof conflictDetailsSchema>;

/** A comment on a conflict's history. */
export const conflictCommentSchema = z.strictObject({
  text: requiredText(4000),
});
export type ConflictCommentInput = z.infer<typeof conflictCommentSchema>;

/** `a,b,c` or repeated parameters → a list (query strings); blanks are dropped. */
const toList = (v: unknown): unknown =>
  typeof v === 'string' || Array.isArray(v)
    ? (Array.isArray(v) ? v : v.split(',')).map((s: unknown) => (typeof s === 'string' ? s.trim() : s)).filter((s: unknown) => s !== '')
    : v;
function listOf<T extends z.ZodType>(item: T) {
  return z.preprocess(toList, z.array(item).max(100));
}

/**
 * The register's list filter as query parameters (`?status=open,in_review&boreId=3&assignee=none`);
 * the list endpoint, the Conflicts screen and the exports share it (see shared/conflicts.ts).
 */
export const conflictListQuerySchema = z.object({
  status: listOf(z.enum(CONFLICT_STATUSES)).optional(),
  computedStatus: listOf(z.enum(CLEARANCE_STATUSES)).optional(),
  boreId: listOf(z.coerce.number().int().positive()).optional(),
  kind: listOf(z.enum(LINE_KINDS)).optional(),
  assignee: listOf(z.union([z.literal('none'), z.coerce.number().int().positive()])).optional(),
  q: z.string().trim().max(200).optional(),
});
export type ConflictListQuery = z.infer<typeof conflictListQuerySchema>;
