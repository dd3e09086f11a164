import { SafetyCautions } from '@/components/safety-cautions';
import { ProblemAlert } from '@/components/ui/alert';
import { EmptyState, Loading } from '@/components/ui/states';
import { useBores } from '@/features/bores/api/get-bores';
import { usePits } from '@/features/bores/api/get-pits';
import { BoreList } from '@/features/bores/components/bore-list';
import { useWorkspace } from './workspace-context';

/** Bores: each proposed crossing with its method, casing, stations, profiles and pits (read-only for now). */
export default function BoresTab() {
  const { project, units } = useWorkspace();
  const bores = useBores(project.id);
  const pits = usePits(project.id);

  let body;
  if (bores.isPending) body = <Loading label="Loading bores…" />;
  else if (bores.isError) body = <ProblemAlert error={bores.error} />;
  else if (bores.data.length === 0)
    body = (
      <EmptyState title="No bores yet">
        <p>
          A bore is a proposed crossing: its method, plan alignment, begin station, casing profile and pits. Clearances are computed from each bore to
          the lines around it.
        </p>
        <p>Entering and editing bores (alignment, profile and pits, with live clearance figures) is not built yet.</p>
      </EmptyState>
    );
  else
    body = (
      <>
        {pits.isError && <ProblemAlert error={pits.error} />}
        <BoreList bores={bores.data} pits={pits.data ?? []} ctx={units} />
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
