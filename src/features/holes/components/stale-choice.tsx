import { useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { CompareTable } from '@/components/ui/compare-table';
import { Button } from '@/components/ui/button';

/** One field where the user's value and the saved value differ. */
export interface StaleRow {
  key: string;
  label: string;
  mine: string;
  theirs: string;
  /** True when the other person changed this field too (the user must choose). */
  bothChanged: boolean;
}

/**
 * After a 409 stale version: each field the user changed, their value beside the value now
 * saved, and a choice per field. Fields only the user changed start on "yours"; fields both
 * changed must be chosen. Fields only the other person changed are listed and kept.
 */
export function StaleChoice({
  rows,
  theirOnly,
  savedBy,
  busy,
  onResolve,
  onDiscard,
}: {
  rows: StaleRow[];
  theirOnly: { key: string; label: string; before: string; after: string }[];
  savedBy?: string;
  busy?: boolean;
  onResolve: (keepMine: string[]) => void;
  onDiscard: () => void;
}) {
  const [choice, setChoice] = useState<Record<string, 'mine' | 'theirs' | undefined>>(() =>
    Object.fromEntries(rows.map((r) => [r.key, r.bothChanged ? undefined : 'mine'])),
  );
  const open = rows.filter((r) => choice[r.key] === undefined);
  return (
    <section aria-label="Resolve the edit conflict" className="space-y-3 rounded-lg border-2 border-caution-300 bg-caution-50 p-4">
      <Alert tone="caution" title="Someone else saved this hole while you were editing">
        <p>
          Nothing of yours is saved yet. {savedBy ? `${savedBy} saved a newer version. ` : ''}For each field you changed, keep your value or take the one
          now saved, then save again.
        </p>
      </Alert>
      {rows.length > 0 && (
        <CompareTable>
          {rows.map((r) => (
            <tr key={r.key} className="border-t border-caution-300/60 align-top">
              <th scope="row" className="py-2 pr-2 text-left font-medium">
                {r.label}
                {r.bothChanged && <span className="block text-xs font-normal text-caution-800">both of you changed it</span>}
              </th>
              <td className="py-2 pr-2">
                <label className="flex min-h-11 cursor-pointer items-start gap-2">
                  <input
                    type="radio"
                    name={`stale-${r.key}`}
                    className="mt-0.5 size-5 accent-brand-700"
                    checked={choice[r.key] === 'mine'}
                    onChange={() => setChoice({ ...choice, [r.key]: 'mine' })}
                    aria-label={`${r.label}: keep yours, ${r.mine}`}
                  />
                  <span className="break-words">{r.mine}</span>
                </label>
              </td>
              <td className="py-2">
                <label className="flex min-h-11 cursor-pointer items-start gap-2">
                  <input
                    type="radio"
                    name={`stale-${r.key}`}
                    className="mt-0.5 size-5 accent-brand-700"
                    checked={choice[r.key] === 'theirs'}
                    onChange={() => setChoice({ ...choice, [r.key]: 'theirs' })}
                    aria-label={`${r.label}: take the saved value, ${r.theirs}`}
                  />
                  <span className="break-words">{r.theirs}</span>
                </label>
              </td>
            </tr>
          ))}
        </CompareTable>
      )}
      {theirOnly.length > 0 && (
        <div className="text-sm">
          <p className="font-medium">Also changed by the other person (kept):</p>
          <ul className="mt-1 list-disc pl-5 text-ink-700">
            {theirOnly.map((t) => (
              <li key={t.key}>
                {t.label}: {t.before} → {t.after}
              </li>
            ))}
          </ul>
        </div>
      )}
      <div className="flex flex-wrap gap-2">
        <Button busy={busy} disabled={open.length > 0} onClick={() => onResolve(rows.filter((r) => choice[r.key] === 'mine').map((r) => r.key))}>
          Save with these choices
        </Button>
        <Button variant="secondary" onClick={onDiscard}>
          Drop my changes
        </Button>
        {open.length > 0 && <p className="self-center text-xs text-caution-900">Choose a value for: {open.map((r) => r.label).join(', ')}.</p>}
      </div>
    </section>
  );
}
