import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { can } from '@shared/permissions';
import { ProblemAlert } from '@/components/ui/alert';
import { ButtonLink } from '@/components/ui/button';
import { EmptyState, Loading } from '@/components/ui/states';
import { useSignedInUser } from '@/features/auth/api/get-session';
import { useBores } from '@/features/bores/api/get-bores';
import { useHoles } from '@/features/holes/api/get-holes';
import { HoleForm } from '@/features/holes/components/hole-form';
import { useLines } from '@/features/lines/api/get-lines';
import { KeptHole } from '@/features/outbox/components/kept-hole';
import { useWorkspace } from './workspace-context';

/** Log a test hole: the phone-first form; on save, the new hole's page (to add photos). */
export default function HoleNewPage() {
  const { project } = useWorkspace();
  const user = useSignedInUser();
  const navigate = useNavigate();
  const lines = useLines(project.id);
  const bores = useBores(project.id);
  const holes = useHoles(project.id);
  const [kept, setKept] = useState<string | null>(null);
  const [formKey, setFormKey] = useState(0);

  let body;
  if (!can(user.role, 'hole.create'))
    body = (
      <EmptyState title="Your role does not log test holes" action={<ButtonLink to=".." relative="path">Back to test holes</ButtonLink>}>
        <p>Field crews and designers log holes. Ask a project manager if you need to.</p>
      </EmptyState>
    );
  else if (lines.isPending || bores.isPending || holes.isPending) body = <Loading label="Loading lines and bores…" />;
  else if (lines.isError || bores.isError || holes.isError) body = <ProblemAlert error={lines.error ?? bores.error ?? holes.error} />;
  else if (kept)
    body = (
      <KeptHole
        clientId={kept}
        onNext={() => {
          setKept(null);
          setFormKey((k) => k + 1);
        }}
      />
    );
  else
    body = (
      <HoleForm
        key={formKey}
        project={project}
        role={user.role}
        userName={user.name}
        lines={lines.data}
        bores={bores.data}
        holes={holes.data}
        mode={{ kind: 'create' }}
        onSaved={(hole) => navigate(`../${hole.id}`, { relative: 'path', state: { saved: 'created' } })}
        onCancel={() => navigate('..', { relative: 'path' })}
        onKept={setKept}
      />
    );

  return (
    <div className="mx-auto max-w-3xl space-y-4">
      <div>
        <ButtonLink to=".." relative="path" variant="ghost" size="sm" className="-ml-3">
          ← Test holes
        </ButtonLink>
        <h2 className="text-lg font-semibold">Log a test hole</h2>
      </div>
      {body}
    </div>
  );
}
