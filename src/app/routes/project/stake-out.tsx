import { NotBuiltYet } from '@/components/not-built';
import { SafetyCautions } from '@/components/safety-cautions';
import { UNIT_LABELS } from '@shared/domain';
import { useWorkspace } from './workspace-context';

/** Stake-out: placeholder until point lists and as-surveyed imports land. */
export default function StakeOutTab() {
  const { project } = useWorkspace();
  return (
    <div className="space-y-4">
      <NotBuiltYet
        title="Stake-out"
        willShow={
          <>
            <p>
              Stake-out is not built yet. It will list the points a survey crew should stake: suggested test-hole positions where a line is still
              unverified, and confirmed line positions at crossings, each with station and offset (L/R) and grid coordinates in {project.crsCode}.
            </p>
            <p>
              Point files will use the columns point, northing, easting, elevation, description, in {UNIT_LABELS[project.unit]} and{' '}
              {project.verticalDatum}, and as-surveyed files in the same layout will be importable back onto the holes.
            </p>
          </>
        }
      />
      <SafetyCautions topics={['one-call', 'tolerance-zone']} title="Before staking for digging" />
    </div>
  );
}
