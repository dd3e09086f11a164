import { can } from '@shared/permissions';
import { SafetyCautions } from '@/components/safety-cautions';
import { ButtonLink } from '@/components/ui/button';
import { useSignedInUser } from '@/features/auth/api/get-session';
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
  const canEdit = can(useSignedInUser().role, 'bore.write');

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
        <p>Entering new bores (alignment and pits) is not built yet; a bore’s profile and casing can be edited with live clearances in Plan &amp; profile.</p>
      </EmptyState>
    );
  else
    body = (
      <>
        {pits.isError && <ProblemAlert error={pits.error} />}
        <BoreList bores={bores.data} pits={pits.data ?? []} ctx={units} />
        {canEdit && (
          <section className="rounded-lg border border-ink-200 bg-white p-4 text-sm" aria-label="Edit a bore profile">
            <p className="mb-2 text-ink-700">
              Change a bore’s profile, grade or casing with every clearance recomputed as you type or drag, in Plan &amp; profile:
            </p>
            <div className="flex flex-wrap gap-2">
              {bores.data.map((b) => (
                <ButtonLink key={b.id} variant="secondary" size="sm" to={`../plan?bore=${b.id}&edit=1`}>
                  Edit {b.name} with live clearances
                </ButtonLink>
              ))}
            </div>
          </section>
        )}
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
