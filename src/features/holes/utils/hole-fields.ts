import type { HoleDto } from '@shared/api';
import type { LinearUnit, StationStyle } from '@shared/domain';
import { formatStation } from '@shared/geometry';
import { formatCoordinate, formatDateTime, formatLength, formatOffset } from '@/lib/format';
import { HOLE_STATUS_LABELS, METHOD_LABELS, REFERENCE_LABELS, SOURCE_LABELS } from './labels';

export interface FieldContext {
  unit: LinearUnit;
  datum: string;
  stationStyle: StationStyle;
  lineLabel: (id: number) => string;
  boreName: (id: number) => string;
}

/** Labels of hole fields as people read them (stale-edit comparison, activity). */
export const HOLE_FIELD_LABELS: Record<string, string> = {
  number: 'Hole number',
  lineId: 'Line exposed',
  position: 'Position',
  groundElevation: 'Ground elevation',
  depthToTop: 'Depth below ground',
  depthReference: 'Depth measured to',
  measuredSize: 'Measured size',
  boxWidth: 'Box width',
  boxHeight: 'Box height',
  depthToBottom: 'Depth to bottom',
  material: 'Material',
  condition: 'Condition',
  direction: 'Direction of run',
  method: 'Excavation method',
  ticketNumber: 'One-call ticket',
  surfaceType: 'Surface',
  markerSet: 'Surface marker set',
  crew: 'Crew',
  dugAt: 'Dug at',
  notes: 'Notes',
  soil: 'Soil',
  groundwater: 'Groundwater',
  restoration: 'Restoration',
  surveyedEasting: 'Surveyed easting',
  surveyedNorthing: 'Surveyed northing',
  surveyedTopElevation: 'Surveyed top of line',
  surveyedGroundElevation: 'Surveyed ground',
};

/** Labels of the other fields a hole's history can show. */
export const HISTORY_FIELD_LABELS: Record<string, string> = {
  ...HOLE_FIELD_LABELS,
  positionSource: 'Position from',
  easting: 'Easting',
  northing: 'Northing',
  approximate: 'Approximate position',
  boreId: 'Bore',
  station: 'Station',
  offset: 'Offset',
  offsetSide: 'Side',
  gpsAccuracy: 'GPS accuracy',
  status: 'Status',
  reviewNote: 'Review note',
  importFile: 'Point file',
};

type PositionLike = Partial<Pick<HoleDto, 'positionSource' | 'easting' | 'northing' | 'boreId' | 'station' | 'offset' | 'offsetSide' | 'gpsAccuracy'>>;

/** A position in words: `Sta. 10+55.63, 3.86 US ft L on Bore 1 (station/offset)` or `E …, N … (typed E/N)`. */
export function describePosition(p: PositionLike, ctx: FieldContext): string {
  const source = p.positionSource ? SOURCE_LABELS[p.positionSource] : '';
  if (p.positionSource === 'station' && p.station != null) {
    const bore = p.boreId != null ? ` on ${ctx.boreName(p.boreId)}` : '';
    return `Sta. ${formatStation(p.station, ctx.stationStyle)}, ${formatOffset(p.offset, p.offsetSide, ctx.unit)}${bore} (${source})`;
  }
  const acc = p.positionSource === 'gps' && p.gpsAccuracy != null ? `, ±${formatLength(p.gpsAccuracy, ctx.unit, 1)}` : '';
  return `E ${formatCoordinate(p.easting, ctx.unit)}, N ${formatCoordinate(p.northing, ctx.unit)} (${source}${acc})`;
}

const LENGTHS = new Set(['depthToTop', 'measuredSize', 'boxWidth', 'boxHeight', 'depthToBottom', 'offset', 'gpsAccuracy']);
const ELEVATIONS = new Set(['groundElevation', 'surveyedTopElevation', 'surveyedGroundElevation']);
const COORDINATES = new Set(['surveyedEasting', 'surveyedNorthing', 'easting', 'northing']);

/** One field's value in words, with unit (and datum for elevations). */
export function formatHoleField(key: string, value: unknown, ctx: FieldContext): string {
  if (value === null || value === undefined || value === '') return '—';
  if (typeof value === 'number') {
    if (ELEVATIONS.has(key)) return `${formatLength(value, ctx.unit)} ${ctx.datum}`;
    if (LENGTHS.has(key)) return formatLength(value, ctx.unit);
    if (COORDINATES.has(key)) return formatCoordinate(value, ctx.unit);
    if (key === 'lineId') return ctx.lineLabel(value);
    if (key === 'boreId') return ctx.boreName(value);
    if (key === 'station') return formatStation(value, ctx.stationStyle);
    return String(value);
  }
  if (typeof value === 'boolean') return value ? 'Yes' : 'No';
  if (key === 'dugAt' && typeof value === 'string') return formatDateTime(value);
  if (key === 'depthReference' && typeof value === 'string') return REFERENCE_LABELS[value as keyof typeof REFERENCE_LABELS] ?? value;
  if (key === 'method' && typeof value === 'string') return METHOD_LABELS[value as keyof typeof METHOD_LABELS] ?? value;
  if (key === 'status' && typeof value === 'string') return HOLE_STATUS_LABELS[value as keyof typeof HOLE_STATUS_LABELS] ?? value;
  if (key === 'positionSource' && typeof value === 'string') return SOURCE_LABELS[value as keyof typeof SOURCE_LABELS] ?? value;
  if (typeof value === 'object') {
    const json = JSON.stringify(value);
    return json.length > 120 ? `${json.slice(0, 117)}…` : json;
  }
  return String(value);
}
