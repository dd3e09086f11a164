import type { ActivityDto, MemberDto, Page, ProjectDto } from '@shared/api';
import { defaultProjectSettings } from '@shared/defaults';
import { memberAddSchema, projectCreateSchema, projectUpdateSchema } from '@shared/schemas/project';
import { z } from 'zod';
import type { AppConfig } from '../../config';
import { conflict, notFound } from '../../errors';
import { createAudited, deleteAudited, updateAudited } from '../../http/audited';
import { ApiRouter, idOf, type RouteMeta } from '../../http/api-router';
import { recompute } from '../clearances/recompute-hook';
import { ActivityEntry } from '../activity/activity-entry.entity';
import { User } from '../users/user.entity';
import { assertCrsUnit, assertValidCrs } from './crs-check';
import { projectCounts } from './project-counts';
import { ProjectMember } from './project-member.entity';
import { presentMember, presentProject } from './project.presenter';
import { Project } from './project.entity';

const activityQuery = z.object({
  limit: z.coerce.number().int().min(1).max(500).default(50),
  offset: z.coerce.number().int().min(0).default(0),
});

/** Projects, their members and their activity log. */
export function projectRoutes(registry: RouteMeta[], config: AppConfig): ApiRouter {
  const api = new ApiRouter('/api/projects', registry, config);

  api.get('/', { access: 'project.read' }, async ({ em, user }): Promise<ProjectDto[]> => {
    const projects =
      user.role === 'admin'
        ? await em.find(Project, {}, { orderBy: { name: 'asc' } })
        : (await em.find(ProjectMember, { user }, { populate: ['project'], orderBy: { project: { name: 'asc' } } })).map((m) => m.project);
    const counts = await projectCounts(em, projects.map((p) => p.id));
    return projects.map((p) => presentProject(p, counts.get(p.id)!));
  });

  api.post('/', { access: 'project.create', body: projectCreateSchema }, async ({ em, body, user, status }) => {
    assertValidCrs(body.crsProj4);
    assertCrsUnit(body.crsCode, body.crsProj4, body.unit);
    const dto = await createAudited(
      { em, project: null, user, entity: 'project' },
      (tem) => {
        const project = new Project({ ...body, settings: body.settings ?? defaultProjectSettings(body.unit) });
        project.description = body.description ?? null;
        tem.persist(new ProjectMember(project, tem.getReference(User, user.id)));
        return project;
      },
      (p) => presentProject(p, { lines: 0, holes: 0, openConflicts: 0, bores: 0 }),
    );
    status(201);
    return dto;
  });

  api.get('/:projectId', { access: 'project.read' }, async ({ em, project }): Promise<ProjectDto> => {
    const counts = await projectCounts(em, [project.id]);
    return presentProject(project, counts.get(project.id)!);
  });

  api.patch('/:projectId', { access: 'project.update', body: projectUpdateSchema }, async ({ em, project, body, user }) => {
    if (body.crsProj4 !== undefined) assertValidCrs(body.crsProj4);
    if (body.crsProj4 !== undefined || body.crsCode !== undefined) assertCrsUnit(body.crsCode ?? project.crsCode, body.crsProj4 ?? project.crsProj4, project.unit);
    const counts = (await projectCounts(em, [project.id])).get(project.id)!;
    const { version, ...fields } = body;
    return updateAudited(
      { em, project, user, entity: 'project', after: recompute(project, user) },
      project,
      version,
      (p) => {
        Object.assign(p, fields);
        if (fields.description !== undefined) p.description = fields.description ?? null;
      },
      (p) => presentProject(p, counts),
    );
  });

  api.delete('/:projectId', { access: 'project.delete' }, async ({ em, project, user }) => {
    await deleteAudited({ em, project: null, user, entity: 'project' }, project, (p) => presentProject(p, { lines: 0, holes: 0, openConflicts: 0, bores: 0 }));
  });

  api.get('/:projectId/members', { access: 'project.read' }, async ({ em, project }): Promise<MemberDto[]> => {
    const members = await em.find(ProjectMember, { project }, { populate: ['user'], orderBy: { user: { name: 'asc' } } });
    return members.map(presentMember);
  });

  api.post('/:projectId/members', { access: 'member.manage', body: memberAddSchema }, async ({ em, project, body, user, status }) => {
    const member = await em.findOne(User, body.userId);
    if (!member) throw notFound('User');
    if ((await em.count(ProjectMember, { project, user: member })) > 0) throw conflict(`${member.name} is already a member.`);
    const dto = await createAudited({ em, project, user, entity: 'member' }, () => new ProjectMember(project, member), presentMember);
    status(201);
    return dto;
  });

  api.delete('/:projectId/members/:userId', { access: 'member.manage' }, async ({ em, project, params, user }) => {
    const membership = await em.findOne(ProjectMember, { project, user: idOf(params, 'userId', 'Member') }, { populate: ['user'] });
    if (!membership) throw notFound('Member');
    await deleteAudited({ em, project, user, entity: 'member' }, membership, presentMember);
  });

  api.get('/:projectId/activity', { access: 'project.read', query: activityQuery }, async ({ em, project, query }): Promise<Page<ActivityDto>> => {
    const [items, total] = await em.findAndCount(
      ActivityEntry,
      { project },
      { populate: ['user'], orderBy: { createdAt: 'desc', id: 'desc' }, limit: query.limit, offset: query.offset },
    );
    return {
      total,
      items: items.map((a) => ({
        id: a.id,
        projectId: project.id,
        userId: a.user?.id ?? null,
        userName: a.user?.name ?? null,
        entity: a.entity,
        entityId: a.entityId,
        action: a.action,
        changes: a.changes,
        at: a.createdAt.toISOString(),
      })),
    };
  });

  return api;
}
