import type { UserDto } from '@shared/api';
import { userCreateSchema } from '@shared/schemas/auth';
import { ProblemAlert } from '@/components/ui/alert';
import { TextField } from '@/components/ui/field';
import { FormActions, saveErrorHandler } from '@/components/ui/form';
import { useZodForm } from '@/lib/form';
import { useCreateUser } from '../api/create-user';
import { RoleField } from './role-field';

const FIELDS = ['email', 'name', 'role', 'password'] as const;

/** Add an account: e-mail, name, role and a first password to pass on privately. */
export function UserCreateForm({ onCreated, onCancel }: { onCreated: (user: UserDto) => void; onCancel: () => void }) {
  const create = useCreateUser();
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useZodForm(userCreateSchema, { defaultValues: { email: '', name: '', role: 'field', password: '' } });

  const onSubmit = handleSubmit((values) =>
    create.mutate(values, {
      onSuccess: onCreated,
      onError: saveErrorHandler(setError, FIELDS),
    }),
  );

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label="Add user">
      {create.error && <ProblemAlert error={create.error} fields={FIELDS} />}
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField label="Name" required autoComplete="off" error={errors.name} {...register('name')} />
        <TextField label="Email" type="email" required autoComplete="off" autoCapitalize="none" spellCheck={false} error={errors.email} {...register('email')} />
        <RoleField required error={errors.role} {...register('role')} />
        <TextField
          label="First password"
          type="password"
          required
          autoComplete="new-password"
          hint="At least 10 characters. Pass it on in person or by phone, not by e-mail."
          error={errors.password}
          {...register('password')}
        />
      </div>
      <FormActions submitLabel="Add user" busy={create.isPending} onCancel={onCancel} />
    </form>
  );
}
