import { Entity, Enum, ManyToOne, Property } from '@mikro-orm/core';
import { BORE_METHODS, type BoreMethod } from '@shared/domain';
import type { GridPoint, ProfilePoint } from '@shared/schemas/common';
import { VersionedEntity } from '../base.entity';
import { Project } from '../projects/project.entity';

/** A proposed bore: plan alignment, casing profile and ground profile, in the project's unit. */
@Entity({ tableName: 'bores' })
export class Bore extends VersionedEntity {
  @ManyToOne({ entity: () => Project, deleteRule: 'cascade' })
  project: Project;

  @Property({ type: 'string', length: 120 })
  name: string;

  @Enum({ items: () => BORE_METHODS, type: 'string' })
  method: BoreMethod;

  /** Plan polyline of grid [E, N] vertices, at least two. */
  @Property({ type: 'json' })
  alignment: GridPoint[];

  @Property({ type: 'double' })
  beginStation: number;

  /** Casing centreline elevations; straight grades between points. */
  @Property({ type: 'json' })
  profile: ProfilePoint[];

  @Property({ type: 'json' })
  groundProfile: ProfilePoint[] = [];

  /** Casing (or reamed hole) outside diameter. */
  @Property({ type: 'double' })
  casingOd: number;

  @Property({ type: 'double', nullable: true })
  carrierSize: number | null = null;

  @Property({ type: 'double' })
  toleranceHorizontal: number = 0;

  @Property({ type: 'double' })
  toleranceVertical: number = 0;

  @Property({ type: 'double' })
  minCover: number = 0;

  @Property({ type: 'text', nullable: true })
  notes: string | null = null;

  constructor(project: Project, init: { name: string; method: BoreMethod; alignment: GridPoint[]; beginStation: number; profile: ProfilePoint[]; casingOd: number }) {
    super();
    this.project = project;
    this.name = init.name;
    this.method = init.method;
    this.alignment = init.alignment;
    this.beginStation = init.beginStation;
    this.profile = init.profile;
    this.casingOd = init.casingOd;
  }
}
