import { useNavigate, useParams } from 'react-router-dom';
import { Alert, ProblemAlert } from '@/components/ui/alert';
import { ButtonLink } from '@/components/ui/button';
import { Loading } from '@/components/ui/states';
import { useSignedInUser } from '@/features/auth/api/get-session';
import { useBores } from '@/features/bores/api/get-bores';
import { useHole } from '@/features/holes/api/get-hole';
import { useHoles } from '@/features/holes/api/get-holes';
import { HoleForm } from '@/features/holes/components/hole-form';
import { holeRights } from '@/features/holes/utils/rights';
import { useLines } from '@/features/lines/api/get-lines';
import { NotFound } from '../not-found';
import { useWorkspace } from './workspace-context';

/** Edit a hole's logged fields; a stale save shows both versions field by field. */
export default function HoleEditPage() {
  const { project } = useWorkspace();
  const user = useSignedInUser();
  const navigate = useNavigate();
  const holeId = Number(useParams().holeId);
  const valid = Number.isInteger(holeId) && holeId > 0;
  const hole = useHole(project.id, valid ? holeId : 0);
  const lines = useLines(project.id);
  const bores = useBores(project.id);
  const holes = useHoles(project.id);
  if (!valid) return <NotFound />;

  let body;
  if (hole.isPending || lines.isPending || bores.isPending || holes.isPending) body = <Loading label="Loading the test hole…" />;
  else if (hole.isError || lines.isError || bores.isError || holes.isError) body = <ProblemAlert error={hole.error ?? lines.error ?? bores.error ?? holes.error} />;
  else if (!holeRights(user, hole.data).canEdit) {
    // Reached by its address: say why before anyone types into a form the server would refuse.
    const { locked } = holeRights(user, hole.data);
    body = (
      <Alert tone="info" title="This hole cannot be edited here">
        <p>
          {locked
            ? 'It has been reviewed and is locked; a design engineer can reopen it with a reason from the hole page.'
            : 'Field crews edit only the holes they logged; this one was logged by someone else. Ask that crew or a design engineer to change it.'}
        </p>
      </Alert>
    );
  } else
    body = (
      <HoleForm
        key={hole.data.id}
        project={project}
        role={user.role}
        userName={user.name}
        lines={lines.data}
        bores={bores.data}
        holes={holes.data}
        mode={{ kind: 'edit', hole: hole.data }}
        onSaved={(_h, how) => navigate('..', { relative: 'path', state: { saved: how } })}
        onCancel={() => navigate('..', { relative: 'path' })}
      />
    );

  return (
    <div className="mx-auto max-w-3xl space-y-4">
      <div>
        <ButtonLink to=".." relative="path" variant="ghost" size="sm" className="-ml-3">
          ← Back to the hole
        </ButtonLink>
        <h2 className="text-lg font-semibold">Edit test hole {hole.data?.number ?? ''}</h2>
      </div>
      {body}
    </div>
  );
}
