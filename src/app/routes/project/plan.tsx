import { useQueryClient } from '@tanstack/react-query';
import { useSearchParams } from 'react-router-dom';
import { can } from '@shared/permissions';
import type { BoreUpdateInput } from '@shared/schemas/bore';
import { SafetyCautions } from '@/components/safety-cautions';
import { ProblemAlert } from '@/components/ui/alert';
import { Loading } from '@/components/ui/states';
import { useSignedInUser } from '@/features/auth/api/get-session';
import { useBores } from '@/features/bores/api/get-bores';
import { usePits } from '@/features/bores/api/get-pits';
import { staleBoreOf, useUpdateBore } from '@/features/bores/api/update-bore';
import { useHoles } from '@/features/holes/api/get-holes';
import { useLines } from '@/features/lines/api/get-lines';
import { useClearances } from '@/features/plan/api/get-clearances';
import { useTileset } from '@/features/plan/api/get-tileset';
import { AFFECTED_BY_BORE_WRITES } from '@/features/plan/api/keys';
import { PlanProfile } from '@/features/plan/components/plan-profile';
import { useRules } from '@/features/rules/api/get-rules';
import { useWorkspace } from './workspace-context';

/** Plan & profile: the map, the profile strip of a bore and its lines, with live bore editing. */
export default function PlanTab() {
  const { project } = useWorkspace();
  const user = useSignedInUser();
  const queryClient = useQueryClient();
  const bores = useBores(project.id);
  const pits = usePits(project.id);
  const lines = useLines(project.id);
  const holes = useHoles(project.id);
  const rules = useRules(project.id);
  const clearances = useClearances(project.id);
  const tileset = useTileset(project.id);
  const updateBore = useUpdateBore(project.id);
  // ?bore=<id>&edit=1 (from the Bores tab) opens that bore, ready to edit.
  const [params] = useSearchParams();
  const initialBoreId = Number(params.get('bore')) || null;
  const startEditing = params.get('edit') === '1';

  const queries = [bores, pits, lines, holes, rules, clearances];
  const failed = queries.find((q) => q.isError);
  if (failed) return <ProblemAlert error={failed.error} />;
  if (queries.some((q) => q.isPending) || tileset.isPending) return <Loading label="Loading the plan and profile…" />;

  const saveBore = async (boreId: number, input: BoreUpdateInput) => {
    const saved = await updateBore.mutateAsync({ boreId, input });
    // The server recomputed the register with the save; wait for the fresh report before leaving edit mode.
    await Promise.all(AFFECTED_BY_BORE_WRITES.map((key) => queryClient.invalidateQueries({ queryKey: [...key] })));
    return saved;
  };

  return (
    <div className="space-y-4">
      <PlanProfile
        project={project}
        bores={bores.data!}
        pits={pits.data!}
        lines={lines.data!}
        holes={holes.data!}
        rules={rules.data!}
        clearances={clearances.data!}
        tileset={tileset.data ?? null}
        canEditBores={can(user.role, 'bore.write')}
        canUploadTiles={can(user.role, 'basemap.upload')}
        saveBore={saveBore}
        staleBoreOf={staleBoreOf}
        initialBoreId={initialBoreId}
        startEditing={startEditing}
      />
      <SafetyCautions topics={['one-call', 'tolerance-zone', 'design-aid']} title="Before anyone digs" className="print:hidden" />
    </div>
  );
}
