import { useState } from 'react';
import { Link } from 'react-router-dom';
import type { BoreDto, PitDto, ProjectDto } from '@shared/api';
import { PIT_KINDS } from '@shared/domain';
import { ProblemAlert } from '@/components/ui/alert';
import { Button, ButtonLink } from '@/components/ui/button';
import { isApiError } from '@/lib/api-client';
import { formatElevation } from '@/lib/format';
import { useDeleteBore } from '../api/delete-bore';
import { useDeletePit } from '../api/delete-pit';
import { BoreForm } from './bore-form';
import { PIT_LABELS } from './bore-list';
import { PitForm } from './pit-form';

type Open = { kind: 'edit' } | { kind: 'delete' } | { kind: 'new-pit' } | { kind: 'edit-pit'; pitId: number } | { kind: 'delete-pit'; pitId: number } | null;

/**
 * What a designer can do to one bore from its card: edit its fields, delete it (after a
 * confirm; the server refuses when its conflicts carry people's decisions), open it in Plan &
 * profile to shape the profile with live clearances, and add, edit or delete its pits.
 */
export function BoreTools({ project, bore, pits }: { project: ProjectDto; bore: BoreDto; pits: PitDto[] }) {
  const [open, setOpen] = useState<Open>(null);
  const removeBore = useDeleteBore(project.id);
  const removePit = useDeletePit(project.id);
  const close = () => {
    setOpen(null);
    removeBore.reset();
    removePit.reset();
  };
  // A refused delete (409 in_use) names the conflicts whose decisions keep the bore.
  const heldBy = isApiError(removeBore.error) && removeBore.error.problem.code === 'in_use' ? (removeBore.error.problem.holds?.conflicts ?? []) : [];
  const freeKind = PIT_KINDS.find((k) => !pits.some((p) => p.kind === k)) ?? 'launch';

  return (
    <div className="space-y-4 border-t border-ink-200 pt-4">
      <section aria-label={`Pits of ${bore.name}`} className="space-y-2">
        <h3 className="text-sm font-semibold text-ink-800">Pits</h3>
        {pits.length === 0 && <p className="text-sm text-ink-600">No pits entered for this bore.</p>}
        <ul className="space-y-2 text-sm">
          {pits.map((pit) => (
            <li key={pit.id} className="space-y-2" data-testid="pit-row">
              <div className="flex flex-wrap items-center gap-2">
                <span className="grow">
                  {PIT_LABELS[pit.kind]}: bottom {formatElevation(pit.bottomElevation, project.unit, project.verticalDatum)}, {pit.footprint.length}-corner footprint
                </span>
                <Button variant="secondary" size="sm" onClick={() => setOpen({ kind: 'edit-pit', pitId: pit.id })} aria-label={`Edit ${PIT_LABELS[pit.kind].toLowerCase()}`}>
                  Edit
                </Button>
                <Button variant="secondary" size="sm" onClick={() => setOpen({ kind: 'delete-pit', pitId: pit.id })} aria-label={`Delete ${PIT_LABELS[pit.kind].toLowerCase()}`}>
                  Delete
                </Button>
              </div>
              {open?.kind === 'edit-pit' && open.pitId === pit.id && (
                <PitForm key={pit.id} project={project} boreId={bore.id} boreName={bore.name} pit={pit} onDone={close} onCancel={close} />
              )}
              {open?.kind === 'delete-pit' && open.pitId === pit.id && (
                <div className="space-y-2 rounded-md border border-danger-100 bg-danger-50 p-3" role="group" aria-label="Confirm deleting the pit">
                  <p>
                    Delete this {PIT_LABELS[pit.kind].toLowerCase()}? Its clearances to the lines around it are removed from the register.
                  </p>
                  <div className="flex flex-wrap gap-2">
                    <Button variant="danger" size="sm" busy={removePit.isPending} onClick={() => removePit.mutate(pit.id, { onSuccess: close })}>
                      Delete the pit for good
                    </Button>
                    <Button variant="secondary" size="sm" onClick={close}>
                      Keep it
                    </Button>
                  </div>
                  {removePit.error && <ProblemAlert error={removePit.error} />}
                </div>
              )}
            </li>
          ))}
        </ul>
        {open?.kind === 'new-pit' ? (
          <PitForm project={project} boreId={bore.id} boreName={bore.name} defaultKind={freeKind} onDone={close} onCancel={close} />
        ) : (
          <Button variant="secondary" size="sm" onClick={() => setOpen({ kind: 'new-pit' })}>
            Add pit
          </Button>
        )}
      </section>

      {open?.kind === 'edit' && <BoreForm key={bore.id} project={project} bore={bore} onDone={close} onCancel={close} />}
      {open?.kind === 'delete' && (
        <div className="space-y-2 rounded-md border border-danger-100 bg-danger-50 p-3 text-sm" role="group" aria-label="Confirm deleting the bore">
          <p>
            Delete {bore.name} with its {pits.length === 1 ? 'pit' : `${pits.length} pits`}? Its clearances and the conflicts nobody has worked on go with
            it. The server keeps a bore whose conflicts carry people’s decisions.
          </p>
          <div className="flex flex-wrap gap-2">
            <Button variant="danger" size="sm" busy={removeBore.isPending} onClick={() => removeBore.mutate(bore.id)}>
              Delete the bore for good
            </Button>
            <Button variant="secondary" size="sm" onClick={close}>
              Keep it
            </Button>
          </div>
          {removeBore.error && <ProblemAlert error={removeBore.error} />}
          {heldBy.length > 0 && (
            <p>
              Open the conflicts that hold it:{' '}
              {heldBy.map((id, i) => (
                <span key={id}>
                  {i > 0 && ', '}
                  <Link className="font-medium text-brand-800 underline" to={`../conflicts/${id}`}>
                    #{id}
                  </Link>
                </span>
              ))}
            </p>
          )}
        </div>
      )}
      {open?.kind !== 'edit' && open?.kind !== 'delete' && (
        <div className="flex flex-wrap gap-2">
          <Button variant="secondary" size="sm" onClick={() => setOpen({ kind: 'edit' })}>
            Edit bore
          </Button>
          <ButtonLink variant="secondary" size="sm" to={`../plan?bore=${bore.id}&edit=1`}>
            Edit {bore.name} with live clearances
          </ButtonLink>
          <Button variant="secondary" size="sm" onClick={() => setOpen({ kind: 'delete' })}>
            Delete bore
          </Button>
        </div>
      )}
    </div>
  );
}
