import { Entity, Enum, ManyToOne, Property, DateTimeType, Unique } from '@mikro-orm/core';
import { BaseEntity } from '../base.entity';
import { User } from '../users/user.entity';
import { TestHole } from './test-hole.entity';

export const PHOTO_STATES = ['processing', 'ready', 'failed'] as const;
export type PhotoState = (typeof PHOTO_STATES)[number];
export const PHOTO_SOURCES = ['exif', 'device'] as const;
export type PhotoSource = (typeof PHOTO_SOURCES)[number];

/**
 * A photo of a test hole. Files live in storage under server-made keys, never client names:
 * `fileKey` is the file exactly as uploaded, `displayKey` its upright copy for viewing (EXIF
 * orientation applied to the pixels; the same key as `fileKey` when nothing needed changing) and
 * `thumbnailKey` the upright thumbnail. The last two are made just after the upload answers.
 */
@Entity({ tableName: 'photos' })
@Unique({ properties: ['hole', 'clientId'] })
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

  @Property({ type: DateTimeType, nullable: true })
  takenAt: Date | null = null;

  @Property({ type: 'double', nullable: true })
  gpsLat: number | null = null;

  @Property({ type: 'double', nullable: true })
  gpsLon: number | null = null;

  /** Where takenAt came from: the photo's EXIF, or the device (the form) when EXIF had none. */
  @Enum({ items: () => PHOTO_SOURCES, type: 'string', nullable: true })
  takenAtSource: PhotoSource | null = null;

  /** Where gpsLat/gpsLon came from. */
  @Enum({ items: () => PHOTO_SOURCES, type: 'string', nullable: true })
  gpsSource: PhotoSource | null = null;

  /** Horizontal accuracy of a device fix in metres, as the device reported it. */
  @Property({ type: 'double', nullable: true })
  gpsAccuracy: number | null = null;

  /** Upright copy for viewing; null until made (or for photos stored before it existed). */
  @Property({ type: 'string', length: 200, nullable: true })
  displayKey: string | null = null;

  @Enum({ items: () => PHOTO_STATES, type: 'string', default: 'ready' })
  state: PhotoState = 'ready';

  /**
   * Id the phone made when the photo was picked: a repeated upload with the same id on the same
   * hole answers this photo instead of storing a second one. Null for uploads sent without one.
   */
  @Property({ type: 'string', length: 36, nullable: true })
  clientId: string | null = null;

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
