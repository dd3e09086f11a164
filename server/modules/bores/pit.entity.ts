import { Entity, Enum, ManyToOne, Property } from '@mikro-orm/core';
import { PIT_KINDS, type PitKind } from '@shared/domain';
import type { GridPoint } from '@shared/schemas/common';
import { VersionedEntity } from '../base.entity';
import { Bore } from './bore.entity';

/** A launch or receiving pit of a bore. */
@Entity({ tableName: 'pits' })
export class Pit extends VersionedEntity {
  @ManyToOne({ entity: () => Bore, deleteRule: 'cascade' })
  bore: Bore;

  @Enum({ items: () => PIT_KINDS, type: 'string' })
  kind: PitKind;

  /** Plan footprint ring of grid [E, N] corners (closure implied). */
  @Property({ type: 'json' })
  footprint: GridPoint[];

  @Property({ type: 'double' })
  bottomElevation: number;

  @Property({ type: 'text', nullable: true })
  notes: string | null = null;

  constructor(bore: Bore, kind: PitKind, footprint: GridPoint[], bottomElevation: number) {
    super();
    this.bore = bore;
    this.kind = kind;
    this.footprint = footprint;
    this.bottomElevation = bottomElevation;
  }
}
