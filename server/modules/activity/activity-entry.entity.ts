import { Entity, Index, ManyToOne, Property } from '@mikro-orm/core';
import { BaseEntity } from '../base.entity';
import { Project } from '../projects/project.entity';
import { User } from '../users/user.entity';

export type Changes = Record<string, { before: unknown; after: unknown }>;

/** Who changed what and when, with before and after values: written on every write. */
@Entity({ tableName: 'activity_entries' })
@Index({ properties: ['project', 'createdAt'] })
export class ActivityEntry extends BaseEntity {
  @ManyToOne({ entity: () => Project, nullable: true, deleteRule: 'cascade' })
  project: Project | null;

  @ManyToOne({ entity: () => User, nullable: true, deleteRule: 'set null' })
  user: User | null;

  @Property({ type: 'string', length: 40 })
  entity: string;

  @Property({ type: 'integer', nullable: true })
  entityId: number | null;

  @Property({ type: 'string', length: 40 })
  action: string;

  @Property({ type: 'json' })
  changes: Changes;

  constructor(init: { project: Project | null; user: User | null; entity: string; entityId: number | null; action: string; changes: Changes }) {
    super();
    this.project = init.project;
    this.user = init.user;
    this.entity = init.entity;
    this.entityId = init.entityId;
    this.action = init.action;
    this.changes = init.changes;
  }
}
