import { useOutletContext } from 'react-router-dom';
import type { ProjectDto } from '@shared/api';
import type { LinearUnit, StationStyle } from '@shared/domain';

export interface WorkspaceContext {
  project: ProjectDto;
}

/** The project of the open workspace (loaded by the workspace frame before any tab renders). */
export function useWorkspace(): WorkspaceContext & { units: { unit: LinearUnit; datum: string; stationStyle: StationStyle } } {
  const { project } = useOutletContext<WorkspaceContext>();
  return { project, units: { unit: project.unit, datum: project.verticalDatum, stationStyle: project.stationStyle } };
}
