import { Entity, Enum, ManyToOne, Property } from '@mikro-orm/core';
import {
  LINE_KINDS,
  LINE_SHAPES,
  LINE_STATUSES,
  QUALITY_LEVELS,
  type LineKind,
  type LineShape,
  type LineStatus,
  type QualityLevel,
} from '@shared/domain';
import type { GridPoint } from '@shared/schemas/common';
import { VersionedEntity } from '../base.entity';
import { Project } from '../projects/project.entity';

/** An existing buried line as far as it is known: records, marks and test holes. */
@Entity({ tableName: 'utility_lines' })
export class UtilityLine extends VersionedEntity {
  @ManyToOne({ entity: () => Project, deleteRule: 'cascade' })
  project: Project;

  @Property({ type: 'string', length: 120 })
  label: string;

  @Property({ type: 'string', length: 160 })
  owner: string;

  @Enum({ items: () => LINE_KINDS, type: 'string' })
  kind: LineKind;

  @Enum({ items: () => LINE_SHAPES, type: 'string' })
  shape: LineShape = 'round';

  @Property({ type: 'double', nullable: true })
  diameter: number | null = null;

  @Property({ type: 'double', nullable: true })
  width: number | null = null;

  @Property({ type: 'double', nullable: true })
  height: number | null = null;

  @Property({ type: 'string', length: 80, nullable: true })
  material: string | null = null;

  @Enum({ items: () => LINE_STATUSES, type: 'string' })
  status: LineStatus = 'active';

  @Enum({ items: () => QUALITY_LEVELS, type: 'string' })
  qualityLevel: QualityLevel = 'D';

  @Property({ type: 'json' })
  path: GridPoint[];

  @Property({ type: 'double' })
  recordDepth: number = 0;

  @Property({ type: 'double', nullable: true })
  requiredVertical: number | null = null;

  @Property({ type: 'double', nullable: true })
  requiredHorizontal: number | null = null;

  @Property({ type: 'string', length: 254, nullable: true })
  contactEmail: string | null = null;

  @Property({ type: 'text', nullable: true })
  notes: string | null = null;

  constructor(project: Project, label: string, owner: string, kind: LineKind, path: GridPoint[]) {
    super();
    this.project = project;
    this.label = label;
    this.owner = owner;
    this.kind = kind;
    this.path = path;
  }
}
