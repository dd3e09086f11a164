import type { StakeMarkDto, StakeoutDto } from '@shared/api';
import { stakeMarkSchema, stakeoutQuerySchema } from '@shared/schemas/stakeout';
import type { AppConfig } from '../../config';
import { badRequest, notFound } from '../../errors';
import { ApiRouter, idOf, type RouteMeta } from '../../http/api-router';
import { logActivity } from '../activity/activity.service';
import { User } from '../users/user.entity';
import { StakeMark } from './stake-mark.entity';
import { currentStakePoints, presentStakeMark, stakeoutList } from './stakeout.service';

/** Stake-out: the points to stake, and marks of what has been staked. */
export function stakeoutRoutes(registry: RouteMeta[], config: AppConfig): ApiRouter {
  const api = new ApiRouter('/api/projects/:projectId/stakeout', registry, config);

  api.get('/', { access: 'project.read', query: stakeoutQuerySchema }, async ({ em, project, query }): Promise<StakeoutDto> => stakeoutList(em, project, query.boreId));

  api.post('/marks', { access: 'stakeout.write', body: stakeMarkSchema }, async ({ em, project, user, body, status }): Promise<StakeMarkDto> => {
    const point = (await currentStakePoints(em, project)).find((p) => p.key === body.key);
    if (!point) throw badRequest('That point is no longer on the stake-out list. Reload the list.', [{ path: 'key', message: 'is not a point on the current list' }]);
    const stakedAt = body.stakedAt ? new Date(body.stakedAt) : new Date();
    if (stakedAt.getTime() > Date.now() + 5 * 60_000) throw badRequest('The staking time is in the future.', [{ path: 'stakedAt', message: 'cannot be in the future' }]);
    return em.transactional(async (tem) => {
      const existing = await tem.findOne(StakeMark, { project, key: body.key }, { populate: ['stakedBy'] });
      const before = existing ? presentStakeMark(existing) : null;
      const mark = existing ?? new StakeMark(project, point.kind, body.key, { stakedAt, easting: point.easting, northing: point.northing, elevation: point.elevation });
      Object.assign(mark, { kind: point.kind, stakedAt, easting: point.easting, northing: point.northing, elevation: point.elevation, note: body.note ?? null });
      mark.stakedBy = tem.getReference(User, user.id);
      tem.persist(mark);
      await tem.flush();
      const dto = { ...presentStakeMark(mark), stakedById: user.id, stakedByName: user.name };
      logActivity(tem, { project, user, entity: 'stake_mark', entityId: mark.id, action: existing ? 'restake' : 'create', before, after: dto });
      await tem.flush();
      status(existing ? 200 : 201);
      return dto;
    });
  });

  api.delete('/marks/:markId', { access: 'stakeout.write' }, async ({ em, project, user, params }) => {
    const mark = await em.findOne(StakeMark, { id: idOf(params, 'markId', 'Stake mark'), project }, { populate: ['stakedBy'] });
    if (!mark) throw notFound('Stake mark');
    await em.transactional(async (tem) => {
      logActivity(tem, { project, user, entity: 'stake_mark', entityId: mark.id, action: 'delete', before: presentStakeMark(mark), after: null });
      tem.remove(tem.merge(mark));
      await tem.flush();
    });
  });

  return api;
}
