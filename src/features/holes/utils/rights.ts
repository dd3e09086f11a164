import type { HoleDto, UserDto } from '@shared/api';
import { can } from '@shared/permissions';

/**
 * What a person may do to a test hole, as the server decides it (server/modules/holes/
 * holes.service.ts `assertCanEdit`): a reviewed hole is locked; a field crew changes only the
 * holes it logged. The screens use it to offer only what will be accepted.
 */
export function holeRights(user: Pick<UserDto, 'id' | 'role'>, hole: Pick<HoleDto, 'status' | 'createdById'>) {
  const locked = hole.status === 'reviewed';
  const own = user.role !== 'field' || hole.createdById === user.id;
  return {
    locked,
    own,
    canEdit: can(user.role, 'hole.update') && own && !locked,
    canDelete: can(user.role, 'hole.delete') && own && !locked,
    canSurvey: can(user.role, 'hole.survey') && !locked,
    canReview: can(user.role, 'hole.review'),
  };
}
