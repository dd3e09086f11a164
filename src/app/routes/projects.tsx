import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { can } from '@shared/permissions';
import { ProblemAlert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { EmptyState, Loading, Panel } from '@/components/ui/states';
import { useSignedInUser } from '@/features/auth/api/get-session';
import { useProjects } from '@/features/projects/api/get-projects';
import { ProjectCards } from '@/features/projects/components/project-cards';
import { ProjectCreateForm } from '@/features/projects/components/project-create-form';

/** Projects the user can open, with counts; managers and admins create new ones here. */
export default function ProjectsRoute() {
  const user = useSignedInUser();
  const projects = useProjects();
  const navigate = useNavigate();
  const [creating, setCreating] = useState(false);
  const mayCreate = can(user.role, 'project.create');

  return (
    <div className="space-y-5">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1 className="text-2xl font-semibold tracking-tight">Projects</h1>
        {mayCreate && !creating && <Button onClick={() => setCreating(true)}>New project</Button>}
      </div>

      {creating && (
        <Panel title="New project">
          <ProjectCreateForm onCreated={(project) => navigate(`/projects/${project.id}/settings`)} onCancel={() => setCreating(false)} />
        </Panel>
      )}

      {projects.isPending ? (
        <Loading label="Loading projects…" />
      ) : projects.isError ? (
        <ProblemAlert error={projects.error} />
      ) : projects.data.length === 0 ? (
        <EmptyState title="No projects yet">
          <p>A project holds one job’s buried lines, test holes, bores and clearances, in one grid, one unit and one vertical datum.</p>
          {mayCreate ? (
            <p>Start one with “New project”. You will need the projected coordinate system (EPSG code and proj4 definition) and the vertical datum of the survey.</p>
          ) : (
            <p>You are not a member of any project yet. A project manager adds people to a project.</p>
          )}
        </EmptyState>
      ) : (
        <ProjectCards projects={projects.data} />
      )}
    </div>
  );
}
