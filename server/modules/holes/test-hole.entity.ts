import { Entity, Enum, Index, ManyToOne, Property, Unique, DateTimeType } from '@mikro-orm/core';
import {
  DEPTH_REFERENCES,
  EXCAVATION_METHODS,
  HOLE_STATUSES,
  POSITION_SOURCES,
  SIDES,
  type DepthReference,
  type ExcavationMethod,
  type HoleStatus,
  type PositionSource,
  type Side,
} from '@shared/domain';
import { VersionedEntity } from '../base.entity';
import { Bore } from '../bores/bore.entity';
import { UtilityLine } from '../lines/utility-line.entity';
import { Project } from '../projects/project.entity';
import { User } from '../users/user.entity';

/**
 * A test hole's record of one exposed line. One excavation exposing several lines gives several
 * records sharing the excavation's number and position, so the number is unique per line.
 */
@Entity({ tableName: 'test_holes' })
@Unique({ properties: ['project', 'number', 'line'] })
@Index({ properties: ['project', 'status'] })
export class TestHole extends VersionedEntity {
  @ManyToOne({ entity: () => Project, deleteRule: 'cascade' })
  project: Project;

  /** Client-made id: a retried create answers with the record it already made. */
  @Property({ type: 'string', length: 36 })
  @Unique()
  clientId: string;

  @Property({ type: 'string', length: 40 })
  number: string;

  @ManyToOne({ entity: () => UtilityLine, deleteRule: 'cascade' })
  line: UtilityLine;

  @Enum({ items: () => HOLE_STATUSES, type: 'string' })
  status: HoleStatus = 'planned';

  @Enum({ items: () => POSITION_SOURCES, type: 'string' })
  positionSource: PositionSource = 'grid';

  @Property({ type: 'double' })
  easting: number;

  @Property({ type: 'double' })
  northing: number;

  /** Phone GPS positions are approximate and never count as surveyed. */
  @Property({ type: 'boolean' })
  approximate: boolean = false;

  @ManyToOne({ entity: () => Bore, nullable: true, deleteRule: 'set null' })
  bore: Bore | null = null;

  @Property({ type: 'double', nullable: true })
  station: number | null = null;

  @Property({ type: 'double', nullable: true })
  offset: number | null = null;

  @Enum({ items: () => SIDES, type: 'string', nullable: true })
  offsetSide: Side | null = null;

  @Property({ type: 'double', nullable: true })
  gpsAccuracy: number | null = null;

  @Property({ type: 'double', nullable: true })
  groundElevation: number | null = null;

  @Property({ type: 'double', nullable: true })
  depthToTop: number | null = null;

  /** What the depth was measured to on the line. */
  @Enum({ items: () => DEPTH_REFERENCES, type: 'string' })
  depthReference: DepthReference = 'top';

  @Property({ type: 'double', nullable: true })
  measuredSize: number | null = null;

  @Property({ type: 'double', nullable: true })
  boxWidth: number | null = null;

  @Property({ type: 'double', nullable: true })
  boxHeight: number | null = null;

  @Property({ type: 'double', nullable: true })
  depthToBottom: number | null = null;

  @Property({ type: 'string', length: 80, nullable: true })
  material: string | null = null;

  @Property({ type: 'string', length: 200, nullable: true })
  condition: string | null = null;

  @Property({ type: 'string', length: 80, nullable: true })
  direction: string | null = null;

  @Enum({ items: () => EXCAVATION_METHODS, type: 'string', nullable: true })
  method: ExcavationMethod | null = null;

  @Property({ type: 'string', length: 40, nullable: true })
  ticketNumber: string | null = null;

  @Property({ type: 'string', length: 80, nullable: true })
  surfaceType: string | null = null;

  @Property({ type: 'boolean', nullable: true })
  markerSet: boolean | null = null;

  @Property({ type: 'string', length: 120, nullable: true })
  crew: string | null = null;

  @Property({ type: DateTimeType, nullable: true })
  dugAt: Date | null = null;

  @Property({ type: 'double', nullable: true })
  surveyedEasting: number | null = null;

  @Property({ type: 'double', nullable: true })
  surveyedNorthing: number | null = null;

  @Property({ type: 'double', nullable: true })
  surveyedTopElevation: number | null = null;

  @Property({ type: 'double', nullable: true })
  surveyedGroundElevation: number | null = null;

  /** The designer's reason when a hole is sent back or reopened. */
  @Property({ type: 'text', nullable: true })
  reviewNote: string | null = null;

  @Property({ type: 'text', nullable: true })
  notes: string | null = null;

  /** Soil seen in the excavation (test-hole sheet, SPEC §8). */
  @Property({ type: 'string', length: 200, nullable: true })
  soil: string | null = null;

  /** Groundwater seen, or "none". */
  @Property({ type: 'string', length: 200, nullable: true })
  groundwater: string | null = null;

  /** How the hole was backfilled and the surface restored. */
  @Property({ type: 'string', length: 200, nullable: true })
  restoration: string | null = null;

  @ManyToOne({ entity: () => User, nullable: true, deleteRule: 'set null' })
  createdBy: User | null = null;

  constructor(project: Project, line: UtilityLine, clientId: string, number: string, easting: number, northing: number) {
    super();
    this.project = project;
    this.line = line;
    this.clientId = clientId;
    this.number = number;
    this.easting = easting;
    this.northing = northing;
  }
}
