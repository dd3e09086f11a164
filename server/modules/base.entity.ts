import { PrimaryKey, Property, DateTimeType } from '@mikro-orm/core';

/** Every table: an integer id and timestamps. */
export abstract class BaseEntity {
  @PrimaryKey({ type: 'integer' })
  id!: number;

  @Property({ type: DateTimeType })
  createdAt: Date = new Date();

  @Property({ type: DateTimeType, onUpdate: () => new Date() })
  updatedAt: Date = new Date();
}

/** Records two people may edit: a version column checked on every write (optimistic locking). */
export abstract class VersionedEntity extends BaseEntity {
  @Property({ type: 'integer', version: true })
  version: number = 1;
}
