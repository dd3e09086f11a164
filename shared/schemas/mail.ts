import { z } from 'zod';
import { CONFLICT_STATUSES } from '../domain';
import { email, optionalText } from './common';

/**
 * Mail each line owner's contact the conflicts on their lines, with the list attached.
 * `mode: 'preview'` answers who would get what and sends nothing; `mode: 'send'` queues the
 * messages in the outbox.
 */
export const mailOwnersSchema = z.strictObject({
  mode: z.enum(['preview', 'send']),
  /** Only these contact addresses (default: every contact with conflicts in the chosen statuses). */
  contacts: z.array(email).max(200).optional(),
  /** Conflict statuses to include (default: open and in review). */
  statuses: z.array(z.enum(CONFLICT_STATUSES)).min(1, 'choose at least one status').optional(),
  /** A note from the sender, placed above the list. */
  message: optionalText(4000),
});
export type MailOwnersInput = z.infer<typeof mailOwnersSchema>;
