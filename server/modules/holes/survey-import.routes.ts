import type { SurveyImportResultDto } from '@shared/api';
import { surveyImportSchema } from '@shared/schemas/survey-import';
import type { ApiRouter } from '../../http/api-router';
import { commitSurveyImport, previewSurveyImport } from './survey-import.service';

/**
 * The surveyor's point file (CSV: point, northing, easting, elevation, description) matched to
 * test holes: a preview that writes nothing, then an all-or-nothing commit.
 */
export function addSurveyImportRoutes(api: ApiRouter): void {
  api.post('/survey-imports/preview', { access: 'hole.survey', body: surveyImportSchema }, async ({ em, project, body }): Promise<SurveyImportResultDto> =>
    previewSurveyImport(em, project, body.csv),
  );

  api.post('/survey-imports/commit', { access: 'hole.survey', body: surveyImportSchema }, async ({ em, project, user, body }): Promise<SurveyImportResultDto> =>
    commitSurveyImport(em, project, user, body.csv, body.fileName),
  );
}
