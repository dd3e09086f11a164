import type { LineImportPreviewDto, LineImportResultDto } from '@shared/api';
import { lineImportSchema } from '@shared/schemas/line-import';
import type { AppConfig } from '../../config';
import { ApiRouter, type RouteMeta } from '../../http/api-router';
import { analyseImport, commitImport } from './line-import.service';

/**
 * Imports of existing lines from GeoJSON, DXF and CSV point files (access `line.write`):
 * a preview that writes nothing, and a commit that writes every line or none.
 */
export function importRoutes(registry: RouteMeta[], config: AppConfig): ApiRouter {
  const api = new ApiRouter('/api/projects/:projectId/imports', registry, config);

  api.post('/lines/preview', { access: 'line.write', body: lineImportSchema }, async ({ em, project, body }): Promise<LineImportPreviewDto> =>
    (await analyseImport(em, project, body, false)).preview,
  );

  api.post('/lines/commit', { access: 'line.write', body: lineImportSchema }, async ({ em, project, user, body, status }): Promise<LineImportResultDto> => {
    const result = await commitImport(em, project, user, body);
    status(201);
    return result;
  });

  return api;
}
