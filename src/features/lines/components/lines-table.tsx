import { Link } from 'react-router-dom';
import type { LineDto } from '@shared/api';
import type { LinearUnit, LineStatus } from '@shared/domain';
import { UNIT_SYMBOLS } from '@shared/units';
import { KindSwatch } from '@/components/kind-swatch';
import { QualityLevelBadge } from '@/components/quality-level';
import { DataTable, type Column } from '@/components/ui/data-table';
import { Badge } from '@/components/ui/states';
import { formatLength, formatSize } from '@/lib/format';

export const LINE_STATUS_LABELS: Record<LineStatus, string> = { active: 'Active', abandoned: 'Abandoned', unknown: 'Status unknown' };

/** Outside size of a line: diameter, or width × height for a box. */
export function lineSize(line: LineDto, unit: LinearUnit): string {
  if (line.shape === 'box') {
    if (line.width == null || line.height == null) return '—';
    return `${formatLength(line.width, unit, 3)} × ${formatLength(line.height, unit, 3)} box`;
  }
  return formatSize(line.diameter, unit);
}

function requirement(line: LineDto, unit: LinearUnit): string {
  if (line.requiredVertical == null && line.requiredHorizontal == null) return 'Project rule';
  const parts = [];
  if (line.requiredVertical != null) parts.push(`V ${formatLength(line.requiredVertical, unit)}`);
  if (line.requiredHorizontal != null) parts.push(`H ${formatLength(line.requiredHorizontal, unit)}`);
  return parts.join(' · ');
}

/** The register of existing lines; each label opens the line's page. Sizes and depths are in the project unit. */
export function LinesTable({ lines, unit, projectId }: { lines: LineDto[]; unit: LinearUnit; projectId: number }) {
  const columns: Column<LineDto>[] = [
    {
      key: 'label',
      header: 'Label',
      cell: (l) => (
        <Link to={`/projects/${projectId}/lines/${l.id}`} className="font-semibold text-brand-700 underline-offset-2 hover:underline">
          {l.label}
        </Link>
      ),
      wrap: true,
    },
    { key: 'kind', header: 'Kind', cell: (l) => <KindSwatch kind={l.kind} /> },
    { key: 'owner', header: 'Owner', cell: (l) => l.owner, wrap: true },
    { key: 'size', header: 'Outside size', cell: (l) => lineSize(l, unit), numeric: true },
    { key: 'material', header: 'Material', cell: (l) => l.material ?? '—' },
    {
      key: 'status',
      header: 'Status',
      cell: (l) => <Badge className={l.status === 'active' ? 'bg-ok-50 text-ok-700' : undefined}>{LINE_STATUS_LABELS[l.status]}</Badge>,
    },
    { key: 'ql', header: 'Quality level', cell: (l) => <QualityLevelBadge level={l.qualityLevel} /> },
    {
      key: 'depth',
      header: <span title="Assumed depth to top of line where no test hole exists">Record depth to top ({UNIT_SYMBOLS[unit]})</span>,
      cell: (l) => formatLength(l.recordDepth, unit),
      numeric: true,
    },
    { key: 'req', header: 'Owner’s clearance', cell: (l) => requirement(l, unit) },
  ];
  return <DataTable caption="Existing lines" columns={columns} rows={lines} rowKey={(l) => l.id} />;
}
