import type { ConflictDto } from '@shared/api';
import type { AppConfig } from '../../config';
import { ApiRouter, type RouteMeta } from '../../http/api-router';
import { presentConflict } from './conflict.presenter';
import { Conflict } from './conflict.entity';

/** The conflict register of a project. */
export function conflictRoutes(registry: RouteMeta[], config: AppConfig): ApiRouter {
  const api = new ApiRouter('/api/projects/:projectId/conflicts', registry, config);

  api.get('/', { access: 'project.read' }, async ({ em, project }): Promise<ConflictDto[]> =>
    (await em.find(Conflict, { project }, { orderBy: { id: 'asc' } })).map(presentConflict),
  );

  return api;
}
