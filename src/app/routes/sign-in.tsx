import { Navigate, useNavigate, useSearchParams } from 'react-router-dom';
import { Loading } from '@/components/ui/states';
import { useSession } from '@/features/auth/api/get-session';
import { SignInForm } from '@/features/auth/components/sign-in-form';
import { Logo } from '../layout/logo';

/** Only local paths are followed after sign-in (no open redirect); by default the landing page picks (routes/landing.tsx). */
function safeNext(next: string | null): string {
  return next && next.startsWith('/') && !next.startsWith('//') ? next : '/';
}

/** Sign-in page; returns the user to where they were headed. */
export default function SignInRoute() {
  const session = useSession();
  const navigate = useNavigate();
  const [params] = useSearchParams();
  const next = safeNext(params.get('next'));

  if (session.isPending) return <Loading label="Opening Threadline…" className="justify-center py-24" />;
  if (session.data) return <Navigate to={next} replace />;

  return (
    <main className="flex min-h-dvh items-start justify-center bg-brand-950 px-4 py-10 sm:items-center">
      <div className="w-full max-w-sm">
        <div className="mb-6 flex items-center justify-center gap-2 text-white">
          <Logo className="size-9 text-brand-200" />
          <span className="text-2xl font-semibold tracking-tight">Threadline</span>
        </div>
        <section className="rounded-xl bg-white p-6 shadow-lg" aria-labelledby="sign-in-heading">
          <h1 id="sign-in-heading" className="text-lg font-semibold text-ink-900">
            Sign in
          </h1>
          <p className="mb-5 text-sm text-ink-600">Buried lines, test holes and bore clearances for your projects.</p>
          <SignInForm onSignedIn={() => navigate(next, { replace: true })} />
        </section>
        <p className="mt-4 text-center text-xs text-brand-200">
          Accounts are created by your office’s Threadline administrator. If you have forgotten your password, ask them to set a new one.
        </p>
      </div>
    </main>
  );
}
