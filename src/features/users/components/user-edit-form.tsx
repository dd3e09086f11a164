import type { UserDto } from '@shared/api';
import { userUpdateSchema } from '@shared/schemas/auth';
import { ProblemAlert } from '@/components/ui/alert';
import { TextField } from '@/components/ui/field';
import { FormActions, saveErrorHandler } from '@/components/ui/form';
import { useZodForm } from '@/lib/form';
import { useUpdateUser } from '../api/update-user';
import { RoleField } from './role-field';

const FIELDS = ['name', 'role', 'password'] as const;
const emptyToUndefined = (value: unknown) => (value === '' ? undefined : value);

/** Edit one account's name, role or password. Your own role cannot be changed here. */
export function UserEditForm({ user, isSelf, onDone }: { user: UserDto; isSelf: boolean; onDone: () => void }) {
  const update = useUpdateUser();
  const valuesOf = (u: UserDto) => ({ name: u.name, role: u.role, password: undefined, version: u.version });
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isDirty },
  } = useZodForm(userUpdateSchema, { defaultValues: valuesOf(user) });

  const onSubmit = handleSubmit((values) =>
    update.mutate(
      { userId: user.id, input: { ...values, role: isSelf ? undefined : values.role } },
      {
        onSuccess: onDone,
        // Someone else saved first: show their version (and carry its version number) before a retry.
        onError: saveErrorHandler(setError, FIELDS, (current: UserDto) => reset(valuesOf(current))),
      },
    ),
  );

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label={`Edit ${user.name}`}>
      {update.error && <ProblemAlert error={update.error} fields={FIELDS} />}
      <div className="grid gap-4 sm:grid-cols-3">
        <TextField label="Name" required error={errors.name} {...register('name')} />
        <RoleField disabled={isSelf} hint={isSelf ? 'Another administrator must change your role.' : undefined} error={errors.role} {...register('role')} />
        <TextField
          label="New password"
          type="password"
          autoComplete="new-password"
          hint="Leave empty to keep the current one."
          error={errors.password}
          {...register('password', { setValueAs: emptyToUndefined })}
        />
      </div>
      <FormActions submitLabel="Save" busy={update.isPending} submitDisabled={!isDirty} onCancel={onDone} />
    </form>
  );
}
