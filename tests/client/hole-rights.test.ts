/**
 * The hole screens offer Edit only where the server will accept the edit: `holeRights` (client)
 * against the server's own rule, `assertCanEdit` plus the role permission, for every role, own
 * and someone else's hole, and every hole status.
 */
import { describe, expect, it } from 'vitest';
import { HOLE_STATUSES, ROLES } from '@shared/domain';
import { can } from '@shared/permissions';
import type { TestHole, User } from '@server/entities';
import { assertCanEdit } from '@server/modules/holes/holes.service';
import { holeRights } from '@/features/holes/utils/rights';

function serverAccepts(user: { id: number; role: (typeof ROLES)[number] }, hole: { status: (typeof HOLE_STATUSES)[number]; createdById: number }): boolean {
  if (!can(user.role, 'hole.update')) return false;
  try {
    assertCanEdit(user as unknown as User, { status: hole.status, number: 'TH-1', createdBy: { id: hole.createdById } } as unknown as TestHole);
    return true;
  } catch {
    return false;
  }
}

describe('who may edit a test hole', () => {
  for (const role of ROLES) {
    for (const status of HOLE_STATUSES) {
      for (const createdById of [1, 2]) {
        it(`a ${role} on a ${status} hole logged by ${createdById === 1 ? 'them' : 'someone else'}: the screen offers what the server accepts`, () => {
          const user = { id: 1, role };
          const hole = { status, createdById };
          expect(holeRights(user, hole).canEdit).toBe(serverAccepts(user, hole));
        });
      }
    }
  }
});
