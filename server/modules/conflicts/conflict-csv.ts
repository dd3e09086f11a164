import Papa from 'papaparse';
import type { ConflictRowDto } from '@shared/api';
import { CONFLICT_STATUS_LABELS, LINE_KIND_LABELS, type LinearUnit, type StationStyle } from '@shared/domain';
import { UNIT_SYMBOLS } from '@shared/units';
import { DECIMALS, textDate, textDateTime, textStation } from '../mail/format';

/** The reference frame printed at the head of every list. */
export interface ListFrame {
  projectName: string;
  crsCode: string;
  unit: LinearUnit;
  verticalDatum: string;
  stationStyle: StationStyle;
  /** Time of the last clearance check the figures come from. */
  checkedAt: Date;
}

const UNIT_NAMES: Record<LinearUnit, string> = { m: 'metres', ft: 'international feet', usft: 'US survey feet' };

/** Latest clearance check over the rows (the register is rechecked inside every write). */
export function lastCheck(rows: ConflictRowDto[]): Date {
  return new Date(Math.max(0, ...rows.map((r) => Date.parse(r.checkedAt))));
}

/**
 * The conflict list as CSV (SPEC §8 columns): `#` lines with the project, CRS, unit, vertical
 * datum and the time of the last clearance check, then a header row and one row per conflict.
 * Every value is a string, so ids and hole numbers keep their form in a spreadsheet.
 * (The exports feature may replace this with its own CSV/XLSX/PDF writers.)
 */
export function conflictListCsv(rows: ConflictRowDto[], frame: ListFrame): string {
  const u = UNIT_SYMBOLS[frame.unit];
  const n = (v: number | null) => (v == null ? '' : v.toFixed(DECIMALS[frame.unit]));
  const st = (v: number | null) => (v == null ? '' : textStation(v, frame.stationStyle));
  const size = (r: ConflictRowDto) =>
    r.line.shape === 'box' ? (r.line.width != null && r.line.height != null ? `${n(r.line.width)} x ${n(r.line.height)}` : '') : n(r.line.diameter);
  const fields = [
    'id', 'bore', 'pits', 'station from', 'station to', 'station', `offset (${u})`, 'side',
    'owner', 'contact', 'line', 'kind', `size (${u})`, 'material', 'quality level', 'test holes',
    `top elevation (${u} ${frame.verticalDatum})`, `required clearance (${u})`, `measured clearance (${u})`, `margin (${u})`,
    'check result', 'status', 'resolution', 'responsible party', 'found', 'owner told', 'answer due', 'closed', 'notes',
  ];
  const data = rows.map((r) => [
    r.number,
    r.bore.name,
    r.pits.map((p) => `${p.kind} pit${p.enters ? ' (enters)' : ''}`).join('; '),
    st(r.stationFrom),
    st(r.stationTo),
    st(r.station),
    n(r.offset),
    r.offset === 0 ? '' : (r.side ?? ''),
    r.line.owner,
    r.line.contactEmail ?? '',
    r.line.label,
    LINE_KIND_LABELS[r.line.kind],
    size(r),
    r.line.material ?? '',
    r.line.qualityLevel,
    r.holes.map((h) => h.number).join('; '),
    n(r.lineTop),
    n(r.required),
    n(r.clearance),
    n(r.margin),
    r.computedStatus,
    CONFLICT_STATUS_LABELS[r.status],
    r.resolutionNote ?? '',
    r.responsibleParty ?? '',
    textDate(r.createdAt),
    r.ownerNotifiedAt ? textDate(r.ownerNotifiedAt) : '',
    r.answerDueAt ? textDate(r.answerDueAt) : '',
    r.closedAt ? textDate(r.closedAt) : '',
    r.notes ?? '',
  ]);
  const oneLine = (t: string) => t.replace(/[\r\n]+/g, ' ');
  const head = [
    `# Threadline conflict list: ${oneLine(frame.projectName)}`,
    `# CRS ${frame.crsCode}; lengths in ${UNIT_NAMES[frame.unit]}; elevations ${oneLine(frame.verticalDatum)}; last clearance check ${textDateTime(frame.checkedAt)}`,
  ];
  return `${head.join('\r\n')}\r\n${Papa.unparse({ fields, data }, { quotes: true, newline: '\r\n' })}\r\n`;
}
