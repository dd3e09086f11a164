import { loginSchema } from '@shared/schemas/auth';
import { ProblemAlert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { applyServerErrors, useZodForm } from '@/lib/form';
import { useLogin } from '../api/login';

/** E-mail and password form; calls `onSignedIn` once the session exists. */
export function SignInForm({ onSignedIn }: { onSignedIn: () => void }) {
  const login = useLogin();
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useZodForm(loginSchema, { defaultValues: { email: '', password: '' } });

  const onSubmit = handleSubmit((values) =>
    login.mutate(values, {
      onSuccess: onSignedIn,
      onError: (error) => applyServerErrors(error, setError, ['email', 'password']),
    }),
  );

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      {login.error && <ProblemAlert error={login.error} fields={['email', 'password']} />}
      <TextField label="Email" type="email" autoComplete="username" inputMode="email" autoCapitalize="none" spellCheck={false} required error={errors.email} {...register('email')} />
      <TextField label="Password" type="password" autoComplete="current-password" required error={errors.password} {...register('password')} />
      <Button type="submit" className="w-full" busy={login.isPending}>
        Sign in
      </Button>
    </form>
  );
}
