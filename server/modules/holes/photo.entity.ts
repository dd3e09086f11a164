import { Entity, ManyToOne, Property } from '@mikro-orm/core';
import { BaseEntity } from '../base.entity';
import { User } from '../users/user.entity';
import { TestHole } from './test-hole.entity';

/** A photo of a test hole. Files live in storage under server-made keys, never client names. */
@Entity({ tableName: 'photos' })
export class Photo extends BaseEntity {
  @ManyToOne({ entity: () => TestHole, deleteRule: 'cascade' })
  hole: TestHole;

  @Property({ type: 'string', length: 200 })
  fileKey: string;

  @Property({ type: 'string', length: 200 })
  thumbnailKey: string;

  @Property({ type: 'string', length: 40 })
  mimeType: string;

  @Property({ type: 'integer' })
  width: number;

  @Property({ type: 'integer' })
  height: number;

  @Property({ type: 'integer' })
  byteSize: number;

  @Property({ type: 'string', length: 300, nullable: true })
  caption: string | null = null;

  @Property({ type: 'datetime', nullable: true })
  takenAt: Date | null = null;

  @Property({ type: 'double', nullable: true })
  gpsLat: number | null = null;

  @Property({ type: 'double', nullable: true })
  gpsLon: number | null = null;

  @ManyToOne({ entity: () => User, nullable: true, deleteRule: 'set null' })
  uploadedBy: User | null = null;

  constructor(hole: TestHole, file: { fileKey: string; thumbnailKey: string; mimeType: string; width: number; height: number; byteSize: number }) {
    super();
    this.hole = hole;
    this.fileKey = file.fileKey;
    this.thumbnailKey = file.thumbnailKey;
    this.mimeType = file.mimeType;
    this.width = file.width;
    this.height = file.height;
    this.byteSize = file.byteSize;
  }
}
