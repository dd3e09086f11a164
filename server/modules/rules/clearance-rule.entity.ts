import { Entity, Enum, ManyToOne, Property, Unique } from '@mikro-orm/core';
import { LINE_KINDS, type LineKind } from '@shared/domain';
import { VersionedEntity } from '../base.entity';
import { Project } from '../projects/project.entity';

/** The project's required clearance for a kind of line, in the project's unit. */
@Entity({ tableName: 'clearance_rules' })
@Unique({ properties: ['project', 'kind'] })
export class ClearanceRule extends VersionedEntity {
  @ManyToOne({ entity: () => Project, deleteRule: 'cascade' })
  project: Project;

  @Enum({ items: () => LINE_KINDS, type: 'string' })
  kind: LineKind;

  @Property({ type: 'double' })
  vertical: number;

  @Property({ type: 'double' })
  horizontal: number;

  /** Where the value comes from (standard, owner letter, common practice). */
  @Property({ type: 'string', length: 300, nullable: true })
  source: string | null = null;

  constructor(project: Project, kind: LineKind, vertical: number, horizontal: number) {
    super();
    this.project = project;
    this.kind = kind;
    this.vertical = vertical;
    this.horizontal = horizontal;
  }
}
