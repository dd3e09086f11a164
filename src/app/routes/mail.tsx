import { can } from '@shared/permissions';
import { ProblemAlert } from '@/components/ui/alert';
import { EmptyState, Loading } from '@/components/ui/states';
import { useSignedInUser } from '@/features/auth/api/get-session';
import { useAdminMail } from '@/features/mail/api/get-admin-mail';
import { AdminMail } from '@/features/mail/components/admin-mail';

/** Mail (administrators only): the outbox and, in development, the messages the built-in server caught. */
export default function MailRoute() {
  const me = useSignedInUser();
  const allowed = can(me.role, 'mail.admin');
  const mail = useAdminMail({ enabled: allowed });
  if (!allowed) {
    return (
      <EmptyState title="Mail">
        <p>Only the administrator sees the outbox.</p>
      </EmptyState>
    );
  }
  return (
    <div className="space-y-5">
      <h1 className="text-2xl font-semibold tracking-tight">Mail</h1>
      {mail.isPending ? <Loading label="Loading mail…" /> : mail.isError ? <ProblemAlert error={mail.error} /> : <AdminMail data={mail.data} />}
    </div>
  );
}
