import { Link } from 'react-router-dom';
import { NotBuiltYet } from '@/components/not-built';
import { useWorkspace } from './workspace-context';

/** Plan & profile: placeholder until the map and profile strip land. */
export default function PlanTab() {
  const { project } = useWorkspace();
  return (
    <NotBuiltYet
      title="Plan & profile"
      willShow={
        <>
          <p>
            The plan-and-profile view is not built yet. It will show this project’s bores, pits, lines in their APWA marking colours and test holes on a map
            drawn from base tiles served by Threadline itself, with a profile strip beneath: ground, the casing with its construction tolerance, and each
            crossed line drawn to scale with its clearance labelled and failing ones flagged. Selecting a record in either view will select it in the other.
          </p>
          <p>
            Plan positions will be in {project.crsCode}; elevations in {project.verticalDatum}.
          </p>
        </>
      }
      meanwhile={
        <p>
          The same records are listed under{' '}
          <Link className="font-medium text-brand-700 underline" to="../lines">
            Lines ({project.counts.lines})
          </Link>
          ,{' '}
          <Link className="font-medium text-brand-700 underline" to="../bores">
            Bores ({project.counts.bores})
          </Link>{' '}
          and{' '}
          <Link className="font-medium text-brand-700 underline" to="../holes">
            Test holes ({project.counts.holes})
          </Link>
          .
        </p>
      }
    />
  );
}
