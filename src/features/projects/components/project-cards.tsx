import { Link } from 'react-router-dom';
import type { ProjectDto } from '@shared/api';
import { UNIT_SYMBOLS } from '@shared/units';
import { Badge } from '@/components/ui/states';

function Count({ label, value, alert }: { label: string; value: number; alert?: boolean }) {
  return (
    <div className="flex flex-col justify-between">
      <dt className="text-xs text-ink-500">{label}</dt>
      <dd className={alert && value > 0 ? 'text-lg font-semibold text-danger-700' : 'text-lg font-semibold text-ink-900'}>{value.toLocaleString('en-US')}</dd>
    </div>
  );
}

/** Project cards: name (a link to the workspace), client, grid and datum, and the register's counts. */
export function ProjectCards({ projects }: { projects: ProjectDto[] }) {
  return (
    <ul className="grid gap-4 md:grid-cols-2 xl:grid-cols-3">
      {projects.map((project) => (
        <li key={project.id} className="relative flex flex-col rounded-lg border border-ink-200 bg-white p-4 shadow-xs focus-within:ring-2 focus-within:ring-brand-500 hover:border-brand-300">
          <h2 className="text-lg font-semibold text-ink-900">
            <Link to={`/projects/${project.id}`} className="after:absolute after:inset-0 focus-visible:outline-none">
              {project.name}
            </Link>
          </h2>
          <p className="text-sm text-ink-600">{project.client}</p>
          <div className="mt-3 flex flex-wrap gap-1.5">
            <Badge title="Horizontal coordinate reference system">{project.crsCode}</Badge>
            <Badge title="Linear unit">{UNIT_SYMBOLS[project.unit]}</Badge>
            <Badge title="Vertical datum">{project.verticalDatum}</Badge>
          </div>
          <dl className="mt-4 grid grid-cols-4 gap-2 border-t border-ink-100 pt-3">
            <Count label="Lines" value={project.counts.lines} />
            <Count label="Test holes" value={project.counts.holes} />
            <Count label="Bores" value={project.counts.bores} />
            <Count label="Open conflicts" value={project.counts.openConflicts} alert />
          </dl>
        </li>
      ))}
    </ul>
  );
}
