import type { EntityManager } from '@mikro-orm/sqlite';
import type { ConflictDto, ConflictEventDto } from '@shared/api';
import { conflictStatusSchema } from '@shared/schemas/conflict';
import type { AppConfig } from '../../config';
import { notFound } from '../../errors';
import { updateAudited } from '../../http/audited';
import { ApiRouter, idOf, type RouteMeta } from '../../http/api-router';
import type { Project } from '../projects/project.entity';
import { User } from '../users/user.entity';
import { presentConflict } from './conflict.presenter';
import { ConflictEvent } from './conflict-event.entity';
import { Conflict } from './conflict.entity';

const CLOSED = new Set(['resolved_redesign', 'resolved_relocation', 'waived', 'void']);

async function findConflict(em: EntityManager, project: Project, params: Record<string, string>): Promise<Conflict> {
  const conflict = await em.findOne(Conflict, { id: idOf(params, 'conflictId', 'Conflict'), project });
  if (!conflict) throw notFound('Conflict');
  return conflict;
}

/** The conflict register of a project: list, status moves with a reason, history. */
export function conflictRoutes(registry: RouteMeta[], config: AppConfig): ApiRouter {
  const api = new ApiRouter('/api/projects/:projectId/conflicts', registry, config);

  api.get('/', { access: 'project.read' }, async ({ em, project }): Promise<ConflictDto[]> =>
    (await em.find(Conflict, { project }, { orderBy: { id: 'asc' } })).map(presentConflict),
  );

  api.patch('/:conflictId/status', { access: 'conflict.status', body: conflictStatusSchema }, async ({ em, project, user, params, body }) => {
    const conflict = await findConflict(em, project, params);
    const from = conflict.status;
    return updateAudited(
      { em, project, user, entity: 'conflict' },
      conflict,
      body.version,
      (c, tem) => {
        c.status = body.status;
        c.statusSetByPerson = true;
        c.closedAt = CLOSED.has(body.status) ? (c.closedAt ?? new Date()) : null;
        tem.persist(new ConflictEvent(c, 'status', body.reason, { from, to: body.status }, tem.getReference(User, user.id)));
      },
      presentConflict,
      'status',
    );
  });

  api.get('/:conflictId/history', { access: 'project.read' }, async ({ em, project, params }): Promise<ConflictEventDto[]> => {
    const conflict = await findConflict(em, project, params);
    const events = await em.find(ConflictEvent, { conflict }, { populate: ['by'], orderBy: { createdAt: 'asc', id: 'asc' } });
    return events.map((e) => ({
      id: e.id,
      conflictId: conflict.id,
      kind: e.kind,
      note: e.note,
      data: e.data,
      byId: e.by?.id ?? null,
      byName: e.by?.name ?? null,
      at: e.createdAt.toISOString(),
    }));
  });

  return api;
}
