import { useState } from 'react';
import { ROLE_LABELS } from '@shared/domain';
import type { UserDto } from '@shared/api';
import { ProblemAlert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Badge } from '@/components/ui/states';
import { formatDate } from '@/lib/format';
import { useUpdateUser } from '../api/update-user';
import { UserEditForm } from './user-edit-form';

/** Accounts with edit and deactivate/reactivate; each change carries the version shown. */
export function UserList({ users, currentUserId }: { users: UserDto[]; currentUserId: number }) {
  const [editing, setEditing] = useState<number | null>(null);
  const setActive = useUpdateUser();

  return (
    <div className="space-y-3">
      {setActive.error && <ProblemAlert error={setActive.error} />}
      <ul className="divide-y divide-ink-100 rounded-lg border border-ink-200 bg-white">
        {users.map((user) => {
          const isSelf = user.id === currentUserId;
          return (
            <li key={user.id} className="px-4 py-3">
              {editing === user.id ? (
                <UserEditForm user={user} isSelf={isSelf} onDone={() => setEditing(null)} />
              ) : (
                <div className="flex flex-wrap items-center justify-between gap-3">
                  <div className="min-w-0">
                    <p className="flex flex-wrap items-center gap-2 font-medium text-ink-900">
                      {user.name}
                      {isSelf && <Badge className="bg-brand-100 text-brand-800">You</Badge>}
                      {user.active ? null : <Badge className="bg-ink-200 text-ink-700">Deactivated</Badge>}
                    </p>
                    <p className="truncate text-sm text-ink-600">{user.email}</p>
                    <p className="text-xs text-ink-500">
                      {ROLE_LABELS[user.role]} · added {formatDate(user.createdAt)}
                    </p>
                  </div>
                  <div className="flex gap-2">
                    <Button variant="secondary" size="sm" onClick={() => setEditing(user.id)} aria-label={`Edit ${user.name}`}>
                      Edit
                    </Button>
                    {!isSelf && (
                      <Button
                        variant={user.active ? 'ghost' : 'secondary'}
                        size="sm"
                        busy={setActive.isPending && setActive.variables?.userId === user.id}
                        onClick={() => setActive.mutate({ userId: user.id, input: { active: !user.active, version: user.version } })}
                        aria-label={`${user.active ? 'Deactivate' : 'Reactivate'} ${user.name}`}
                      >
                        {user.active ? 'Deactivate' : 'Reactivate'}
                      </Button>
                    )}
                  </div>
                </div>
              )}
            </li>
          );
        })}
      </ul>
    </div>
  );
}
