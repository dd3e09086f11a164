import type { BoreDto, PitDto } from '@shared/api';
import { boreCreateSchema, boreUpdateSchema, pitCreateSchema, pitUpdateSchema } from '@shared/schemas/bore';
import type { AppConfig } from '../../config';
import { badRequest, notFound } from '../../errors';
import { createAudited, deleteAudited, updateAudited } from '../../http/audited';
import { ApiRouter, idOf, type RouteMeta } from '../../http/api-router';
import { assertBoreDeletable } from '../clearances/delete-guards';
import { recompute } from '../clearances/recompute-hook';
import type { EntityManager } from '@mikro-orm/sqlite';
import type { Project } from '../projects/project.entity';
import { presentBore, presentPit } from './bore.presenter';
import { Bore } from './bore.entity';
import { Pit } from './pit.entity';

async function findBore(em: EntityManager, project: Project, id: number): Promise<Bore> {
  const bore = await em.findOne(Bore, { id, project });
  if (!bore) throw notFound('Bore');
  return bore;
}

/** Bores (alignment, profiles, casing, tolerances) and their pits. */
export function boreRoutes(registry: RouteMeta[], config: AppConfig): ApiRouter {
  const api = new ApiRouter('/api/projects/:projectId', registry, config);

  api.get('/bores', { access: 'project.read' }, async ({ em, project }): Promise<BoreDto[]> =>
    (await em.find(Bore, { project }, { orderBy: { name: 'asc' } })).map(presentBore),
  );

  api.post('/bores', { access: 'bore.write', body: boreCreateSchema }, async ({ em, project, user, body, status }) => {
    const dto = await createAudited({ em, project, user, entity: 'bore' , after: recompute(project, user) }, () => Object.assign(new Bore(project, body), body), presentBore);
    status(201);
    return dto;
  });

  api.get('/bores/:boreId', { access: 'project.read' }, async ({ em, project, params }) =>
    presentBore(await findBore(em, project, idOf(params, 'boreId', 'Bore'))),
  );

  api.patch('/bores/:boreId', { access: 'bore.write', body: boreUpdateSchema }, async ({ em, project, user, params, body }) => {
    const bore = await findBore(em, project, idOf(params, 'boreId', 'Bore'));
    const { version, ...fields } = body;
    return updateAudited({ em, project, user, entity: 'bore' , after: recompute(project, user) }, bore, version, (b) => void Object.assign(b, fields), presentBore);
  });

  api.delete('/bores/:boreId', { access: 'bore.write' }, async ({ em, project, user, params }) => {
    const bore = await findBore(em, project, idOf(params, 'boreId', 'Bore'));
    const guard = (tem: EntityManager) => assertBoreDeletable(tem, bore.id);
    await deleteAudited({ em, project, user, entity: 'bore', guard, after: recompute(project, user) }, bore, presentBore);
  });

  api.get('/pits', { access: 'project.read' }, async ({ em, project }): Promise<PitDto[]> =>
    (await em.find(Pit, { bore: { project } }, { orderBy: { id: 'asc' } })).map(presentPit),
  );

  api.post('/pits', { access: 'pit.write', body: pitCreateSchema }, async ({ em, project, user, body, status }) => {
    const bore = await em.findOne(Bore, { id: body.boreId, project });
    if (!bore) throw badRequest('The bore is not in this project.', [{ path: 'boreId', message: 'no such bore in this project' }]);
    const { boreId: _boreId, ...fields } = body;
    const dto = await createAudited(
      { em, project, user, entity: 'pit' , after: recompute(project, user) },
      () => Object.assign(new Pit(bore, body.kind, body.footprint, body.bottomElevation), { notes: fields.notes ?? null }),
      presentPit,
    );
    status(201);
    return dto;
  });

  api.patch('/pits/:pitId', { access: 'pit.write', body: pitUpdateSchema }, async ({ em, project, user, params, body }) => {
    const pit = await em.findOne(Pit, { id: idOf(params, 'pitId', 'Pit'), bore: { project } });
    if (!pit) throw notFound('Pit');
    const { version, ...fields } = body;
    return updateAudited({ em, project, user, entity: 'pit' , after: recompute(project, user) }, pit, version, (p) => void Object.assign(p, fields), presentPit);
  });

  api.delete('/pits/:pitId', { access: 'pit.write' }, async ({ em, project, user, params }) => {
    const pit = await em.findOne(Pit, { id: idOf(params, 'pitId', 'Pit'), bore: { project } });
    if (!pit) throw notFound('Pit');
    await deleteAudited({ em, project, user, entity: 'pit' , after: recompute(project, user) }, pit, presentPit);
  });

  return api;
}
