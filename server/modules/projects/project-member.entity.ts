import { Entity, ManyToOne, Unique } from '@mikro-orm/core';
import { BaseEntity } from '../base.entity';
import { User } from '../users/user.entity';
import { Project } from './project.entity';

/** A user's membership of a project; non-admins see only their projects. */
@Entity({ tableName: 'project_members' })
@Unique({ properties: ['project', 'user'] })
export class ProjectMember extends BaseEntity {
  @ManyToOne({ entity: () => Project, deleteRule: 'cascade' })
  project: Project;

  @ManyToOne({ entity: () => User, deleteRule: 'cascade' })
  user: User;

  constructor(project: Project, user: User) {
    super();
    this.project = project;
    this.user = user;
  }
}
