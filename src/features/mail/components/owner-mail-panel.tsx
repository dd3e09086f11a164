import { useState } from 'react';
import type { MailOwnersResultDto } from '@shared/api';
import { ACTIVE_CONFLICT_STATUSES } from '@shared/conflicts';
import { CONFLICT_STATUS_LABELS, CONFLICT_STATUSES, type ConflictStatus } from '@shared/domain';
import { Alert, ProblemAlert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { CheckboxField, TextAreaField } from '@/components/ui/field';
import { Panel } from '@/components/ui/states';
import { useMailOwners } from '../api/mail-owners';

/**
 * Mail each line owner's contact the conflicts on their lines, with the list attached: choose
 * the statuses, preview who gets what, untick anyone, send. Messages go through the outbox,
 * so they are kept and retried until the mail server takes them.
 */
export function OwnerMailPanel({ projectId, onClose }: { projectId: number; onClose: () => void }) {
  const mail = useMailOwners(projectId);
  const [statuses, setStatuses] = useState<ConflictStatus[]>([...ACTIVE_CONFLICT_STATUSES]);
  const [message, setMessage] = useState('');
  const [plan, setPlan] = useState<MailOwnersResultDto | null>(null);
  const [chosen, setChosen] = useState<Set<string>>(new Set());
  const [sent, setSent] = useState<MailOwnersResultDto | null>(null);

  const preview = () =>
    mail.mutate(
      { mode: 'preview', statuses, message: message || undefined },
      {
        onSuccess: (result) => {
          setPlan(result);
          setChosen(new Set(result.recipients.map((r) => r.to)));
          setSent(null);
        },
      },
    );
  const send = () =>
    mail.mutate({ mode: 'send', statuses, message: message || undefined, contacts: [...chosen] }, { onSuccess: (result) => { setSent(result); setPlan(null); } });

  return (
    <Panel title="Mail owners their conflicts" actions={<Button variant="ghost" size="sm" onClick={onClose}>Close</Button>}>
      <div className="space-y-4">
        {mail.error && <ProblemAlert error={mail.error} />}
        {sent && (
          <Alert tone="success" title={`Queued ${sent.recipients.length} ${sent.recipients.length === 1 ? 'message' : 'messages'}`}>
            <p>
              {sent.recipients.map((r) => r.to).join(', ')}. They leave as soon as the mail server accepts them and are retried while it is unreachable; the
              administrator sees each one under Mail. Each conflict’s “owner told” date and history now record the mailing.
            </p>
          </Alert>
        )}
        <fieldset>
          <legend className="text-sm font-medium text-ink-800">Conflicts in these statuses</legend>
          <div className="mt-1 flex flex-wrap gap-x-4">
            {CONFLICT_STATUSES.map((s) => (
              <CheckboxField
                key={s}
                label={CONFLICT_STATUS_LABELS[s]}
                checked={statuses.includes(s)}
                onChange={(e) => {
                  setPlan(null);
                  setStatuses(e.target.checked ? [...statuses, s] : statuses.filter((x) => x !== s));
                }}
              />
            ))}
          </div>
        </fieldset>
        <TextAreaField label="Message to the owners" hint="Optional; placed above the list in every message." value={message} onChange={(e) => setMessage(e.target.value)} />
        <Button variant="secondary" onClick={preview} busy={mail.isPending && !plan} disabled={statuses.length === 0}>
          Preview recipients
        </Button>

        {plan && (
          <div className="space-y-3">
            {plan.recipients.length === 0 ? (
              <Alert tone="caution">No conflict in these statuses is on a line with a contact e-mail.</Alert>
            ) : (
              <fieldset className="space-y-2">
                <legend className="text-sm font-medium text-ink-800">Who gets what</legend>
                {plan.recipients.map((r) => (
                  <div key={r.to} className="rounded-md border border-ink-200 p-3">
                    <CheckboxField
                      label={r.to}
                      hint={`${r.owners.join(', ')} · lines ${r.lines.map((l) => l.label).join(', ')} · ${r.conflicts.map((c) => c.number).join(', ')} · attached ${r.attachmentName}`}
                      checked={chosen.has(r.to)}
                      onChange={(e) => {
                        const next = new Set(chosen);
                        if (e.target.checked) next.add(r.to);
                        else next.delete(r.to);
                        setChosen(next);
                      }}
                    />
                  </div>
                ))}
              </fieldset>
            )}
            {plan.skipped.length > 0 && (
              <Alert tone="caution" title="Not mailed: no contact e-mail">
                <ul className="list-disc pl-5">
                  {plan.skipped.map((s) => (
                    <li key={s.owner}>
                      {s.owner} ({s.lines.join(', ')}; {s.conflicts.join(', ')})
                    </li>
                  ))}
                </ul>
                <p>Add a contact e-mail to the line under Lines to include them.</p>
              </Alert>
            )}
            {plan.recipients.length > 0 && (
              <Button onClick={send} busy={mail.isPending} disabled={chosen.size === 0}>
                Send to {chosen.size} {chosen.size === 1 ? 'owner' : 'owners'}
              </Button>
            )}
          </div>
        )}
      </div>
    </Panel>
  );
}
