import type { EntityManager } from '@mikro-orm/sqlite';
import type { Problem } from '@shared/api';
import { AppError } from '../../errors';
import { ConflictEvent } from '../conflicts/conflict-event.entity';
import { TestHole } from '../holes/test-hole.entity';

/**
 * Deleting a line or a bore would take its conflicts and their history with it (and, for a line,
 * its test holes and photos). A record people have worked on is kept: these guards refuse the
 * delete with a 409 that says what holds it. Conflicts only the clearance check has touched go
 * with the record; the activity log keeps the deleted record's last values either way.
 */

/** Conflict-history kinds written by people (status moves, assignment, details, comments, mail). */
export const PERSON_EVENT_KINDS = ['status', 'assignment', 'details', 'comment', 'owner_mailed'] as const;

async function workedConflictIds(em: EntityManager, where: { line: number } | { bore: number }): Promise<number[]> {
  const events = await em.find(
    ConflictEvent,
    { kind: { $in: [...PERSON_EVENT_KINDS] }, conflict: where },
    { fields: ['conflict'], orderBy: { conflict: 'asc' } },
  );
  return [...new Set(events.map((e) => e.conflict.id))];
}

const list = (ids: number[]) => ids.slice(0, 5).map((id) => `#${id}`).join(', ') + (ids.length > 5 ? ` and ${ids.length - 5} more` : '');

function inUse(message: string, holds: NonNullable<Problem['holds']>): AppError {
  return new AppError(409, 'in_use', message, { holds });
}

/** Refuse to delete a line that has test holes or conflicts with a history people wrote. */
export async function assertLineDeletable(em: EntityManager, lineId: number): Promise<void> {
  const holes = await em.find(TestHole, { line: lineId }, { fields: ['number'], orderBy: { number: 'asc' } });
  const conflicts = await workedConflictIds(em, { line: lineId });
  if (holes.length === 0 && conflicts.length === 0) return;
  const reasons = [
    holes.length > 0 ? `${holes.length} test hole${holes.length === 1 ? '' : 's'} (${holes.slice(0, 5).map((h) => h.number).join(', ')}${holes.length > 5 ? ', …' : ''})` : null,
    conflicts.length > 0 ? `conflict history people wrote (${list(conflicts)})` : null,
  ].filter(Boolean);
  throw inUse(
    `This line has ${reasons.join(' and ')}, which deleting it would erase. Move or delete the holes first; a line found not to be there is kept and marked abandoned or unknown instead.`,
    { holes: holes.map((h) => h.number), conflicts },
  );
}

/** Refuse to delete a bore whose conflicts carry a history people wrote. */
export async function assertBoreDeletable(em: EntityManager, boreId: number): Promise<void> {
  const conflicts = await workedConflictIds(em, { bore: boreId });
  if (conflicts.length === 0) return;
  throw inUse(
    `This bore's conflicts ${list(conflicts)} carry decisions, comments or mail that deleting the bore would erase. Void or resolve them and keep the bore, or change its alignment instead.`,
    { conflicts },
  );
}
