import type { MemberDto, ProjectCounts, ProjectDto } from '@shared/api';
import type { ProjectMember } from './project-member.entity';
import type { Project } from './project.entity';

export function presentProject(p: Project, counts: ProjectCounts): ProjectDto {
  return {
    id: p.id,
    name: p.name,
    client: p.client,
    description: p.description,
    crsCode: p.crsCode,
    crsProj4: p.crsProj4,
    unit: p.unit,
    verticalDatum: p.verticalDatum,
    stationStyle: p.stationStyle,
    settings: p.settings,
    version: p.version,
    createdAt: p.createdAt.toISOString(),
    updatedAt: p.updatedAt.toISOString(),
    counts,
  };
}

export function presentMember(m: ProjectMember): MemberDto {
  return {
    userId: m.user.id,
    name: m.user.name,
    email: m.user.email,
    role: m.user.role,
    active: m.user.active,
    addedAt: m.createdAt.toISOString(),
  };
}
