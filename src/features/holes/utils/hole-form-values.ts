import type { BoreDto, HoleDto } from '@shared/api';
import type { DepthReference, ExcavationMethod, PositionSource, Side, StationStyle } from '@shared/domain';
import { formatStation, parseStation } from '@shared/geometry';
import type { HoleCreateInput, HoleUpdateInput } from '@shared/schemas/hole';

/**
 * The logging form's values. Mostly the shared create schema's fields, plus what only the
 * screen needs: the station as typed, the choice of a new unidentified line, and text forms of
 * the selects. `toCreateInput` turns them into the body the shared schema checks.
 */
export interface HoleFormValues {
  number: string;
  /** A line id, or NEW_LINE to add an unidentified line with the hole (sent as `newLine`). */
  lineChoice: string;
  newLineLabel: string;
  /** The form's position mode; 'map' and 'survey' positions of existing holes are shown as grid values. */
  positionSource: PositionSource;
  easting: number | null;
  northing: number | null;
  boreId: string;
  stationText: string;
  offset: number | null;
  offsetSide: Side | '';
  gpsAccuracy: number | null;
  groundElevation: number | null;
  depthToTop: number | null;
  depthReference: DepthReference;
  sizeShape: 'round' | 'box';
  measuredSize: number | null;
  boxWidth: number | null;
  boxHeight: number | null;
  depthToBottom: number | null;
  material: string;
  condition: string;
  direction: string;
  method: ExcavationMethod | '';
  ticketNumber: string;
  surfaceType: string;
  markerSet: 'yes' | 'no' | '';
  crew: string;
  /** `datetime-local` text in the browser's time zone. */
  dugAt: string;
  notes: string;
  soil: string;
  groundwater: string;
  restoration: string;
}

export const NEW_LINE = 'new';

