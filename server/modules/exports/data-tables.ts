import { HOLE_STATUSES, LINE_KIND_LABELS, type LineKind } from '@shared/domain';
import { csvDocument, type CsvColumn } from './csv';
import type { HoleRow, LineRow, ProjectExportData } from './export-data';
import { headerBlock, isoSeconds, round4, stationText } from './export-header';

/** Lines and test holes as CSV, for the zip (the same conventions as every CSV export). */

export function linesCsv(data: ProjectExportData, kinds?: LineKind[]): string {
  const u = data.frame.unitSymbol;
  const rows = data.lines.filter((l) => !kinds?.length || kinds.includes(l.kind));
  const columns: CsvColumn<LineRow>[] = [
    { header: 'label', text: true, id: true, user: true, value: (l) => l.label },
    { header: 'owner', text: true, user: true, value: (l) => l.owner },
    { header: 'contact', text: true, user: true, value: (l) => l.contactEmail },
    { header: 'kind', text: true, value: (l) => LINE_KIND_LABELS[l.kind] },
    { header: 'shape', text: true, value: (l) => l.shape },
    { header: `diameter (${u})`, text: false, value: (l) => round4(l.diameter) },
    { header: `width (${u})`, text: false, value: (l) => round4(l.width) },
    { header: `height (${u})`, text: false, value: (l) => round4(l.height) },
    { header: 'material', text: true, user: true, value: (l) => l.material },
    { header: 'status', text: true, value: (l) => l.status },
    { header: 'quality level', text: true, value: (l) => l.qualityLevel },
    { header: `record depth to top (${u})`, text: false, value: (l) => round4(l.recordDepth) },
    { header: `path (easting northing; ${u})`, text: true, value: (l) => l.path.map(([e, n]) => `${round4(e)} ${round4(n)}`).join('; ') },
  ];
  return csvDocument(headerBlock(data.frame, 'lines', [['Rows', `${rows.length} lines`]]), columns, rows);
}

export function holesCsv(data: ProjectExportData, kinds?: LineKind[]): string {
  const u = data.frame.unitSymbol;
  const z = `${u} ${data.frame.verticalDatum}`;
  const rows = data.holes
    .filter((h) => {
      const line = data.linesById.get(h.lineId);
      return line && (!kinds?.length || kinds.includes(line.kind));
    })
    .sort((a, b) => a.number.localeCompare(b.number, 'en', { numeric: true }) || HOLE_STATUSES.indexOf(a.status) - HOLE_STATUSES.indexOf(b.status));
  const lineLabel = (h: HoleRow) => data.linesById.get(h.lineId)?.label ?? '';
  const columns: CsvColumn<HoleRow>[] = [
    { header: 'number', text: true, id: true, user: true, value: (h) => h.number },
    { header: 'line', text: true, id: true, user: true, value: lineLabel },
    { header: 'status', text: true, value: (h) => h.status },
    { header: `northing (${u})`, text: false, value: (h) => round4(h.northing) },
    { header: `easting (${u})`, text: false, value: (h) => round4(h.easting) },
    { header: 'position', text: true, value: (h) => (h.surveyed ? 'surveyed' : h.approximate ? `${h.positionSource} (approximate)` : h.positionSource) },
    { header: 'station', text: true, value: (h) => stationText(h.station, data.frame) },
    { header: `offset (${u})`, text: false, value: (h) => round4(h.offset) },
    { header: 'side', text: true, value: (h) => (h.offset ? h.offsetSide : '') },
    { header: `ground (${z})`, text: false, value: (h) => round4(h.groundElevation) },
    { header: `depth (${u})`, text: false, value: (h) => round4(h.depthToTop) },
    { header: 'depth measured to', text: true, value: (h) => h.depthReference },
    { header: `top of line (${z})`, text: false, value: (h) => round4(h.topElevation) },
    { header: `measured size (${u})`, text: false, value: (h) => round4(h.measuredSize) },
    { header: 'material', text: true, user: true, value: (h) => h.material },
    { header: 'condition', text: true, user: true, value: (h) => h.condition },
    { header: 'method', text: true, value: (h) => h.method },
    { header: 'one-call ticket', text: true, id: true, user: true, value: (h) => h.ticketNumber },
    { header: 'crew', text: true, user: true, value: (h) => h.crew },
    { header: 'dug (UTC)', text: true, value: (h) => (h.dugAt ? isoSeconds(h.dugAt) : '') },
    { header: 'notes', text: true, user: true, value: (h) => h.notes },
  ];
  return csvDocument(headerBlock(data.frame, 'test holes', [['Rows', `${rows.length} test-hole records (one per line exposed)`]]), columns, rows);
}
