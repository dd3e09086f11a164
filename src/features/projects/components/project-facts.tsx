import type { ReactNode } from 'react';
import { QUALITY_LEVELS, UNIT_LABELS } from '@shared/domain';
import type { ProjectDto } from '@shared/api';
import { formatLength } from '@/lib/format';
import { STATION_STYLE_LABELS } from './station-style';

function Fact({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div className="py-2 sm:grid sm:grid-cols-3 sm:gap-4">
      <dt className="text-sm font-medium text-ink-600">{label}</dt>
      <dd className="mt-0.5 text-sm break-words text-ink-900 sm:col-span-2 sm:mt-0">{children}</dd>
    </div>
  );
}

/** Read-only view of the project fields, for roles that may not edit them. */
export function ProjectFacts({ project }: { project: ProjectDto }) {
  const s = project.settings;
  return (
    <dl className="divide-y divide-ink-100">
      <Fact label="Client">{project.client}</Fact>
      {project.description && <Fact label="Description">{project.description}</Fact>}
      <Fact label="CRS">{project.crsCode}</Fact>
      <Fact label="proj4 definition">
        <code className="font-mono text-xs">{project.crsProj4}</code>
      </Fact>
      <Fact label="Linear unit">{UNIT_LABELS[project.unit]}</Fact>
      <Fact label="Vertical datum">{project.verticalDatum}</Fact>
      <Fact label="Station style">{STATION_STYLE_LABELS[project.stationStyle]}</Fact>
      {s && (
        <>
          <Fact label="Verification distance">{formatLength(s.verificationDistance, project.unit)}</Fact>
          <Fact label="Uncertainty by quality level">
            {QUALITY_LEVELS.map((level) => `${level}: ${formatLength(s.qualityLevelUncertainty[level], project.unit)}`).join(' · ')}
          </Fact>
          <Fact label="Extrapolation allowance">{s.extrapolationFactor} per unit of distance</Fact>
          <Fact label="Poorest phone GPS accepted">{formatLength(s.maxGpsAccuracy, project.unit)}</Fact>
        </>
      )}
    </dl>
  );
}
