import { Navigate } from 'react-router-dom';
import { ProblemAlert } from '@/components/ui/alert';
import { Loading } from '@/components/ui/states';
import { useSignedInUser } from '@/features/auth/api/get-session';
import { useProjects } from '@/features/projects/api/get-projects';

/** The project whose conflict register was opened last on this device (the Conflicts tab records it). */
export const LAST_PROJECT_KEY = 'threadline.lastProject';

/**
 * Where a signed-in person lands. A project manager lands on the conflict register of the
 * project whose register they opened last on this device, else of their project with the most open conflicts (else the
 * first); everyone else, and a manager with no project, on the project list.
 */
export default function LandingRoute() {
  const user = useSignedInUser();
  const projects = useProjects();
  if (user.role !== 'manager') return <Navigate to="/projects" replace />;
  if (projects.isPending) return <Loading label="Opening your conflicts…" />;
  if (projects.isError) return <ProblemAlert error={projects.error} />;
  const list = projects.data;
  if (list.length === 0) return <Navigate to="/projects" replace />;
  let last = NaN;
  try {
    last = Number(globalThis.localStorage?.getItem(LAST_PROJECT_KEY));
  } catch {
    // storage refused: use the busiest project
  }
  const target = list.find((p) => p.id === last) ?? [...list].sort((a, b) => b.counts.openConflicts - a.counts.openConflicts)[0]!;
  return <Navigate to={`/projects/${target.id}/conflicts`} replace />;
}
