import type { ActivityDto } from '@shared/api';
import { formatDateTime } from '@/lib/format';
import { HISTORY_FIELD_LABELS, formatHoleField, type FieldContext } from '../utils/hole-fields';

const ACTIONS: Record<string, string> = {
  create: 'logged the hole',
  update: 'changed',
  survey: 'entered survey values',
  'survey-import': 'imported survey shots',
  accept: 'accepted it; the hole is locked',
  send_back: 'sent it back',
  reopen: 'reopened it',
  delete: 'deleted the hole',
  'photo-add': 'added photos',
  'photo-caption': 'changed a photo caption',
  'photo-delete': 'deleted a photo',
};

/** Record keys that say nothing to a reader (ids, bookkeeping). */
const HIDDEN = new Set(['id', 'projectId', 'clientId', 'createdById', 'createdAt', 'updatedAt', 'version', 'photoCount']);

interface PhotoSummary {
  id: number;
  caption: string | null;
}

function photoWords(list: unknown): string {
  const photos = (Array.isArray(list) ? list : list ? [list] : []) as PhotoSummary[];
  if (photos.length === 0) return '';
  const captions = photos.map((p) => (p.caption ? `“${p.caption}”` : 'no caption'));
  return `${photos.length === 1 ? '1 photo' : `${photos.length} photos`}: ${captions.join(', ')}`;
}

/**
 * A hole's history, newest first: who did what and when, and each field's value before and
 * after (lengths with the unit, elevations with the datum). A creation lists the values logged,
 * folded away.
 */
export function HoleActivity({ items, ctx }: { items: ActivityDto[]; ctx: FieldContext }) {
  const label = (key: string) => HISTORY_FIELD_LABELS[key] ?? (key.startsWith('caption (photo') ? 'Photo caption' : key);
  const show = (key: string, value: unknown) => formatHoleField(key.startsWith('caption (photo') ? 'caption' : key, value, ctx);
  return (
    <ol className="divide-y divide-ink-100">
      {items.map((entry) => {
        const changes = Object.entries(entry.changes ?? {}).filter(([k]) => !HIDDEN.has(k));
        let detail: React.ReactNode = null;
        if (entry.action === 'photo-add') detail = <p className="text-sm text-ink-700">{photoWords(entry.changes.photos?.after)}</p>;
        else if (entry.action === 'photo-delete') detail = <p className="text-sm text-ink-700">{photoWords(entry.changes.photo?.before)}</p>;
        else if (entry.action === 'create') {
          const logged = changes.filter(([, c]) => c.after !== null && c.after !== '');
          detail = (
            <details className="text-sm">
              <summary className="min-h-10 cursor-pointer py-2 text-brand-700">Values logged ({logged.length})</summary>
              <dl className="grid grid-cols-[max-content_1fr] gap-x-3 gap-y-1 text-xs">
                {logged.map(([k, c]) => (
                  <div key={k} className="contents">
                    <dt className="text-ink-600">{label(k)}</dt>
                    <dd className="break-words">{show(k, c.after)}</dd>
                  </div>
                ))}
              </dl>
            </details>
          );
        } else if (changes.length > 0) {
          detail = (
            <dl className="mt-1 grid gap-x-4 gap-y-1 text-sm sm:grid-cols-[max-content_1fr]">
              {changes.map(([k, c]) => (
                <div key={k} className="contents">
                  <dt className="font-medium text-ink-600">{label(k)}</dt>
                  <dd className="break-words text-ink-800">
                    <del className="text-ink-500 decoration-ink-400">{show(k, c.before)}</del>
                    <span aria-hidden> → </span>
                    <span className="sr-only"> changed to </span>
                    <ins className="no-underline">{show(k, c.after)}</ins>
                  </dd>
                </div>
              ))}
            </dl>
          );
        }
        return (
          <li key={entry.id} className="py-3 first:pt-0 last:pb-0">
            <p className="text-sm">
              <span className="font-medium">{entry.userName ?? 'System'}</span> {ACTIONS[entry.action] ?? entry.action}
            </p>
            <p className="text-xs text-ink-500">
              <time dateTime={entry.at}>{formatDateTime(entry.at)}</time>
            </p>
            {detail}
          </li>
        );
      })}
    </ol>
  );
}
