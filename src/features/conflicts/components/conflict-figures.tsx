import { Link } from 'react-router-dom';
import type { ConflictRowDto } from '@shared/api';
import { LINE_STATUS_LABELS, type LinearUnit, type StationStyle } from '@shared/domain';
import { formatStation } from '@shared/geometry';
import { KindSwatch } from '@/components/kind-swatch';
import { QualityLevelBadge } from '@/components/quality-level';
import { Panel } from '@/components/ui/states';
import { formatDateTime, formatElevation, formatLength, formatOffset, formatSize } from '@/lib/format';

export interface FiguresFrame {
  projectId: number;
  unit: LinearUnit;
  datum: string;
  stationStyle: StationStyle;
}

function Row({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <div className="grid grid-cols-[minmax(8rem,40%)_1fr] gap-2 border-b border-ink-100 py-1.5 last:border-b-0">
      <dt className="text-sm text-ink-600">{label}</dt>
      <dd className="min-w-0 text-sm [overflow-wrap:anywhere] text-ink-900">{children}</dd>
    </div>
  );
}


/** Where the conflict is and how close it comes, from the last clearance check. */
export function ConflictFiguresPanel({ row, frame }: { row: ConflictRowDto; frame: FiguresFrame }) {
  const st = (v: number | null) => (v == null ? '—' : formatStation(v, frame.stationStyle));
  const range = row.stationFrom != null && row.stationTo != null && row.stationFrom !== row.stationTo ? `${st(row.stationFrom)} – ${st(row.stationTo)}` : null;
  return (
    <Panel title="Where and how close" headingLevel={3}>
      <dl>
        <Row label="Bore">{row.bore.name}</Row>
        <Row label="Relation">{row.relation === 'crossing' ? 'Crosses the bore' : row.relation === 'near' ? 'Runs near the bore' : 'Pit only'}</Row>
        <Row label="Station">
          {st(row.station)}
          {range && <span className="block text-xs text-ink-500">near the bore from {range}</span>}
        </Row>
        <Row label="Offset">{formatOffset(row.offset, row.side, frame.unit)}</Row>
        <Row label="Top of line">{formatElevation(row.lineTop, frame.unit, frame.datum)}</Row>
        <Row label={`Measured clearance (${row.governing ?? 'edge to edge'})`}>
          <span className={row.clearance != null && row.clearance < 0 ? 'font-semibold text-danger-700' : undefined}>{formatLength(row.clearance, frame.unit)}</span>
        </Row>
        <Row label="Required clearance">{formatLength(row.required, frame.unit)}</Row>
        <Row label="Margin">{formatLength(row.margin, frame.unit)}</Row>
        <Row label="Allowance">{formatLength(row.allowance, frame.unit)} <span className="text-xs text-ink-500">(bore tolerance + location uncertainty)</span></Row>
        <Row label="3-D clear distance">{formatLength(row.clearDistance3d, frame.unit)}</Row>
        {row.pits.map((p) => (
          <Row key={p.pitId} label={p.kind === 'launch' ? 'Launch pit' : 'Receiving pit'}>
            {p.enters ? 'The line enters the footprint' : `The line passes ${formatLength(p.planGap, frame.unit)} from the footprint`}
            {p.heightAbovePitBottom != null && <span className="block text-xs text-ink-500">{formatLength(p.heightAbovePitBottom, frame.unit)} above the pit bottom</span>}
          </Row>
        ))}
        <Row label="Last checked">{formatDateTime(row.checkedAt)}</Row>
      </dl>
    </Panel>
  );
}

/** The line in conflict: owner and contact, kind, size, material, quality level, test holes. */
export function ConflictLinePanel({ row, frame }: { row: ConflictRowDto; frame: FiguresFrame }) {
  const l = row.line;
  return (
    <Panel title={`Line ${l.label}`} headingLevel={3}>
      <dl>
        <Row label="Owner">{l.owner}</Row>
        <Row label="Contact">{l.contactEmail ? <a className="text-brand-700 underline" href={`mailto:${l.contactEmail}`}>{l.contactEmail}</a> : <span className="text-ink-500">none on record</span>}</Row>
        <Row label="Kind">
          <KindSwatch kind={l.kind} />
        </Row>
        <Row label="Size">{l.shape === 'box' ? `${formatLength(l.width, frame.unit)} × ${formatLength(l.height, frame.unit)} (box)` : formatSize(l.diameter, frame.unit)}</Row>
        <Row label="Material">{l.material ?? '—'}</Row>
        <Row label="Quality level">
          <QualityLevelBadge level={l.qualityLevel} />
        </Row>
        <Row label="Status">{LINE_STATUS_LABELS[l.status]}</Row>
        <Row label="Test holes">
          {row.holes.length === 0 ? (
            <span className="text-ink-500">none on this line</span>
          ) : (
            <ul className="flex flex-wrap gap-x-3 gap-y-1">
              {row.holes.map((h) => (
                <li key={h.id}>
                  <Link to={`/projects/${frame.projectId}/holes/${h.id}`} className="text-brand-700 underline-offset-2 hover:underline">
                    {h.number}
                  </Link>
                  {h.verifying && <span className="ml-1 text-xs text-ok-700">verifies</span>}
                </li>
              ))}
            </ul>
          )}
        </Row>
      </dl>
    </Panel>
  );
}
