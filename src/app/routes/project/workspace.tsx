import { Suspense, useEffect, useRef } from 'react';
import { Link, NavLink, Outlet, useParams } from 'react-router-dom';
import { UNIT_LABELS } from '@shared/domain';
import type { ProjectDto } from '@shared/api';
import { ProblemAlert } from '@/components/ui/alert';
import { cn } from '@/components/ui/cn';
import { Badge, Loading } from '@/components/ui/states';
import { useProject } from '@/features/projects/api/get-project';
import { NotFound } from '../not-found';
import type { WorkspaceContext } from './workspace-context';

const TABS: { path: string; label: string; count?: (p: ProjectDto) => number; alert?: boolean }[] = [
  { path: 'plan', label: 'Plan & profile' },
  { path: 'holes', label: 'Test holes', count: (p) => p.counts.holes },
  { path: 'lines', label: 'Lines', count: (p) => p.counts.lines },
  { path: 'bores', label: 'Bores', count: (p) => p.counts.bores },
  { path: 'conflicts', label: 'Conflicts', count: (p) => p.counts.openConflicts, alert: true },
  { path: 'stake-out', label: 'Stake-out' },
  { path: 'exports', label: 'Exports' },
  { path: 'activity', label: 'Activity' },
  { path: 'settings', label: 'Settings' },
];

/** Section tabs; on a phone they scroll sideways and the current one is kept in view. */
function Tabs({ project }: { project: ProjectDto }) {
  const ref = useRef<HTMLElement>(null);
  const params = useParams();
  const here = params['*'];
  useEffect(() => {
    const nav = ref.current;
    const active = nav?.querySelector<HTMLElement>('[aria-current="page"]');
    if (!nav || !active) return;
    const left = active.offsetLeft - (nav.clientWidth - active.offsetWidth) / 2;
    nav.scrollTo({ left: Math.max(0, left) });
  }, [here]);

  return (
    <nav ref={ref} aria-label="Project sections" className="relative -mx-3 overflow-x-auto border-b border-ink-200 px-3 [scrollbar-width:thin] sm:mx-0 sm:px-0">
      <ul className="flex min-w-max gap-1">
        {TABS.map((tab) => {
          const count = tab.count?.(project);
          return (
            <li key={tab.path}>
              <NavLink
                to={tab.path}
                className={({ isActive }) =>
                  cn(
                    'inline-flex min-h-12 items-center gap-2 border-b-2 px-3 text-sm font-medium whitespace-nowrap',
                    isActive ? 'border-brand-600 text-brand-800' : 'border-transparent text-ink-600 hover:border-ink-300 hover:text-ink-900',
                  )
                }
              >
                {tab.label}
                {/* The count is visual only, so each tab's accessible name is exactly its label. */}
                {count != null && (
                  <span aria-hidden className={cn('rounded-full px-1.5 text-xs tabular', tab.alert && count > 0 ? 'bg-danger-600 text-white' : 'bg-ink-100 text-ink-600')}>
                    {count}
                  </span>
                )}
              </NavLink>
            </li>
          );
        })}
      </ul>
    </nav>
  );
}

/** The project workspace frame: project heading, its grid and datum, section tabs and the open section. */
export default function WorkspaceRoute() {
  const params = useParams();
  const projectId = Number(params.projectId);
  if (!Number.isInteger(projectId) || projectId <= 0) return <NotFound />;
  return <Workspace projectId={projectId} />;
}

function Workspace({ projectId }: { projectId: number }) {
  const project = useProject(projectId);

  if (project.isPending) return <Loading label="Loading project…" />;
  if (project.isError) {
    return (
      <div className="space-y-3">
        <ProblemAlert error={project.error} />
        <Link to="/projects" className="font-medium text-brand-700 underline">
          Back to projects
        </Link>
      </div>
    );
  }

  const p = project.data;
  const context: WorkspaceContext = { project: p };
  return (
    <div className="space-y-4">
      <div>
        <Link to="/projects" className="text-sm text-brand-700 hover:underline">
          ← All projects
        </Link>
        <h1 className="mt-1 text-2xl font-semibold tracking-tight">{p.name}</h1>
        <p className="text-sm text-ink-600">{p.client}</p>
        <div className="mt-2 flex flex-wrap gap-1.5" aria-label="Project reference frame">
          <Badge title="Horizontal coordinate reference system">{p.crsCode}</Badge>
          <Badge title="Linear unit">{UNIT_LABELS[p.unit]}</Badge>
          <Badge title="Vertical datum">Elevations: {p.verticalDatum}</Badge>
          <Badge title="How stations are written in this project">Station style {p.stationStyle === '100' ? '12+34.56' : '1+234.567'}</Badge>
        </div>
      </div>
      <Tabs project={p} />
      <Suspense fallback={<Loading label="Loading section…" />}>
        <Outlet context={context} />
      </Suspense>
    </div>
  );
}
