import { Entity, ManyToOne, Property } from '@mikro-orm/core';
import { BaseEntity } from '../base.entity';
import { User } from '../users/user.entity';
import { Conflict } from './conflict.entity';

/** One entry of a conflict's history: found, worsened, cleared, status moved, comment. */
@Entity({ tableName: 'conflict_events' })
export class ConflictEvent extends BaseEntity {
  @ManyToOne({ entity: () => Conflict, deleteRule: 'cascade' })
  conflict: Conflict;

  @Property({ type: 'string', length: 40 })
  kind: string;

  @Property({ type: 'text', nullable: true })
  note: string | null = null;

  @Property({ type: 'json', nullable: true })
  data: Record<string, unknown> | null = null;

  /** Null when the clearance check wrote the event. */
  @ManyToOne({ entity: () => User, nullable: true, deleteRule: 'set null' })
  by: User | null = null;

  constructor(conflict: Conflict, kind: string, note: string | null, data: Record<string, unknown> | null, by: User | null) {
    super();
    this.conflict = conflict;
    this.kind = kind;
    this.note = note;
    this.data = data;
    this.by = by;
  }
}
