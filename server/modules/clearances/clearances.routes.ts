import type { AppConfig } from '../../config';
import { ApiRouter, type RouteMeta } from '../../http/api-router';
import type { ClearancesDto } from '@shared/api';
import { computeProjectReport, reportFrame } from './clearance.service';

/** The computed clearances of a project: per bore and per line, every figure, status and basis. */
export function clearanceRoutes(registry: RouteMeta[], config: AppConfig): ApiRouter {
  const api = new ApiRouter('/api/projects/:projectId/clearances', registry, config);

  api.get('/', { access: 'project.read' }, async ({ em, project }): Promise<ClearancesDto> => {
    const report = await computeProjectReport(em, project);
    return { ...reportFrame(project), report };
  });

  return api;
}
