import type { ActivityDto } from '@shared/api';
import type { LinearUnit } from '@shared/domain';
import { UNIT_SYMBOLS } from '@shared/units';
import { formatDateTime } from '@/lib/format';

const ENTITY_LABELS: Record<string, string> = {
  project: 'project',
  member: 'member',
  bore: 'bore',
  pit: 'pit',
  line: 'line',
  hole: 'test hole',
  test_hole: 'test hole',
  testHole: 'test hole',
  photo: 'photo',
  rule: 'clearance rule',
  clearance_rule: 'clearance rule',
  clearanceRule: 'clearance rule',
  conflict: 'conflict',
  user: 'user',
};

const ACTION_LABELS: Record<string, string> = {
  create: 'created',
  created: 'created',
  update: 'changed',
  updated: 'changed',
  delete: 'deleted',
  deleted: 'deleted',
  survey: 'entered survey values on',
  review: 'reviewed',
  add: 'added',
  remove: 'removed',
  // Test-hole workflow and photos (issue 4).
  'survey-import': 'imported survey shots onto',
  accept: 'accepted and locked',
  send_back: 'sent back',
  reopen: 'reopened',
  'photo-add': 'added photos to',
  'photo-caption': 'changed a photo caption on',
  'photo-delete': 'deleted a photo of',
};

/** `depthToTop` / `depth_to_top` → `depth to top`. */
function fieldName(field: string): string {
  return field
    .replace(/_/g, ' ')
    .replace(/([a-z0-9])([A-Z])/g, '$1 $2')
    .toLowerCase();
}

/** Fields holding a length in the project unit, and those holding an elevation (unit and datum). */
const LENGTH_FIELDS = new Set([
  'vertical', 'horizontal', 'depthToTop', 'depthToBottom', 'measuredSize', 'boxWidth', 'boxHeight', 'diameter', 'width', 'height',
  'recordDepth', 'requiredVertical', 'requiredHorizontal', 'casingOd', 'carrierSize', 'toleranceHorizontal', 'toleranceVertical',
  'minCover', 'offset', 'gpsAccuracy', 'beginStation', 'station', 'easting', 'northing', 'surveyedEasting', 'surveyedNorthing',
]);
const ELEVATION_FIELDS = new Set(['groundElevation', 'surveyedTopElevation', 'surveyedGroundElevation', 'bottomElevation']);

function show(value: unknown, field: string, unit: LinearUnit, datum: string): string {
  if (value === null || value === undefined || value === '') return '—';
  if (typeof value === 'number') {
    if (ELEVATION_FIELDS.has(field)) return `${value} ${UNIT_SYMBOLS[unit]} ${datum}`;
    if (LENGTH_FIELDS.has(field)) return `${value} ${UNIT_SYMBOLS[unit]}`;
    return String(value);
  }
  if (typeof value === 'string' || typeof value === 'boolean') return String(value);
  const json = JSON.stringify(value);
  return json.length > 120 ? `${json.slice(0, 117)}…` : json;
}

/** Who did what to which record, with each changed field's value before and after (lengths with unit, elevations with datum). */
export function ActivityList({ items, unit, datum }: { items: ActivityDto[]; unit: LinearUnit; datum: string }) {
  return (
    <ol className="divide-y divide-ink-100 rounded-lg border border-ink-200 bg-white">
      {items.map((entry) => {
        const changes = Object.entries(entry.changes ?? {});
        return (
          <li key={entry.id} className="px-4 py-3">
            <p className="text-sm text-ink-900">
              <span className="font-medium">{entry.userName ?? 'System'}</span> {ACTION_LABELS[entry.action] ?? entry.action}{' '}
              {ENTITY_LABELS[entry.entity] ?? entry.entity}
              {entry.entityId != null && <span className="text-ink-500"> #{entry.entityId}</span>}
            </p>
            <p className="text-xs text-ink-500">
              <time dateTime={entry.at}>{formatDateTime(entry.at)}</time>
            </p>
            {changes.length > 0 && (
              <dl className="mt-2 grid gap-x-4 gap-y-1 text-xs sm:grid-cols-[max-content_1fr]">
                {changes.map(([field, change]) => (
                  <div key={field} className="contents">
                    <dt className="font-medium text-ink-600">{fieldName(field)}</dt>
                    <dd className="break-words text-ink-800">
                      <del className="text-ink-500 decoration-ink-400">{show(change.before, field, unit, datum)}</del>
                      <span aria-hidden> → </span>
                      <span className="sr-only"> changed to </span>
                      <ins className="no-underline">{show(change.after, field, unit, datum)}</ins>
                    </dd>
                  </div>
                ))}
              </dl>
            )}
          </li>
        );
      })}
    </ol>
  );
}
