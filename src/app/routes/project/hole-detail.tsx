import { useState } from 'react';
import { useLocation, useNavigate, useParams } from 'react-router-dom';
import type { HoleDto, PhotoDto } from '@shared/api';
import { can } from '@shared/permissions';
import { Alert, ProblemAlert } from '@/components/ui/alert';
import { Button, ButtonLink, buttonClasses } from '@/components/ui/button';
import { EmptyState, Loading, Panel } from '@/components/ui/states';
import { useSignedInUser } from '@/features/auth/api/get-session';
import { useBores } from '@/features/bores/api/get-bores';
import { useDeleteHole } from '@/features/holes/api/delete-hole';
import { useHole } from '@/features/holes/api/get-hole';
import { useHoleActivity } from '@/features/holes/api/get-hole-activity';
import { useHolePhotos } from '@/features/holes/api/get-hole-photos';
import { HoleActivity } from '@/features/holes/components/hole-activity';
import { HoleFacts } from '@/features/holes/components/hole-facts';
import { HoleStatusBadge, HoleStatusSteps, LockIcon } from '@/features/holes/components/hole-status';
import { PhotoGallery } from '@/features/holes/components/photo-gallery';
import { PhotoUpload } from '@/features/holes/components/photo-upload';
import { ReviewPanel } from '@/features/holes/components/review-panel';
import { SurveyForm } from '@/features/holes/components/survey-form';
import type { FieldContext } from '@/features/holes/utils/hole-fields';
import { holeRights } from '@/features/holes/utils/rights';
import { useLines } from '@/features/lines/api/get-lines';
import { NotFound } from '../not-found';
import { useWorkspace } from './workspace-context';

/** One test hole: its status in the workflow, what was logged and surveyed, photos, survey tie-in, review, and its history. */
export default function HoleDetailPage() {
  const holeId = Number(useParams().holeId);
  if (!Number.isInteger(holeId) || holeId <= 0) return <NotFound />;
  return <HoleDetail holeId={holeId} />;
}

function HoleDetail({ holeId }: { holeId: number }) {
  const { project } = useWorkspace();
  const hole = useHole(project.id, holeId);

  let body;
  if (hole.isPending) body = <Loading label="Loading the test hole…" />;
  else if (hole.isError) body = <ProblemAlert error={hole.error} />;
  else body = <HoleBody hole={hole.data} />;

  return (
    <div className="space-y-4">
      <ButtonLink to=".." relative="path" variant="ghost" size="sm" className="-ml-3">
        ← Test holes
      </ButtonLink>
      {body}
    </div>
  );
}

