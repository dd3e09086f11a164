import type { ClearanceRuleDto } from '@shared/api';
import { clearanceRuleSchema, clearanceRuleUpdateSchema } from '@shared/schemas/project';
import type { AppConfig } from '../../config';
import { conflict, notFound } from '../../errors';
import { createAudited, deleteAudited, updateAudited } from '../../http/audited';
import { ApiRouter, idOf, type RouteMeta } from '../../http/api-router';
import { recompute } from '../clearances/recompute-hook';
import { ClearanceRule } from './clearance-rule.entity';

export function presentRule(r: ClearanceRule): ClearanceRuleDto {
  return {
    id: r.id,
    projectId: r.project.id,
    kind: r.kind,
    vertical: r.vertical,
    horizontal: r.horizontal,
    source: r.source ?? null,
    version: r.version,
    createdAt: r.createdAt.toISOString(),
    updatedAt: r.updatedAt.toISOString(),
  };
}

/** Required clearances per line kind (the owner's value on a line overrides them). */
export function ruleRoutes(registry: RouteMeta[], config: AppConfig): ApiRouter {
  const api = new ApiRouter('/api/projects/:projectId/rules', registry, config);

  api.get('/', { access: 'project.read' }, async ({ em, project }): Promise<ClearanceRuleDto[]> =>
    (await em.find(ClearanceRule, { project }, { orderBy: { kind: 'asc' } })).map(presentRule),
  );

  api.post('/', { access: 'rule.write', body: clearanceRuleSchema }, async ({ em, project, user, body, status }) => {
    if ((await em.count(ClearanceRule, { project, kind: body.kind })) > 0) throw conflict(`There is already a rule for ${body.kind}; edit it instead.`);
    const dto = await createAudited(
      { em, project, user, entity: 'rule' , after: recompute(project, user) },
      () => Object.assign(new ClearanceRule(project, body.kind, body.vertical, body.horizontal), { source: body.source ?? null }),
      presentRule,
    );
    status(201);
    return dto;
  });

  api.patch('/:ruleId', { access: 'rule.write', body: clearanceRuleUpdateSchema }, async ({ em, project, user, params, body }) => {
    const rule = await em.findOne(ClearanceRule, { id: idOf(params, 'ruleId', 'Rule'), project });
    if (!rule) throw notFound('Rule');
    const { version, ...fields } = body;
    return updateAudited({ em, project, user, entity: 'rule' , after: recompute(project, user) }, rule, version, (r) => void Object.assign(r, fields), presentRule);
  });

  api.delete('/:ruleId', { access: 'rule.write' }, async ({ em, project, user, params }) => {
    const rule = await em.findOne(ClearanceRule, { id: idOf(params, 'ruleId', 'Rule'), project });
    if (!rule) throw notFound('Rule');
    await deleteAudited({ em, project, user, entity: 'rule' , after: recompute(project, user) }, rule, presentRule);
  });

  return api;
}
