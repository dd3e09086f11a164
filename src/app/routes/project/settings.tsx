import { can } from '@shared/permissions';
import { Panel } from '@/components/ui/states';
import { useSignedInUser } from '@/features/auth/api/get-session';
import { MembersPanel } from '@/features/members/components/members-panel';
import { ProjectFacts } from '@/features/projects/components/project-facts';
import { ProjectSettingsForm } from '@/features/projects/components/project-settings-form';
import { RulesPanel } from '@/features/rules/components/rules-panel';
import { useUsers } from '@/features/users/api/get-users';
import { useWorkspace } from './workspace-context';

/** Settings: project fields and tolerances, members, and clearance rules, each editable by its role. */
export default function SettingsTab() {
  const { project } = useWorkspace();
  const user = useSignedInUser();
  const mayEditProject = can(user.role, 'project.update');
  const mayManageMembers = can(user.role, 'member.manage');
  const users = useUsers({ enabled: mayManageMembers });

  return (
    <div className="space-y-5">
      <h2 className="sr-only">Settings</h2>
      <Panel title="Project" headingLevel={3}>
        {mayEditProject ? <ProjectSettingsForm project={project} /> : <ProjectFacts project={project} />}
      </Panel>
      <Panel title="Members" headingLevel={3}>
        <MembersPanel projectId={project.id} canManage={mayManageMembers} candidates={users.data} />
      </Panel>
      <Panel title="Clearance rules" headingLevel={3}>
        <RulesPanel projectId={project.id} unit={project.unit} canEdit={can(user.role, 'rule.write')} />
      </Panel>
    </div>
  );
}
