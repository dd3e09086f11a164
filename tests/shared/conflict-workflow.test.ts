/**
 * The register's status rules (shared/conflicts.ts), checked against the table written by hand
 * in README.md ("Conflict register, stake-out and mail"). Common practice: a waiver is the line
 * owner's written acceptance, recorded by the project manager; a closed item is reopened before
 * it is closed another way.
 */
import { describe, expect, it } from 'vitest';
import { allowedConflictMoves, conflictMoveProblem } from '@shared/conflicts';
import { CONFLICT_STATUSES, ROLES, type ConflictStatus, type Role } from '@shared/domain';

const CLOSED: ConflictStatus[] = ['resolved_redesign', 'resolved_relocation', 'waived', 'void'];

/** Expected moves by hand: from → role → targets. */
function expected(from: ConflictStatus, role: Role): ConflictStatus[] {
  if (!['admin', 'manager', 'designer'].includes(role)) return [];
  if (CLOSED.includes(from)) return ['open', 'in_review'];
  const base: ConflictStatus[] = from === 'open' ? ['in_review', 'resolved_redesign', 'resolved_relocation', 'void'] : ['open', 'resolved_redesign', 'resolved_relocation', 'void'];
  return role === 'designer' ? base : [...base, 'waived'];
}

describe('conflict status moves', () => {
  for (const role of ROLES) {
    for (const from of CONFLICT_STATUSES) {
      it(`${role} from ${from}`, () => {
        expect([...allowedConflictMoves(from, role)].sort()).toEqual(expected(from, role).sort());
      });
    }
  }

  it('explains a refusal: role problems and workflow problems apart', () => {
    expect(conflictMoveProblem('open', 'waived', 'designer')?.kind).toBe('role');
    expect(conflictMoveProblem('open', 'in_review', 'viewer')?.kind).toBe('role');
    expect(conflictMoveProblem('waived', 'void', 'manager')?.kind).toBe('workflow');
    expect(conflictMoveProblem('open', 'open', 'manager')?.message).toMatch(/already/);
    expect(conflictMoveProblem('in_review', 'waived', 'manager')).toBeNull();
  });
});
