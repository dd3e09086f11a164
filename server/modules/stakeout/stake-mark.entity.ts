import { Entity, ManyToOne, Property, Unique, DateTimeType } from '@mikro-orm/core';
import { BaseEntity } from '../base.entity';
import { Project } from '../projects/project.entity';
import { User } from '../users/user.entity';

/**
 * A stake-out point marked staked: when, by whom, and where the point was when it was staked
 * (so the list can show a point that has moved since). One mark per point; staking again
 * replaces it.
 */
@Entity({ tableName: 'stake_marks' })
@Unique({ properties: ['project', 'key'] })
export class StakeMark extends BaseEntity {
  @ManyToOne({ entity: () => Project, deleteRule: 'cascade' })
  project: Project;

  /** crossing, suggested_hole or pit_corner. */
  @Property({ type: 'string', length: 20 })
  kind: string;

  /** The point's stable id, e.g. `crossing:<boreId>:<lineId>`. */
  @Property({ type: 'string', length: 120 })
  key: string;

  @Property({ type: DateTimeType })
  stakedAt: Date;

  @ManyToOne({ entity: () => User, nullable: true, deleteRule: 'set null' })
  stakedBy: User | null = null;

  @Property({ type: 'text', nullable: true })
  note: string | null = null;

  @Property({ type: 'double' })
  easting: number;

  @Property({ type: 'double' })
  northing: number;

  @Property({ type: 'double', nullable: true })
  elevation: number | null = null;

  constructor(project: Project, kind: string, key: string, at: { stakedAt: Date; easting: number; northing: number; elevation: number | null }) {
    super();
    this.project = project;
    this.kind = kind;
    this.key = key;
    this.stakedAt = at.stakedAt;
    this.easting = at.easting;
    this.northing = at.northing;
    this.elevation = at.elevation;
  }
}
