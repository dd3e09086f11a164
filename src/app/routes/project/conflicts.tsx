import { SafetyCautions } from '@/components/safety-cautions';
import { ProblemAlert } from '@/components/ui/alert';
import { EmptyState, Loading } from '@/components/ui/states';
import { useBores } from '@/features/bores/api/get-bores';
import { useConflicts } from '@/features/conflicts/api/get-conflicts';
import { ConflictsTable } from '@/features/conflicts/components/conflicts-table';
import { useLines } from '@/features/lines/api/get-lines';
import { useWorkspace } from './workspace-context';

/** Conflicts: the register as it stands (read-only); the clearance check that fills it is still to come. */
export default function ConflictsTab() {
  const { project } = useWorkspace();
  const conflicts = useConflicts(project.id);
  const lines = useLines(project.id);
  const bores = useBores(project.id);

  const lineLabel = (id: number) => lines.data?.find((l) => l.id === id)?.label ?? `Line ${id}`;
  const boreName = (id: number) => bores.data?.find((b) => b.id === id)?.name ?? `Bore ${id}`;

  let body;
  if (conflicts.isPending) body = <Loading label="Loading conflicts…" />;
  else if (conflicts.isError) body = <ProblemAlert error={conflicts.error} />;
  else if (conflicts.data.length === 0)
    body = (
      <EmptyState title="No conflicts in the register">
        <p>
          The clearance check that fills this register is not built yet, so an empty list here does not mean the lines are clear. When it is, every line
          that overlaps a bore or falls short of its required clearance will be listed with its figures, and tracked until the bore is redesigned, the
          line relocated, or the owner waives it.
        </p>
      </EmptyState>
    );
  else body = <ConflictsTable conflicts={conflicts.data} lineLabel={lineLabel} boreName={boreName} />;

  return (
    <div className="space-y-4">
      <h2 className="text-lg font-semibold">Conflicts</h2>
      {body}
      <p className="text-sm text-ink-600">The status workflow, assignees, due dates and history of each conflict are not built yet.</p>
      <SafetyCautions topics={['design-aid']} title="Before relying on a clearance" />
    </div>
  );
}
