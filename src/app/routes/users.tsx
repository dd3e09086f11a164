import { useState } from 'react';
import { can } from '@shared/permissions';
import { Alert, ProblemAlert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { EmptyState, Loading, Panel } from '@/components/ui/states';
import { useSignedInUser } from '@/features/auth/api/get-session';
import { useUsers } from '@/features/users/api/get-users';
import { UserCreateForm } from '@/features/users/components/user-create-form';
import { UserList } from '@/features/users/components/user-list';

/** Users (administrators only): accounts, roles and access. */
export default function UsersRoute() {
  const me = useSignedInUser();
  const allowed = can(me.role, 'user.manage');
  const users = useUsers({ enabled: allowed });
  const [adding, setAdding] = useState(false);
  const [added, setAdded] = useState<string | null>(null);

  if (!allowed) {
    return (
      <EmptyState title="Users">
        <p>Only the administrator manages user accounts.</p>
      </EmptyState>
    );
  }

  return (
    <div className="space-y-5">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1 className="text-2xl font-semibold tracking-tight">Users</h1>
        {!adding && (
          <Button
            onClick={() => {
              setAdding(true);
              setAdded(null);
            }}
          >
            Add user
          </Button>
        )}
      </div>
      <p className="max-w-prose text-sm text-ink-600">
        A deactivated user cannot sign in but stays on the records they made. Roles decide what each person may change; every project also needs them
        as a member.
      </p>
      {added && <Alert tone="success">{added} can now sign in. Add them to the projects they work on, under each project’s Settings.</Alert>}
      {adding && (
        <Panel title="Add user">
          <UserCreateForm
            onCreated={(user) => {
              setAdding(false);
              setAdded(user.name);
            }}
            onCancel={() => setAdding(false)}
          />
        </Panel>
      )}
      {users.isPending ? (
        <Loading label="Loading users…" />
      ) : users.isError ? (
        <ProblemAlert error={users.error} />
      ) : users.data.length === 0 ? (
        <EmptyState title="No users">
          <p>Add the first account with “Add user”.</p>
        </EmptyState>
      ) : (
        <UserList users={users.data} currentUserId={me.id} />
      )}
    </div>
  );
}
