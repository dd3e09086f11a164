import { useState } from 'react';
import { ProblemAlert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { EmptyState, Loading } from '@/components/ui/states';
import { useActivity } from '@/features/activity/api/get-activity';
import { ActivityList, type ActivityContext } from '@/features/activity/components/activity-list';
import { useBores } from '@/features/bores/api/get-bores';
import { HISTORY_FIELD_LABELS, formatHoleField } from '@/features/holes/utils/hole-fields';
import { useLines } from '@/features/lines/api/get-lines';
import { useWorkspace } from './workspace-context';

const PAGE_SIZE = 25;

/** Activity: every change to the project's records, newest first, a page at a time. */
export default function ActivityTab() {
  const { project } = useWorkspace();
  const [offset, setOffset] = useState(0);
  const activity = useActivity(project.id, { limit: PAGE_SIZE, offset });
  const lines = useLines(project.id);
  const bores = useBores(project.id);
  const base = {
    unit: project.unit,
    datum: project.verticalDatum,
    stationStyle: project.stationStyle,
    lineLabel: (id: number) => lines.data?.find((l) => l.id === id)?.label ?? `line ${id}`,
    boreName: (id: number) => bores.data?.find((b) => b.id === id)?.name ?? `bore ${id}`,
  };
  // Test holes have their own words for their fields (the hole page's history uses the same).
  const ctx: ActivityContext = {
    ...base,
    formatField: (entity, field, value) => (entity === 'hole' ? formatHoleField(field, value, base) : null),
    fieldLabel: (entity, field) => (entity === 'hole' ? (HISTORY_FIELD_LABELS[field] ?? null) : null),
  };

  let body;
  if (activity.isPending) body = <Loading label="Loading activity…" />;
  else if (activity.isError) body = <ProblemAlert error={activity.error} />;
  else if (activity.data.total === 0)
    body = (
      <EmptyState title="No activity yet">
        <p>Every change to this project’s records will be listed here: who made it, when, and each field’s value before and after.</p>
      </EmptyState>
    );
  else {
    const { items, total } = activity.data;
    const first = offset + 1;
    const last = offset + items.length;
    body = (
      <div className="space-y-3" aria-busy={activity.isPlaceholderData || undefined}>
        <ActivityList items={items} ctx={ctx} />
        <nav aria-label="Activity pages" className="flex flex-wrap items-center justify-between gap-2">
          <p className="text-sm text-ink-600" aria-live="polite">
            {first}–{last} of {total}
          </p>
          <div className="flex gap-2">
            <Button variant="secondary" disabled={offset === 0 || activity.isPlaceholderData} onClick={() => setOffset(Math.max(0, offset - PAGE_SIZE))}>
              Newer
            </Button>
            <Button variant="secondary" disabled={last >= total || activity.isPlaceholderData} onClick={() => setOffset(offset + PAGE_SIZE)}>
              Older
            </Button>
          </div>
        </nav>
      </div>
    );
  }

  return (
    <div className="space-y-4">
      <h2 className="text-lg font-semibold">Activity</h2>
      {body}
    </div>
  );
}
