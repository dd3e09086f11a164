import { Entity, Enum, Property, Unique } from '@mikro-orm/core';
import { ROLES, type Role } from '@shared/domain';
import { VersionedEntity } from '../base.entity';

@Entity({ tableName: 'users' })
export class User extends VersionedEntity {
  @Property({ type: 'string', length: 254 })
  @Unique()
  email: string;

  @Property({ type: 'string', length: 120 })
  name: string;

  @Property({ type: 'string', hidden: true, lazy: false })
  passwordHash: string;

  @Enum({ items: () => ROLES, type: 'string' })
  role: Role;

  @Property({ type: 'boolean' })
  active: boolean = true;

  constructor(email: string, name: string, role: Role, passwordHash: string) {
    super();
    this.email = email;
    this.name = name;
    this.role = role;
    this.passwordHash = passwordHash;
  }
}