function HoleBody({ hole }: { hole: HoleDto }) {
  const { project } = useWorkspace();
  const user = useSignedInUser();
  const navigate = useNavigate();
  const location = useLocation();
  const saved = (location.state as { saved?: 'created' | 'updated' | 'unchanged' } | null)?.saved;
  const lines = useLines(project.id);
  const bores = useBores(project.id);
  const photos = useHolePhotos(project.id, hole.id);
  const activity = useHoleActivity(project.id, hole.id);
  const remove = useDeleteHole(project.id, hole.id);
  const [confirmDelete, setConfirmDelete] = useState(false);

  const { locked, own, canEdit, canDelete, canSurvey, canReview } = holeRights(user, hole);
  // Crews add photos to the holes they logged; the server says the same.
  const canUpload = can(user.role, 'photo.upload') && !locked && own;
  /** Designers and administrators change any photo; others the ones they added (crews also those on their own holes). */
  const canChangePhoto = (p: PhotoDto) =>
    can(user.role, 'photo.upload') && !locked && (can(user.role, 'hole.review') || p.uploadedById === user.id || (user.role === 'field' && hole.createdById === user.id));
  const line = lines.data?.find((l) => l.id === hole.lineId);
  const ctx: FieldContext = {
    unit: project.unit,
    datum: project.verticalDatum,
    stationStyle: project.stationStyle,
    lineLabel: (id) => lines.data?.find((l) => l.id === id)?.label ?? `line ${id}`,
    boreName: (id) => bores.data?.find((b) => b.id === id)?.name ?? `bore ${id}`,
  };
  // The surveyor comes to a hole to tie it in: on a phone the form sits above the photos.
  const surveyFirst = user.role === 'surveyor';
  const surveyPanel = (
    <Panel title="Survey tie-in">
      <SurveyForm hole={hole} project={project} ctx={ctx} />
    </Panel>
  );

  return (
    <div className="space-y-4">
      <div className="space-y-2">
        <div className="flex flex-wrap items-center gap-2">
          <h2 className="text-xl font-semibold">Test hole {hole.number}</h2>
          <HoleStatusBadge status={hole.status} />
        </div>
        <HoleStatusSteps status={hole.status} />
      </div>

      {saved === 'created' &&
        (hole.status === 'planned' ? (
          <Alert tone="caution" title={`Test hole ${hole.number} saved as planned`}>
            <p>
              It has no depth to top yet, so it does not verify the line. When the line is exposed, edit the hole and enter the depth: it then counts as dug.
            </p>
          </Alert>
        ) : (
          <Alert tone="success" title={`Test hole ${hole.number} saved`}>
            <p>Add photos below: the line exposed with a tape showing depth, the marker, the restored surface.</p>
          </Alert>
        ))}
      {saved === 'updated' && <Alert tone="success">Changes saved.</Alert>}
      {locked && (
        <Alert tone="info" title={<span className="inline-flex items-center gap-1.5"><LockIcon className="size-4" /> Reviewed and locked</span>}>
          <p>A designer accepted this hole. Its values, survey and photos can no longer change; a designer can reopen it, with a reason.</p>
        </Alert>
      )}
      {hole.reviewNote && !locked && (
        <Alert tone="caution" title="Note from the review">
          <p className="whitespace-pre-line">{hole.reviewNote}</p>
        </Alert>
      )}

      <div className="flex flex-wrap gap-2">
        {canEdit && (
          <ButtonLink to="edit" className="min-h-12">
            Edit hole
          </ButtonLink>
        )}
        <a href={`/api/projects/${project.id}/holes/${hole.id}/sheet.pdf`} target="_blank" rel="noreferrer" className={buttonClasses('secondary', 'md', 'min-h-12')}>
          Test-hole sheet (PDF)
        </a>
        {canDelete &&
          (confirmDelete ? (
            <>
              <Button
                variant="danger"
                className="min-h-12"
                busy={remove.isPending}
                onClick={() => remove.mutate(undefined, { onSuccess: () => navigate('..', { relative: 'path', state: { deleted: hole.number } }) })}
              >
                Delete {hole.number} and its photos
              </Button>
              <Button variant="secondary" className="min-h-12" onClick={() => setConfirmDelete(false)}>
                Keep it
              </Button>
            </>
          ) : (
            <Button variant="ghost" className="min-h-12" onClick={() => setConfirmDelete(true)}>
              Delete…
            </Button>
          ))}
      </div>
      {remove.error && <ProblemAlert error={remove.error} />}
      {!canEdit && !locked && can(user.role, 'hole.update') && !own && (
        <p className="text-sm text-ink-600">Field crews edit only the holes they logged; this one was logged by someone else.</p>
      )}

      <HoleFacts hole={hole} line={line} project={project} ctx={ctx} />

      {canSurvey && surveyFirst && surveyPanel}

      <Panel title={`Photos (${photos.data?.length ?? hole.photoCount})`}>
        <div className="space-y-4">
          {photos.isPending ? (
            <Loading label="Loading photos…" />
          ) : photos.isError ? (
            <ProblemAlert error={photos.error} />
          ) : photos.data.length === 0 ? (
            <p className="text-sm text-ink-600">No photos yet.{canUpload ? '' : locked ? ' The hole is locked.' : ''}</p>
          ) : (
            <PhotoGallery photos={photos.data} projectId={project.id} holeId={hole.id} holeNumber={hole.number} canChange={canChangePhoto} />
          )}
          {canUpload && <PhotoUpload projectId={project.id} holeId={hole.id} holeNumber={hole.number} />}
        </div>
      </Panel>

      {canSurvey && !surveyFirst && surveyPanel}

      {canReview && (
        <Panel title="Review">
          <ReviewPanel hole={hole} projectId={project.id} />
        </Panel>
      )}

      <Panel title="History">
        {activity.isPending ? (
          <Loading label="Loading history…" />
        ) : activity.isError ? (
          <ProblemAlert error={activity.error} />
        ) : activity.data.length === 0 ? (
          <EmptyState title="No changes recorded">
            <p>Every change to this hole will be listed here with its values before and after.</p>
          </EmptyState>
        ) : (
          <HoleActivity items={activity.data} ctx={ctx} />
        )}
      </Panel>
    </div>
  );
}
