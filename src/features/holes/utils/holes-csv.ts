import Papa from 'papaparse';
import type { LinearUnit, StationStyle } from '@shared/domain';
import { UNIT_LABELS } from '@shared/domain';
import { formatStation } from '@shared/geometry';
import { UNIT_SYMBOLS } from '@shared/units';
import type { HoleRow } from '../components/holes-table';
import { CLEARANCE_LABELS, HOLE_STATUS_LABELS, SOURCE_LABELS } from './labels';

/** What the export header says about the rows: the project's frame and the time of the data. */
export interface CsvFrame {
  projectName: string;
  crsCode: string;
  unit: LinearUnit;
  verticalDatum: string;
  /** When the clearance statuses in the file were computed (null when not available). */
  clearancesCheckedAt: string | null;
  exportedAt: string;
  /** Rows in the register before filtering. */
  total: number;
  /** Plain words for the filters in force, if any. */
  filters: string;
  fileStem: string;
}

/**
 * An identifier written so spreadsheets keep it as text (leading zeros, long ticket numbers):
 * the cell holds the formula `="0012"`, which Excel, LibreOffice and Google Sheets all show as
 * the text 0012. Double quotes inside are doubled for the formula.
 */
export function textId(value: string | null | undefined): string {
  if (value == null || value === '') return '';
  return `="${value.replace(/"/g, '""')}"`;
}

/**
 * Free text made safe from formula injection: a cell starting with = + - @ tab or carriage return
 * is prefixed with an apostrophe (OWASP, "CSV Injection"), so no spreadsheet runs it.
 */
export function safeText(value: string | null | undefined): string {
  if (value == null) return '';
  return /^[=+\-@\t\r]/.test(value) ? `'${value}` : value;
}

const num = (v: number | null | undefined, decimals = 4): number | '' => (v == null || !Number.isFinite(v) ? '' : Number(v.toFixed(decimals)));

/**
 * The rows shown, as CSV: a first line carrying project, CRS, unit, vertical datum, export time
 * and clearance-check time; a header row naming each column with its unit; then one row per hole.
 */
export function holesCsv(rows: readonly HoleRow[], frame: CsvFrame, opts: { unit: LinearUnit; stationStyle: StationStyle }): string {
  const u = UNIT_SYMBOLS[opts.unit];
  const d = frame.verticalDatum;
  const meta = [
    `Threadline test holes: ${frame.projectName}`,
    `CRS ${frame.crsCode}`,
    `unit ${UNIT_LABELS[frame.unit]} (${UNIT_SYMBOLS[frame.unit]})`,
    `vertical datum ${frame.verticalDatum}`,
    `exported ${frame.exportedAt}`,
    `clearances checked ${frame.clearancesCheckedAt ?? 'not available'}`,
    `${rows.length} of ${frame.total} holes${frame.filters ? ` (${frame.filters})` : ''}`,
    'ids written as ="..." so spreadsheets keep them as text',
  ].join('; ');
  const header = [
    'Hole', 'Line', 'Line kind', 'Quality level', 'Status', 'Clearance status',
    'Position source', 'Approximate', `GPS accuracy (${u})`, `Easting (${u})`, `Northing (${u})`,
    'Bore', 'Station', `Offset (${u})`, 'Side',
    `Ground elevation (${u} ${d})`, 'Ground surveyed', `Depth below ground (${u})`, 'Depth measured to',
    `Top of line elevation (${u} ${d})`, 'Top of line from', `Surveyed easting (${u})`, `Surveyed northing (${u})`,
    `Measured size (${u})`, `Box width (${u})`, `Box height (${u})`, `Depth to bottom (${u})`,
    'Material', 'Condition', 'Direction of run', 'Method', 'One-call ticket', 'Surface', 'Marker set', 'Soil', 'Groundwater', 'Restoration', 'Crew', 'Dug at', 'Notes',
  ];
  const body = rows.map((r) => {
    const h = r.hole;
    return [
      textId(h.number),
      safeText(r.lineLabel),
      r.lineKind ?? '',
      r.qualityLevel ?? '',
      HOLE_STATUS_LABELS[h.status],
      r.clearance ? CLEARANCE_LABELS[r.clearance.status] : '',
      SOURCE_LABELS[h.positionSource],
      h.approximate ? 'yes' : 'no',
      num(h.gpsAccuracy, 2),
      num(h.easting),
      num(h.northing),
      safeText(r.boreName),
      h.station != null ? formatStation(h.station, opts.stationStyle) : '',
      num(h.offset),
      h.offset ? (h.offsetSide ?? '') : '',
      num(r.ground),
      r.groundSurveyed ? 'yes' : 'no',
      num(h.depthToTop),
      h.depthToTop != null ? h.depthReference : '',
      num(r.top),
      r.topSource ?? '',
      num(h.surveyedEasting),
      num(h.surveyedNorthing),
      num(h.measuredSize),
      num(h.boxWidth),
      num(h.boxHeight),
      num(h.depthToBottom),
      safeText(h.material),
      safeText(h.condition),
      safeText(h.direction),
      h.method ?? '',
      textId(h.ticketNumber),
      safeText(h.surfaceType),
      h.markerSet == null ? '' : h.markerSet ? 'yes' : 'no',
      safeText(h.soil),
      safeText(h.groundwater),
      safeText(h.restoration),
      safeText(h.crew),
      h.dugAt ?? '',
      safeText(h.notes),
    ];
  });
  // Quote every text cell; leave numbers bare so spreadsheets read them as numbers.
  return Papa.unparse([[meta], header, ...body], { quotes: (value: unknown) => typeof value === 'string', newline: '\r\n', escapeFormulae: false }) + '\r\n';
}