/** `datetime-local` value of an ISO time, in this browser's time zone. */
export function toLocalInput(iso: string | null | undefined): string {
  if (!iso) return '';
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return '';
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}T${pad(d.getHours())}:${pad(d.getMinutes())}`;
}

/** Empty values of a new hole: dug now, measured to the top, by air. */
export function emptyHoleValues(number: string, crew: string): HoleFormValues {
  return {
    number,
    lineChoice: '',
    newLineLabel: '',
    positionSource: 'grid',
    easting: null,
    northing: null,
    boreId: '',
    stationText: '',
    offset: null,
    offsetSide: '',
    gpsAccuracy: null,
    groundElevation: null,
    depthToTop: null,
    depthReference: 'top',
    sizeShape: 'round',
    measuredSize: null,
    boxWidth: null,
    boxHeight: null,
    depthToBottom: null,
    material: '',
    condition: '',
    direction: '',
    method: 'air',
    ticketNumber: '',
    surfaceType: '',
    markerSet: '',
    crew,
    dugAt: toLocalInput(new Date().toISOString()),
    notes: '',
    soil: '',
    groundwater: '',
    restoration: '',
  };
}

/** The form values of an existing hole. */
export function holeToValues(hole: HoleDto, stationStyle: StationStyle): HoleFormValues {
  const isStation = hole.positionSource === 'station' && hole.boreId != null && hole.station != null;
  return {
    number: hole.number,
    lineChoice: String(hole.lineId),
    newLineLabel: '',
    positionSource: isStation ? 'station' : hole.positionSource,
    easting: hole.easting,
    northing: hole.northing,
    boreId: hole.boreId != null ? String(hole.boreId) : '',
    stationText: hole.station != null ? formatStation(hole.station, stationStyle) : '',
    offset: hole.offset,
    offsetSide: hole.offsetSide ?? '',
    gpsAccuracy: hole.gpsAccuracy,
    groundElevation: hole.groundElevation,
    depthToTop: hole.depthToTop,
    depthReference: hole.depthReference,
    sizeShape: hole.boxWidth != null || hole.boxHeight != null ? 'box' : 'round',
    measuredSize: hole.measuredSize,
    boxWidth: hole.boxWidth,
    boxHeight: hole.boxHeight,
    depthToBottom: hole.depthToBottom,
    material: hole.material ?? '',
    condition: hole.condition ?? '',
    direction: hole.direction ?? '',
    method: hole.method ?? '',
    ticketNumber: hole.ticketNumber ?? '',
    surfaceType: hole.surfaceType ?? '',
    markerSet: hole.markerSet == null ? '' : hole.markerSet ? 'yes' : 'no',
    crew: hole.crew ?? '',
    dugAt: toLocalInput(hole.dugAt),
    notes: hole.notes ?? '',
    soil: hole.soil ?? '',
    groundwater: hole.groundwater ?? '',
    restoration: hole.restoration ?? '',
  };
}

const text = (v: string): string | null => (v.trim() === '' ? null : v.trim());

export interface PayloadResult {
  input: Omit<HoleCreateInput, 'clientId'> & { clientId: string };
  /** Problems the shared schema cannot see (the station text), keyed by form field. */
  errors: Partial<Record<keyof HoleFormValues, string>>;
}

/**
 * Build the create body from the form: only the fields of the chosen position mode, the station
 * parsed in the project's style, empty text as null.
 */
export function toCreateInput(values: HoleFormValues, clientId: string, stationStyle: StationStyle): PayloadResult {
  const errors: PayloadResult['errors'] = {};
  const source = values.positionSource;
  let station: number | null = null;
  if (source === 'station' && values.stationText.trim() !== '') {
    try {
      station = parseStation(values.stationText, stationStyle);
    } catch (e) {
      errors.stationText = e instanceof Error ? e.message : 'is not a station';
    }
  }
  const position =
    source === 'station'
      ? {
          boreId: values.boreId ? Number(values.boreId) : null,
          station: station,
          offset: values.offset,
          offsetSide: values.offset === 0 ? null : values.offsetSide || null,
        }
      : source === 'gps'
        ? { easting: values.easting, northing: values.northing, gpsAccuracy: values.gpsAccuracy }
        : { easting: values.easting, northing: values.northing };
  const box = values.sizeShape === 'box';
  const input = {
    clientId,
    number: values.number,
    ...(values.lineChoice === NEW_LINE ? { newLine: { label: values.newLineLabel } } : { lineId: values.lineChoice ? Number(values.lineChoice) : undefined }),
    positionSource: source,
    ...position,
    groundElevation: values.groundElevation,
    depthToTop: values.depthToTop,
    depthReference: values.depthReference,
    measuredSize: box ? null : values.measuredSize,
    boxWidth: box ? values.boxWidth : null,
    boxHeight: box ? values.boxHeight : null,
    depthToBottom: values.depthToBottom,
    material: text(values.material),
    condition: text(values.condition),
    direction: text(values.direction),
    method: values.method || null,
    ticketNumber: text(values.ticketNumber),
    surfaceType: text(values.surfaceType),
    markerSet: values.markerSet === '' ? null : values.markerSet === 'yes',
    crew: text(values.crew),
    dugAt: values.dugAt ? new Date(values.dugAt).toISOString() : null,
    notes: text(values.notes),
    soil: text(values.soil),
    groundwater: text(values.groundwater),
    restoration: text(values.restoration),
  } satisfies Record<string, unknown>;
  return { input: input as PayloadResult['input'], errors };
}

export const POSITION_KEYS = ['positionSource', 'easting', 'northing', 'boreId', 'station', 'offset', 'offsetSide', 'gpsAccuracy'] as const;
type PositionKey = (typeof POSITION_KEYS)[number];

const COMPARED_KEYS = [
  'number', 'lineId', 'groundElevation', 'depthToTop', 'depthReference', 'measuredSize', 'boxWidth', 'boxHeight', 'depthToBottom',
  'material', 'condition', 'direction', 'method', 'ticketNumber', 'surfaceType', 'markerSet', 'crew', 'dugAt', 'notes',
  'soil', 'groundwater', 'restoration',
] as const;
export type ComparedKey = (typeof COMPARED_KEYS)[number];

function same(a: unknown, b: unknown, key: string): boolean {
  if (a == null && b == null) return true;
  if (key === 'dugAt' && typeof a === 'string' && typeof b === 'string') return new Date(a).getTime() === new Date(b).getTime();
  if (typeof a === 'number' && typeof b === 'number') return Math.abs(a - b) < 1e-9;
  return a === b;
}

/** Whether the position in the body differs from the hole's (compared in the mode the body uses). */
export function positionChanged(input: Partial<Record<PositionKey, unknown>>, hole: HoleDto): boolean {
  if (input.positionSource === 'station') {
    return (
      hole.positionSource !== 'station' ||
      !same(input.boreId, hole.boreId, 'boreId') ||
      !same(input.station, hole.station, 'station') ||
      !same(input.offset, hole.offset, 'offset') ||
      !same(input.offset === 0 ? null : input.offsetSide, hole.offset === 0 ? null : hole.offsetSide, 'offsetSide')
    );
  }
  if (input.positionSource === 'gps') return hole.positionSource !== 'gps' || !same(input.easting, hole.easting, 'e') || !same(input.northing, hole.northing, 'n') || !same(input.gpsAccuracy, hole.gpsAccuracy, 'a');
  // grid, or a map/survey position shown as grid values
  return !same(input.easting, hole.easting, 'e') || !same(input.northing, hole.northing, 'n') || input.positionSource !== hole.positionSource;
}

/**
 * The PATCH body of an edit: the fields that differ from the hole as loaded, with the whole
 * position (its source and every value of that mode) when any of it changed; null when nothing did.
 */
export function toUpdateInput(input: PayloadResult['input'], hole: HoleDto): HoleUpdateInput | null {
  const body: Record<string, unknown> = {};
  for (const key of COMPARED_KEYS) {
    if (!same(input[key], hole[key], key)) body[key] = input[key];
  }
  if (positionChanged(input, hole)) {
    // A map or survey position typed over becomes a typed grid position.
    for (const key of POSITION_KEYS) if (key in input) body[key] = input[key as keyof typeof input];
    if (body.positionSource === 'map' || body.positionSource === 'survey') body.positionSource = 'grid';
  }
  if (Object.keys(body).length === 0) return null;
  return { ...body, version: hole.version } as HoleUpdateInput;
}

/** Grid E/N of a station/offset entry on a bore, for showing where it lands (the server does the same). */
export function boreById(bores: readonly BoreDto[] | undefined, id: string): BoreDto | undefined {
  return bores?.find((b) => String(b.id) === id);
}
