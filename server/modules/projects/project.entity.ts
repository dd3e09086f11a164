import { Entity, Enum, Property } from '@mikro-orm/core';
import { LINEAR_UNITS, STATION_STYLES, type LinearUnit, type StationStyle } from '@shared/domain';
import type { ProjectSettings } from '@shared/schemas/project';
import { VersionedEntity } from '../base.entity';

/** A project. Every length and elevation of its records is stored in `unit`. */
@Entity({ tableName: 'projects' })
export class Project extends VersionedEntity {
  @Property({ type: 'string', length: 160 })
  name: string;

  @Property({ type: 'string', length: 160 })
  client: string;

  @Property({ type: 'text', nullable: true })
  description: string | null = null;

  @Property({ type: 'string', length: 20 })
  crsCode: string;

  @Property({ type: 'text' })
  crsProj4: string;

  @Enum({ items: () => LINEAR_UNITS, type: 'string' })
  unit: LinearUnit;

  @Property({ type: 'string', length: 60 })
  verticalDatum: string;

  @Enum({ items: () => STATION_STYLES, type: 'string' })
  stationStyle: StationStyle;

  @Property({ type: 'json' })
  settings: ProjectSettings;

  constructor(init: {
    name: string;
    client: string;
    crsCode: string;
    crsProj4: string;
    unit: LinearUnit;
    verticalDatum: string;
    stationStyle: StationStyle;
    settings: ProjectSettings;
  }) {
    super();
    this.name = init.name;
    this.client = init.client;
    this.crsCode = init.crsCode;
    this.crsProj4 = init.crsProj4;
    this.unit = init.unit;
    this.verticalDatum = init.verticalDatum;
    this.stationStyle = init.stationStyle;
    this.settings = init.settings;
  }
}
