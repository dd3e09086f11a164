import { useState } from 'react';
import { can } from '@shared/permissions';
import { SafetyCautions } from '@/components/safety-cautions';
import { Button } from '@/components/ui/button';
import { useSignedInUser } from '@/features/auth/api/get-session';
import { ProblemAlert } from '@/components/ui/alert';
import { EmptyState, Loading } from '@/components/ui/states';
import { useBores } from '@/features/bores/api/get-bores';
import { usePits } from '@/features/bores/api/get-pits';
import { BoreForm } from '@/features/bores/components/bore-form';
import { BoreList } from '@/features/bores/components/bore-list';
import { BoreTools } from '@/features/bores/components/bore-tools';
import { useWorkspace } from './workspace-context';

/**
 * Bores: each proposed crossing with its method, casing, stations, profiles and pits. People
 * with `bore.write` add, edit and delete bores and pits here; the profile is shaped with live
 * clearances in Plan & profile.
 */
export default function BoresTab() {
  const { project, units } = useWorkspace();
  const bores = useBores(project.id);
  const pits = usePits(project.id);
  const canEdit = can(useSignedInUser().role, 'bore.write');
  const [adding, setAdding] = useState(false);

  const addForm = canEdit && adding && <BoreForm project={project} onDone={() => setAdding(false)} onCancel={() => setAdding(false)} />;

  let body;
  if (bores.isPending) body = <Loading label="Loading bores…" />;
  else if (bores.isError) body = <ProblemAlert error={bores.error} />;
  else if (bores.data.length === 0)
    body = adding ? (
      addForm
    ) : (
      <EmptyState title="No bores yet">
        <p>
          A bore is a proposed crossing: its method, plan alignment, begin station, casing profile and pits. Clearances are computed from each bore to
          the lines around it.
        </p>
        {canEdit ? (
          <>
            <p>Add the first bore: type or paste its alignment, give its begin station, casing and a first profile, and its clearances are computed at once.</p>
            <Button onClick={() => setAdding(true)}>Add the first bore</Button>
          </>
        ) : (
          <p>A designer enters the bores; once one does, each bore is listed here and its clearances show in Plan &amp; profile.</p>
        )}
      </EmptyState>
    );
  else
    body = (
      <>
        {pits.isError && <ProblemAlert error={pits.error} />}
        {canEdit && (adding ? addForm : <Button onClick={() => setAdding(true)}>Add bore</Button>)}
        <BoreList
          bores={bores.data}
          pits={pits.data ?? []}
          ctx={units}
          renderTools={canEdit ? (bore, borePits) => <BoreTools project={project} bore={bore} pits={borePits} /> : undefined}
        />
      </>
    );

  return (
    <div className="space-y-4">
      <h2 className="text-lg font-semibold">Bores</h2>
      {body}
      <SafetyCautions topics={['excavation-entry', 'casing-entry', 'design-aid']} title="Pits, casings and clearances" />
    </div>
  );
}
