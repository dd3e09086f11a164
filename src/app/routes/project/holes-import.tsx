import { can } from '@shared/permissions';
import { ButtonLink } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/states';
import { useSignedInUser } from '@/features/auth/api/get-session';
import { SurveyImport } from '@/features/survey-import/components/survey-import';
import { useWorkspace } from './workspace-context';

/** Import as-surveyed shots onto the test holes from a point file (surveyors). */
export default function HolesImportPage() {
  const { project } = useWorkspace();
  const user = useSignedInUser();
  return (
    <div className="mx-auto max-w-5xl space-y-4">
      <div>
        <ButtonLink to=".." relative="path" variant="ghost" size="sm" className="-ml-3">
          ← Test holes
        </ButtonLink>
        <h2 className="text-lg font-semibold">Import survey shots</h2>
      </div>
      {can(user.role, 'hole.survey') ? (
        <SurveyImport project={project} />
      ) : (
        <EmptyState title="Survey imports are for the survey crew" action={<ButtonLink to=".." relative="path">Back to test holes</ButtonLink>}>
          <p>The surveyor imports as-surveyed shots onto the holes. Your role can read the results on each hole.</p>
        </EmptyState>
      )}
    </div>
  );
}
