import { useId, useMemo } from 'react';
import { useSearchParams } from 'react-router-dom';
import type { StakePointDto } from '@shared/api';
import { UNIT_LABELS } from '@shared/domain';
import { can } from '@shared/permissions';
import { STAKE_POINT_KIND_LABELS, STAKE_POINT_KINDS, type StakePointKind } from '@shared/schemas/stakeout';
import { SafetyCautions } from '@/components/safety-cautions';
import { Alert, ProblemAlert } from '@/components/ui/alert';
import { FilterChips } from '@/components/ui/filter-chips';
import { EmptyState, Loading } from '@/components/ui/states';
import { useSignedInUser } from '@/features/auth/api/get-session';
import { useStakeout } from '@/features/stakeout/api/get-stakeout';
import { StakePointCard } from '@/features/stakeout/components/stake-point-card';
import { useWorkspace } from './workspace-context';

type KindChoice = 'all' | StakePointKind;

/**
 * Stake-out: the points a survey crew stakes — confirmed line positions over each crossing,
 * suggested test holes and pit corners — with N/E/Z and station/offset, filtered by bore (kept
 * in the address bar), each marked staked with when and by whom.
 */
export default function StakeOutTab() {
  const { project } = useWorkspace();
  const user = useSignedInUser();
  const stakeout = useStakeout(project.id);
  const boreSelectId = useId();
  const [params, setParams] = useSearchParams();
  const boreId = Number(params.get('bore')) || null;
  const kind = (STAKE_POINT_KINDS as readonly string[]).includes(params.get('kind') ?? '') ? (params.get('kind') as StakePointKind) : 'all';
  const frame = useMemo(() => ({ projectId: project.id, unit: project.unit, datum: project.verticalDatum, stationStyle: project.stationStyle }), [project]);
  const setParam = (key: string, value: string | null) => {
    const next = new URLSearchParams(params);
    if (value) next.set(key, value);
    else next.delete(key);
    setParams(next, { replace: true });
  };

  let body;
  if (stakeout.isPending) body = <Loading label="Working out the points to stake…" />;
  else if (stakeout.isError) body = <ProblemAlert error={stakeout.error} />;
  else if (stakeout.data.points.length === 0)
    body = (
      <EmptyState title="Nothing to stake yet">
        <p>
          Points appear here once the project has bores: a confirmed position wherever a dug test hole verifies a line crossing a bore, a suggested test
          hole wherever a line near a bore is still unverified, and the corners of each launch and receiving pit.
        </p>
      </EmptyState>
    );
  else {
    const all = stakeout.data.points;
    const bores = [...new Map(all.map((p) => [p.boreId, p.boreName])).entries()];
    const ofBore = all.filter((p) => boreId === null || p.boreId === boreId);
    const shown = ofBore.filter((p) => kind === 'all' || p.kind === kind);
    const count = (k: StakePointKind) => ofBore.filter((p) => p.kind === k).length;
    const staked = shown.filter((p: StakePointDto) => p.mark).length;
    body = (
      <div className="space-y-3">
        <div className="grid gap-2 sm:grid-cols-[minmax(12rem,18rem)_1fr] sm:items-end">
          <div className="flex flex-col gap-1">
            <label htmlFor={boreSelectId} className="text-sm font-medium text-ink-800">
              Bore
            </label>
            <select id={boreSelectId} value={boreId ?? ''} onChange={(e) => setParam('bore', e.target.value || null)} className="min-h-11 rounded-md border border-ink-300 bg-white px-2 text-base sm:text-sm">
              <option value="">All bores</option>
              {bores.map(([id, name]) => (
                <option key={id} value={id}>
                  {name}
                </option>
              ))}
            </select>
          </div>
          <FilterChips<KindChoice>
            label="Filter by kind of point"
            value={kind}
            onChange={(v) => setParam('kind', v === 'all' ? null : v)}
            options={[{ value: 'all', label: 'All', count: ofBore.length }, ...STAKE_POINT_KINDS.map((k) => ({ value: k, label: STAKE_POINT_KIND_LABELS[k], count: count(k) }))]}
          />
        </div>
        <p className="text-sm text-ink-600" aria-live="polite">
          {shown.length} {shown.length === 1 ? 'point' : 'points'}, {staked} staked · grid {stakeout.data.crsCode}, {UNIT_LABELS[stakeout.data.unit]}, elevations {stakeout.data.verticalDatum}:
          crossings at the top of the line, suggested holes at the ground (from the bore’s ground profile), pit corners at the pit bottom.
        </p>
        {stakeout.data.orphanMarks.length > 0 && (
          <Alert tone="caution" title="Staked points no longer on the list">
            <p>
              {stakeout.data.orphanMarks.length} staked {stakeout.data.orphanMarks.length === 1 ? 'point has' : 'points have'} gone from the list because a line,
              bore or pit changed. Check the stakes in the field against the current list.
            </p>
          </Alert>
        )}
        {shown.length === 0 ? (
          <p className="rounded-md border border-ink-200 bg-white px-4 py-6 text-center text-sm text-ink-600">No points of this kind on this bore.</p>
        ) : (
          <ul className="grid gap-3 lg:grid-cols-2" aria-label="Points to stake">
            {shown.map((p) => (
              <StakePointCard key={p.key} point={p} frame={frame} canStake={can(user.role, 'stakeout.write')} />
            ))}
          </ul>
        )}
      </div>
    );
  }

  return (
    <div className="space-y-4">
      <h2 className="text-lg font-semibold">Stake-out</h2>
      <SafetyCautions topics={['one-call', 'tolerance-zone']} title="Before staking for digging" />
      {body}
    </div>
  );
}
