import { useState } from 'react';
import { ROLE_LABELS, type Role } from '@shared/domain';
import { ProblemAlert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/field';
import { Badge, EmptyState, Loading } from '@/components/ui/states';
import { useAddMember } from '../api/add-member';
import { useMembers } from '../api/get-members';
import { useRemoveMember } from '../api/remove-member';

/** A person who could be added (from the user list, which only managers and admins can read). */
export interface MemberCandidate {
  id: number;
  name: string;
  email: string;
  role: Role;
  active: boolean;
}

/** Project members; managers and admins add and remove them. */
export function MembersPanel({ projectId, canManage, candidates }: { projectId: number; canManage: boolean; candidates?: MemberCandidate[] }) {
  const members = useMembers(projectId);
  const add = useAddMember(projectId);
  const remove = useRemoveMember(projectId);
  const [chosen, setChosen] = useState('');
  const [confirming, setConfirming] = useState<number | null>(null);

  if (members.isPending) return <Loading label="Loading members…" />;
  if (members.isError) return <ProblemAlert error={members.error} />;

  const memberIds = new Set(members.data.map((m) => m.userId));
  const addable = (candidates ?? []).filter((u) => u.active && !memberIds.has(u.id));

  return (
    <div className="space-y-4">
      {(add.error || remove.error) && <ProblemAlert error={add.error ?? remove.error} />}
      {members.data.length === 0 ? (
        <EmptyState title="No members yet">
          <p>Only members (and administrators) can open this project. {canManage ? 'Add people below.' : 'A project manager adds them.'}</p>
        </EmptyState>
      ) : (
        <ul className="divide-y divide-ink-100 rounded-md border border-ink-200">
          {members.data.map((member) => (
            <li key={member.userId} className="flex flex-wrap items-center justify-between gap-2 px-3 py-2">
              <div className="min-w-0">
                <p className="font-medium text-ink-900">
                  {member.name} {!member.active && <Badge className="ml-1 bg-ink-200 text-ink-700">Deactivated</Badge>}
                </p>
                <p className="truncate text-sm text-ink-600">
                  {member.email} · {ROLE_LABELS[member.role]}
                </p>
              </div>
              {canManage &&
                (confirming === member.userId ? (
                  <div className="flex gap-2">
                    <Button
                      variant="danger"
                      size="sm"
                      busy={remove.isPending && remove.variables === member.userId}
                      onClick={() => remove.mutate(member.userId, { onSettled: () => setConfirming(null) })}
                    >
                      Remove {member.name}
                    </Button>
                    <Button variant="secondary" size="sm" onClick={() => setConfirming(null)}>
                      Keep
                    </Button>
                  </div>
                ) : (
                  <Button variant="ghost" size="sm" onClick={() => setConfirming(member.userId)} aria-label={`Remove ${member.name} from the project`}>
                    Remove
                  </Button>
                ))}
            </li>
          ))}
        </ul>
      )}

      {canManage && (
        <form
          className="flex flex-col gap-2 sm:flex-row sm:items-end"
          onSubmit={(event) => {
            event.preventDefault();
            const userId = Number(chosen);
            if (userId > 0) add.mutate({ userId }, { onSuccess: () => setChosen('') });
          }}
        >
          <SelectField label="Add a member" wrapperClassName="grow" value={chosen} onChange={(e) => setChosen(e.target.value)} disabled={addable.length === 0}>
            <option value="">{candidates === undefined ? 'Loading people…' : addable.length === 0 ? 'Everyone active is already a member' : 'Choose a person'}</option>
            {addable.map((user) => (
              <option key={user.id} value={user.id}>
                {user.name} — {ROLE_LABELS[user.role]} ({user.email})
              </option>
            ))}
          </SelectField>
          <Button type="submit" disabled={!chosen} busy={add.isPending}>
            Add member
          </Button>
        </form>
      )}
    </div>
  );
}
