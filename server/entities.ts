import { ActivityEntry } from './modules/activity/activity-entry.entity';
import { Bore } from './modules/bores/bore.entity';
import { Pit } from './modules/bores/pit.entity';
import { ConflictEvent } from './modules/conflicts/conflict-event.entity';
import { Conflict } from './modules/conflicts/conflict.entity';
import { Photo } from './modules/holes/photo.entity';
import { TestHole } from './modules/holes/test-hole.entity';
import { UtilityLine } from './modules/lines/utility-line.entity';
import { OutboxMessage } from './modules/mail/outbox-message.entity';
import { ProjectMember } from './modules/projects/project-member.entity';
import { Project } from './modules/projects/project.entity';
import { ClearanceRule } from './modules/rules/clearance-rule.entity';
import { StakeMark } from './modules/stakeout/stake-mark.entity';
import { User } from './modules/users/user.entity';

/**
 * Every entity, listed (not globbed): MikroORM's glob discovery imports files outside Vite,
 * which fails under vitest (see DEVELOPERS.md).
 */
export const ENTITIES = [
  User,
  Project,
  ProjectMember,
  Bore,
  Pit,
  UtilityLine,
  TestHole,
  Photo,
  ClearanceRule,
  Conflict,
  ConflictEvent,
  ActivityEntry,
  OutboxMessage,
  StakeMark,
];

export { ActivityEntry, Bore, ClearanceRule, Conflict, ConflictEvent, Photo, Pit, Project, ProjectMember, TestHole, User, UtilityLine };
export { OutboxMessage, StakeMark };
