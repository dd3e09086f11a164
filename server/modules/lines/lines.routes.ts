import type { LineDto } from '@shared/api';
import { lineCreateSchema, lineUpdateSchema } from '@shared/schemas/line';
import type { AppConfig } from '../../config';
import { notFound } from '../../errors';
import { createAudited, deleteAudited, updateAudited } from '../../http/audited';
import { ApiRouter, idOf, type RouteMeta } from '../../http/api-router';
import type { EntityManager } from '@mikro-orm/sqlite';
import { assertLineDeletable } from '../clearances/delete-guards';
import { recompute } from '../clearances/recompute-hook';
import { presentLine } from './line.presenter';
import { UtilityLine } from './utility-line.entity';

/** Existing buried lines of a project. */
export function lineRoutes(registry: RouteMeta[], config: AppConfig): ApiRouter {
  const api = new ApiRouter('/api/projects/:projectId/lines', registry, config);

  api.get('/', { access: 'project.read' }, async ({ em, project }): Promise<LineDto[]> =>
    (await em.find(UtilityLine, { project }, { orderBy: { label: 'asc' } })).map(presentLine),
  );

  api.post('/', { access: 'line.write', body: lineCreateSchema }, async ({ em, project, user, body, status }) => {
    const dto = await createAudited(
      { em, project, user, entity: 'line' , after: recompute(project, user) },
      () => Object.assign(new UtilityLine(project, body.label, body.owner, body.kind, body.path), body, { contactEmail: body.contactEmail || null }),
      presentLine,
    );
    status(201);
    return dto;
  });

  api.get('/:lineId', { access: 'project.read' }, async ({ em, project, params }) => {
    const line = await em.findOne(UtilityLine, { id: idOf(params, 'lineId', 'Line'), project });
    if (!line) throw notFound('Line');
    return presentLine(line);
  });

  api.patch('/:lineId', { access: 'line.write', body: lineUpdateSchema }, async ({ em, project, user, params, body }) => {
    const line = await em.findOne(UtilityLine, { id: idOf(params, 'lineId', 'Line'), project });
    if (!line) throw notFound('Line');
    const { version, ...fields } = body;
    return updateAudited(
      { em, project, user, entity: 'line' , after: recompute(project, user) },
      line,
      version,
      (l) => {
        Object.assign(l, fields);
        if (fields.contactEmail !== undefined) l.contactEmail = fields.contactEmail || null;
      },
      presentLine,
    );
  });

  api.delete('/:lineId', { access: 'line.write' }, async ({ em, project, user, params }) => {
    const line = await em.findOne(UtilityLine, { id: idOf(params, 'lineId', 'Line'), project });
    if (!line) throw notFound('Line');
    const guard = (tem: EntityManager) => assertLineDeletable(tem, line.id);
    await deleteAudited({ em, project, user, entity: 'line', guard, after: recompute(project, user) }, line, presentLine);
  });

  return api;
}
