import type { ActivityDto } from '@shared/api';
import type { LinearUnit, StationStyle } from '@shared/domain';
import { formatCoordinate, formatDateTime, formatElevation, formatLength, formatStation } from '@/lib/format';

const ENTITY_LABELS: Record<string, string> = {
  project: 'project',
  member: 'member',
  bore: 'bore',
  pit: 'pit',
  line: 'line',
  hole: 'test hole',
  photo: 'photo',
  rule: 'clearance rule',
  conflict: 'conflict',
  user: 'user',
};

const ACTION_LABELS: Record<string, string> = {
  create: 'created',
  update: 'changed',
  delete: 'deleted',
  survey: 'entered survey values on',
  review: 'reviewed',
  add: 'added',
  remove: 'removed',
  'survey-import': 'imported survey shots onto',
  accept: 'accepted and locked',
  send_back: 'sent back',
  reopen: 'reopened',
  'photo-add': 'added photos to',
  'photo-caption': 'changed a photo caption on',
  'photo-delete': 'deleted a photo of',
};

/** Bookkeeping a reader has no use for (ids, client-made ids, timestamps, versions, counts). */
const HIDDEN = new Set(['id', 'projectId', 'clientId', 'createdById', 'uploadedById', 'createdAt', 'updatedAt', 'version', 'photoCount']);

const LENGTHS = new Set([
  'vertical', 'horizontal', 'depthToTop', 'depthToBottom', 'measuredSize', 'boxWidth', 'boxHeight', 'diameter', 'width', 'height',
  'recordDepth', 'requiredVertical', 'requiredHorizontal', 'casingOd', 'carrierSize', 'toleranceHorizontal', 'toleranceVertical',
  'minCover', 'offset', 'gpsAccuracy',
]);
const COORDINATES = new Set(['easting', 'northing', 'surveyedEasting', 'surveyedNorthing']);
const STATIONS = new Set(['station', 'beginStation']);
const ELEVATIONS = new Set(['groundElevation', 'surveyedTopElevation', 'surveyedGroundElevation', 'bottomElevation']);
const ISO_TIME = /^\d{4}-\d\d-\d\dT\d\d:\d\d/;

/** What the list needs to put figures in the project's own terms. */
export interface ActivityContext {
  unit: LinearUnit;
  datum: string;
  stationStyle: StationStyle;
  lineLabel: (id: number) => string;
  boreName: (id: number) => string;
  /** A feature's own wording for its fields (e.g. test holes); null to use the general one. */
  formatField?: (entity: string, field: string, value: unknown) => string | null;
  fieldLabel?: (entity: string, field: string) => string | null;
}

/** `depthToTop` → `depth to top`. */
function fieldName(field: string): string {
  return field
    .replace(/_/g, ' ')
    .replace(/([a-z0-9])([A-Z])/g, '$1 $2')
    .toLowerCase();
}

function show(entity: string, field: string, value: unknown, ctx: ActivityContext): string {
  if (value === null || value === undefined || value === '') return '—';
  const own = ctx.formatField?.(entity, field, value);
  if (own != null) return own;
  if (typeof value === 'number') {
    if (field === 'lineId') return ctx.lineLabel(value);
    if (field === 'boreId') return ctx.boreName(value);
    if (STATIONS.has(field)) return formatStation(value, ctx.stationStyle);
    if (ELEVATIONS.has(field)) return formatElevation(value, ctx.unit, ctx.datum);
    if (COORDINATES.has(field)) return formatCoordinate(value, ctx.unit);
    if (LENGTHS.has(field)) return formatLength(value, ctx.unit);
    return String(value);
  }
  if (typeof value === 'boolean') return value ? 'Yes' : 'No';
  if (typeof value === 'string') return ISO_TIME.test(value) ? formatDateTime(value) : value;
  if (field === 'path' && Array.isArray(value)) return `${value.length} vertices`;
  const json = JSON.stringify(value);
  return json.length > 120 ? `${json.slice(0, 117)}…` : json;
}

/** "test hole TH-03", "line W-1", "bore Bore 1": the record's own name when the entry carries it. */
function recordName(entry: ActivityDto): string {
  const kind = ENTITY_LABELS[entry.entity] ?? entry.entity;
  for (const key of ['number', 'label', 'name', 'email']) {
    const c = entry.changes?.[key];
    const name = c ? (c.after ?? c.before) : undefined;
    if (typeof name === 'string' && name !== '') return `${kind} ${name}`;
  }
  return entry.entityId != null ? `${kind} #${entry.entityId}` : kind;
}

/** Who did what to which record: each changed field before and after, in the project's unit, datum and station style; a creation lists its values folded away. */
export function ActivityList({ items, ctx }: { items: ActivityDto[]; ctx: ActivityContext }) {
  const label = (entity: string, field: string) => ctx.fieldLabel?.(entity, field) ?? fieldName(field);
  return (
    <ol className="divide-y divide-ink-100 rounded-lg border border-ink-200 bg-white">
      {items.map((entry) => {
        const changes = Object.entries(entry.changes ?? {}).filter(([field]) => !HIDDEN.has(field));
        const created = entry.action === 'create';
        const values = created ? changes.filter(([, c]) => c.after !== null && c.after !== '') : changes;
        const rows = (
          <dl className="mt-2 grid gap-x-4 gap-y-1 text-xs sm:grid-cols-[max-content_1fr]">
            {values.map(([field, change]) => (
              <div key={field} className="contents">
                <dt className="font-medium text-ink-600">{label(entry.entity, field)}</dt>
                <dd className="break-words text-ink-800">
                  {created ? (
                    show(entry.entity, field, change.after, ctx)
                  ) : (
                    <>
                      <del className="text-ink-500 decoration-ink-400">{show(entry.entity, field, change.before, ctx)}</del>
                      <span aria-hidden> → </span>
                      <span className="sr-only"> changed to </span>
                      <ins className="no-underline">{show(entry.entity, field, change.after, ctx)}</ins>
                    </>
                  )}
                </dd>
              </div>
            ))}
          </dl>
        );
        return (
          <li key={entry.id} className="px-4 py-3">
            <p className="text-sm text-ink-900">
              <span className="font-medium">{entry.userName ?? 'System'}</span> {ACTION_LABELS[entry.action] ?? entry.action} {recordName(entry)}
            </p>
            <p className="text-xs text-ink-500">
              <time dateTime={entry.at}>{formatDateTime(entry.at)}</time>
            </p>
            {values.length > 0 &&
              (created ? (
                <details className="text-sm">
                  <summary className="min-h-10 cursor-pointer py-2 text-brand-700">Values ({values.length})</summary>
                  {rows}
                </details>
              ) : (
                rows
              ))}
          </li>
        );
      })}
    </ol>
  );
}
