import type { ReactNode } from 'react';
import type { HoleDto, LineDto, ProjectDto } from '@shared/api';
import { UNIT_SYMBOLS } from '@shared/units';
import { KindSwatch } from '@/components/kind-swatch';
import { QualityLevelBadge } from '@/components/quality-level';
import { Badge } from '@/components/ui/states';
import { formatCoordinate, formatDateTime, formatElevation, formatLength, formatSize } from '@/lib/format';
import { describePosition, type FieldContext } from '../utils/hole-fields';
import { METHOD_LABELS, REFERENCE_LABELS } from '../utils/labels';
import { topOfLine } from './holes-table';

function Surveyed() {
  return <Badge className="ml-1.5 bg-brand-100 text-brand-800" title="Value from the surveyor's tie-in">surveyed</Badge>;
}

function Fact({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div className="grid grid-cols-[9.5rem_1fr] gap-2 border-b border-ink-100 py-2 last:border-b-0 sm:grid-cols-[12rem_1fr]">
      <dt className="text-sm text-ink-600">{label}</dt>
      <dd className="text-sm text-ink-900">{children}</dd>
    </div>
  );
}

/** Everything logged and surveyed on a hole, each number with its unit and each elevation with its datum. */
export function HoleFacts({ hole, line, project, ctx }: { hole: HoleDto; line: LineDto | undefined; project: ProjectDto; ctx: FieldContext }) {
  const u = project.unit;
  const datum = project.verticalDatum;
  const top = topOfLine(hole);
  return (
    <div className="grid gap-4 lg:grid-cols-2">
      <section aria-label="Line and position" className="rounded-lg border border-ink-200 bg-white px-4 py-2">
        <dl>
          <Fact label="Line exposed">
            {line ? (
              <span className="inline-flex flex-col gap-0.5">
                <span className="font-medium">{line.label}</span>
                <span className="flex flex-wrap items-center gap-2 text-xs text-ink-600">
                  <KindSwatch kind={line.kind} /> <QualityLevelBadge level={line.qualityLevel} /> {line.owner}
                </span>
              </span>
            ) : (
              `Line ${hole.lineId}`
            )}
          </Fact>
          <Fact label="Position as logged">
            {describePosition(hole, ctx)}
            {hole.approximate && <Badge className="ml-1.5 bg-caution-100 text-caution-800">approximate</Badge>}
            {hole.positionSource === 'station' && (
              <span className="block text-xs text-ink-500">
                E {formatCoordinate(hole.easting, u)}, N {formatCoordinate(hole.northing, u)}
              </span>
            )}
          </Fact>
          <Fact label="Surveyed position">
            {hole.surveyedEasting != null && hole.surveyedNorthing != null ? (
              <>
                E {formatCoordinate(hole.surveyedEasting, u)}, N {formatCoordinate(hole.surveyedNorthing, u)}
                <Surveyed />
              </>
            ) : (
              <span className="text-ink-500">not surveyed yet</span>
            )}
          </Fact>
          <Fact label="Grid">
            {project.crsCode}, {UNIT_SYMBOLS[u]}
          </Fact>
        </dl>
      </section>

      <section aria-label="Depth and elevation" className="rounded-lg border border-ink-200 bg-white px-4 py-2">
        <dl>
          <Fact label="Ground elevation">
            {hole.surveyedGroundElevation != null ? (
              <>
                {formatElevation(hole.surveyedGroundElevation, u, datum)}
                <Surveyed />
                {hole.groundElevation != null && <span className="block text-xs text-ink-500">logged {formatElevation(hole.groundElevation, u, datum)}</span>}
              </>
            ) : (
              formatElevation(hole.groundElevation, u, datum)
            )}
          </Fact>
          <Fact label="Depth below ground">
            {hole.depthToTop == null ? '—' : `${formatLength(hole.depthToTop, u)}, measured ${REFERENCE_LABELS[hole.depthReference]} of line`}
          </Fact>
          <Fact label="Depth to bottom">{formatLength(hole.depthToBottom, u)}</Fact>
          <Fact label="Top of line elevation">
            {top ? (
              <>
                {formatElevation(top.value, u, datum)}
                {top.source === 'surveyed' ? <Surveyed /> : <span className="block text-xs text-ink-500">ground − depth</span>}
              </>
            ) : (
              <span className="text-ink-500">{hole.depthToTop != null && hole.depthReference !== 'top' ? 'depth not taken to the top; needs the survey' : '—'}</span>
            )}
          </Fact>
        </dl>
      </section>

      <section aria-label="The line as found" className="rounded-lg border border-ink-200 bg-white px-4 py-2">
        <dl>
          <Fact label="Size">
            {hole.boxWidth != null || hole.boxHeight != null
              ? `Box ${formatLength(hole.boxWidth, u)} wide × ${formatLength(hole.boxHeight, u)} high`
              : hole.measuredSize != null
                ? `${formatSize(hole.measuredSize, u)} outside diameter`
                : '—'}
          </Fact>
          <Fact label="Material">{hole.material ?? '—'}</Fact>
          <Fact label="Condition">{hole.condition ?? '—'}</Fact>
          <Fact label="Direction of run">{hole.direction ?? '—'}</Fact>
        </dl>
      </section>

      <section aria-label="Digging record" className="rounded-lg border border-ink-200 bg-white px-4 py-2">
        <dl>
          <Fact label="Dug at">{formatDateTime(hole.dugAt)}</Fact>
          <Fact label="Crew">{hole.crew ?? '—'}</Fact>
          <Fact label="Method">{hole.method ? METHOD_LABELS[hole.method] : '—'}</Fact>
          <Fact label="One-call ticket">{hole.ticketNumber ?? '—'}</Fact>
          <Fact label="Surface">{hole.surfaceType ?? '—'}</Fact>
          <Fact label="Marker set">{hole.markerSet == null ? '—' : hole.markerSet ? 'Yes' : 'No'}</Fact>
          <Fact label="Soil">{hole.soil ?? '—'}</Fact>
          <Fact label="Groundwater">{hole.groundwater ?? '—'}</Fact>
          <Fact label="Restoration">{hole.restoration ?? '—'}</Fact>
          {hole.notes && <Fact label="Notes">{<span className="whitespace-pre-line">{hole.notes}</span>}</Fact>}
        </dl>
      </section>
    </div>
  );
}
