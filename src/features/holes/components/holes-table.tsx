import type { HoleDto } from '@shared/api';
import type { HoleStatus, LineKind, LinearUnit, StationStyle } from '@shared/domain';
import { UNIT_SYMBOLS } from '@shared/units';
import { KindSwatch } from '@/components/kind-swatch';
import { DataTable, type Column } from '@/components/ui/data-table';
import { Badge } from '@/components/ui/states';
import { formatCoordinate, formatDateTime, formatLength, formatOffset, formatStation } from '@/lib/format';

export const HOLE_STATUS_LABELS: Record<HoleStatus, string> = {
  planned: 'Planned',
  dug: 'Dug',
  surveyed: 'Surveyed',
  reviewed: 'Reviewed',
};

const HOLE_STATUS_TONES: Record<HoleStatus, string> = {
  planned: 'bg-ink-100 text-ink-700',
  dug: 'bg-caution-100 text-caution-800',
  surveyed: 'bg-brand-100 text-brand-800',
  reviewed: 'bg-ok-100 text-ok-700',
};

export function HoleStatusBadge({ status }: { status: HoleStatus }) {
  return <Badge className={HOLE_STATUS_TONES[status]}>{HOLE_STATUS_LABELS[status]}</Badge>;
}

const SOURCE_LABELS = { grid: 'typed E/N', station: 'station/offset', gps: 'phone GPS', map: 'picked on map', survey: 'surveyed' } as const;

export interface HoleTableContext {
  unit: LinearUnit;
  datum: string;
  stationStyle: StationStyle;
  lines: Map<number, { label: string; kind: LineKind }>;
  bores: Map<number, string>;
}

function Position({ hole, ctx }: { hole: HoleDto; ctx: HoleTableContext }) {
  const source = SOURCE_LABELS[hole.positionSource];
  const approx = hole.approximate ? (
    <Badge className="ml-1 bg-caution-100 text-caution-800" title="Approximate position">
      approx.{hole.gpsAccuracy != null ? ` ±${formatLength(hole.gpsAccuracy, ctx.unit, 1)}` : ''}
    </Badge>
  ) : null;
  if (hole.station != null && hole.boreId != null) {
    return (
      <span>
        Sta. {formatStation(hole.station, ctx.stationStyle)}, {formatOffset(hole.offset, hole.offsetSide, ctx.unit)}
        <span className="block text-xs text-ink-500">
          on {ctx.bores.get(hole.boreId) ?? `bore ${hole.boreId}`} · {source}
        </span>
        {approx}
      </span>
    );
  }
  return (
    <span>
      E {formatCoordinate(hole.easting, ctx.unit)}
      <br />N {formatCoordinate(hole.northing, ctx.unit)}
      <span className="block text-xs text-ink-500">{source}</span>
      {approx}
    </span>
  );
}

const REFERENCE_LABELS = { top: 'to top', centre: 'to centre', bottom: 'to bottom' } as const;

/** Top of line: the surveyed value wins; else ground − depth when the depth was taken to the top. */
function topOfLine(hole: HoleDto, ctx: HoleTableContext) {
  if (hole.surveyedTopElevation != null) {
    return (
      <span>
        {formatLength(hole.surveyedTopElevation, ctx.unit)}
        <span className="block text-xs text-ink-500">surveyed</span>
      </span>
    );
  }
  if (hole.groundElevation != null && hole.depthToTop != null && hole.depthReference === 'top') {
    return (
      <span>
        {formatLength(hole.groundElevation - hole.depthToTop, ctx.unit)}
        <span className="block text-xs text-ink-500">ground − depth</span>
      </span>
    );
  }
  return '—';
}

/** Test holes, read-only: number, line, status, position, elevations (with datum) and who dug when. */
export function HolesTable({ holes, ctx }: { holes: HoleDto[]; ctx: HoleTableContext }) {
  const u = UNIT_SYMBOLS[ctx.unit];
  const columns: Column<HoleDto>[] = [
    { key: 'number', header: 'Hole', cell: (h) => h.number },
    {
      key: 'line',
      header: 'Line exposed',
      wrap: true,
      cell: (h) => {
        const line = ctx.lines.get(h.lineId);
        return line ? (
          <span className="inline-flex flex-col">
            <span className="font-medium">{line.label}</span>
            <span className="text-xs text-ink-600">
              <KindSwatch kind={line.kind} />
            </span>
          </span>
        ) : (
          `Line ${h.lineId}`
        );
      },
    },
    { key: 'status', header: 'Status', cell: (h) => <HoleStatusBadge status={h.status} /> },
    { key: 'position', header: 'Position', cell: (h) => <Position hole={h} ctx={ctx} /> },
    {
      key: 'ground',
      header: (
        <>
          Ground elev.
          <span className="block font-normal normal-case">
            {u}, {ctx.datum}
          </span>
        </>
      ),
      cell: (h) =>
        h.surveyedGroundElevation != null ? (
          <span>
            {formatLength(h.surveyedGroundElevation, ctx.unit)}
            <span className="block text-xs text-ink-500">surveyed</span>
          </span>
        ) : (
          formatLength(h.groundElevation, ctx.unit)
        ),
      numeric: true,
    },
    {
      key: 'depth',
      header: (
        <>
          Depth below ground<span className="block font-normal normal-case">{u}</span>
        </>
      ),
      cell: (h) =>
        h.depthToTop == null ? (
          '—'
        ) : (
          <span>
            {formatLength(h.depthToTop, ctx.unit)}
            <span className="block text-xs text-ink-500">{REFERENCE_LABELS[h.depthReference]}</span>
          </span>
        ),
      numeric: true,
    },
    {
      key: 'top',
      header: (
        <>
          Top of line elev.
          <span className="block font-normal normal-case">
            {u}, {ctx.datum}
          </span>
        </>
      ),
      cell: (h) => topOfLine(h, ctx),
      numeric: true,
    },
    { key: 'crew', header: 'Crew', cell: (h) => h.crew ?? '—' },
    { key: 'dug', header: 'Dug at', cell: (h) => formatDateTime(h.dugAt) },
    { key: 'photos', header: 'Photos', cell: (h) => h.photoCount, numeric: true },
  ];
  return <DataTable caption="Test holes" columns={columns} rows={holes} rowKey={(h) => h.id} />;
}
