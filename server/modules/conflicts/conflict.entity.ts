import { Entity, Enum, ManyToOne, Property, Unique, DateTimeType } from '@mikro-orm/core';
import { CLEARANCE_STATUSES, CONFLICT_STATUSES, type ClearanceStatus, type ConflictStatus } from '@shared/domain';
import { VersionedEntity } from '../base.entity';
import { Bore } from '../bores/bore.entity';
import { UtilityLine } from '../lines/utility-line.entity';
import { Project } from '../projects/project.entity';
import { User } from '../users/user.entity';

/**
 * A line that fails its requirement against a bore (or its pits), tracked to resolution.
 * `computedStatus` and `figures` come from the last clearance check; `status` is the people's.
 */
@Entity({ tableName: 'conflicts' })
@Unique({ properties: ['bore', 'line'] })
export class Conflict extends VersionedEntity {
  @ManyToOne({ entity: () => Project, deleteRule: 'cascade' })
  project: Project;

  @ManyToOne({ entity: () => Bore, deleteRule: 'cascade' })
  bore: Bore;

  @ManyToOne({ entity: () => UtilityLine, deleteRule: 'cascade' })
  line: UtilityLine;

  @Enum({ items: () => CLEARANCE_STATUSES, type: 'string' })
  computedStatus: ClearanceStatus;

  @Property({ type: 'json' })
  figures: Record<string, unknown> = {};

  @Property({ type: DateTimeType })
  checkedAt: Date = new Date();

  @Enum({ items: () => CONFLICT_STATUSES, type: 'string' })
  status: ConflictStatus = 'open';

  /** True once a person has set the status; the engine then never overwrites it. */
  @Property({ type: 'boolean' })
  statusSetByPerson: boolean = false;

  @ManyToOne({ entity: () => User, nullable: true, deleteRule: 'set null' })
  assignee: User | null = null;

  @Property({ type: DateTimeType, nullable: true })
  dueDate: Date | null = null;

  @Property({ type: 'text', nullable: true })
  resolutionNote: string | null = null;

  @Property({ type: 'string', length: 160, nullable: true })
  responsibleParty: string | null = null;

  @Property({ type: DateTimeType, nullable: true })
  ownerNotifiedAt: Date | null = null;

  @Property({ type: DateTimeType, nullable: true })
  answerDueAt: Date | null = null;

  @Property({ type: DateTimeType, nullable: true })
  closedAt: Date | null = null;

  @Property({ type: 'text', nullable: true })
  notes: string | null = null;

  constructor(project: Project, bore: Bore, line: UtilityLine, computedStatus: ClearanceStatus) {
    super();
    this.project = project;
    this.bore = bore;
    this.line = line;
    this.computedStatus = computedStatus;
  }
}
