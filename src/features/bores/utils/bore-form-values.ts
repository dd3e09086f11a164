import type { BoreDto } from '@shared/api';
import type { BoreMethod, StationStyle } from '@shared/domain';
import { formatStation, parseStation } from '@shared/geometry';
import { boreCreateSchema, boreUpdateSchema, type BoreCreateInput, type BoreUpdateInput } from '@shared/schemas/bore';
import { polylineLength } from '@/lib/format';
import { plainNumber } from '@/lib/parse-pairs';
import { validate, type PathErrors } from './validate';

/** One grid vertex row of a form (alignment, pit footprint), as typed. */
export interface VertexRow {
  e: string;
  n: string;
}

/** A typed number: empty → undefined (the schema says "is required"), unreadable → NaN (it says "must be a number"). */
export function numberOf(text: string): number | undefined {
  return text.trim() === '' ? undefined : plainNumber(text);
}

/** The form's rows as grid points for the schema (row i is point i, so a problem names its row). */
export function rowsToPoints(rows: VertexRow[]): [number | undefined, number | undefined][] {
  return rows.map((r) => [numberOf(r.e), numberOf(r.n)]);
}

/** Grid points as form rows. */
export function pointsToRows(points: readonly (readonly [number, number])[]): VertexRow[] {
  return points.map(([e, n]) => ({ e: String(e), n: String(n) }));
}

/**
 * The bore form's values as typed: the shared schema's fields as text, the begin station in the
 * project's style, the alignment as vertex rows, and the profile either as entry/exit elevations
 * with a straight grade between the alignment's ends, or as station–elevation rows.
 */
export interface BoreFormValues {
  name: string;
  method: BoreMethod;
  beginStation: string;
  vertices: VertexRow[];
  casingOd: string;
  carrierSize: string;
  toleranceHorizontal: string;
  toleranceVertical: string;
  minCover: string;
  notes: string;
  profileMode: 'straight' | 'points';
  entryElevation: string;
  exitElevation: string;
  profilePoints: { station: string; elevation: string }[];
  /** Ground surface over the bore, station–elevation rows (none, or two or more). */
  groundPoints: { station: string; elevation: string }[];
}

export function emptyBoreValues(style: StationStyle): BoreFormValues {
  return {
    name: '',
    method: 'hdd',
    beginStation: formatStation(0, style),
    vertices: [
      { e: '', n: '' },
      { e: '', n: '' },
    ],
    casingOd: '',
    carrierSize: '',
    toleranceHorizontal: '',
    toleranceVertical: '',
    minCover: '',
    notes: '',
    profileMode: 'straight',
    entryElevation: '',
    exitElevation: '',
    profilePoints: [
      { station: '', elevation: '' },
      { station: '', elevation: '' },
    ],
    groundPoints: [],
  };
}

export function boreValues(bore: BoreDto, style: StationStyle): BoreFormValues {
  return {
    ...emptyBoreValues(style),
    name: bore.name,
    method: bore.method,
    beginStation: formatStation(bore.beginStation, style),
    vertices: pointsToRows(bore.alignment),
    casingOd: String(bore.casingOd),
    carrierSize: bore.carrierSize == null ? '' : String(bore.carrierSize),
    toleranceHorizontal: String(bore.toleranceHorizontal),
    toleranceVertical: String(bore.toleranceVertical),
    minCover: String(bore.minCover),
    notes: bore.notes ?? '',
    groundPoints: bore.groundProfile.map((p) => ({ station: formatStation(p.station, style), elevation: String(p.elevation) })),
  };
}

const textOrNull = (t: string): string | null => (t.trim() === '' ? null : t);

/** The station as typed, or the parser's message saying what is wrong. */
function station(text: string, style: StationStyle): { value?: number; error?: string } {
  try {
    return { value: parseStation(text, style) };
  } catch (e) {
    return { error: e instanceof Error ? e.message.replace(/^a station /, '') : 'is not a station' };
  }
}

/** Fields both create and edit send. `errors` holds what the schema cannot see (station text, a zero-length alignment). */
function commonFields(values: BoreFormValues, style: StationStyle) {
  const errors: PathErrors = {};
  const begin = station(values.beginStation, style);
  if (begin.error) errors.beginStation = begin.error;
  const alignment = rowsToPoints(values.vertices);
  const complete = alignment.every(([e, n]) => Number.isFinite(e) && Number.isFinite(n));
  const length = complete ? polylineLength(alignment as [number, number][]) : null;
  if (length === 0 && alignment.length >= 2) errors.alignment = 'has no length: its vertices are all at one point';
  const fields = {
    name: values.name,
    method: values.method,
    alignment,
    beginStation: begin.value ?? Number.NaN,
    casingOd: numberOf(values.casingOd),
    carrierSize: numberOf(values.carrierSize) ?? null,
    toleranceHorizontal: numberOf(values.toleranceHorizontal),
    toleranceVertical: numberOf(values.toleranceVertical),
    minCover: numberOf(values.minCover),
    notes: textOrNull(values.notes),
  };
  return { fields, errors, begin: begin.value, length };
}

/** The ground profile rows as schema points; a station the parser refuses is named on its row in `errors`. */
function groundProfileOf(values: BoreFormValues, style: StationStyle, errors: PathErrors) {
  // The schema takes one point, but one point gives a cover at one station only: ask for a line.
  if (values.groundPoints.length === 1) errors.groundProfile = 'needs at least two points, or none';
  return values.groundPoints.map((p, i) => {
    const s = station(p.station, style);
    if (s.error) errors[`groundProfile.${i}.station`] = s.error;
    return { station: s.value ?? Number.NaN, elevation: numberOf(p.elevation) };
  });
}

/** Merge the schema's problems with ours (ours win: they say more about the text typed). */
function merge(schemaErrors: PathErrors | null, ours: PathErrors): PathErrors | null {
  const all = { ...(schemaErrors ?? {}), ...ours };
  // The begin station's NaN placeholder: the parser's message is the one to show.
  if (ours.beginStation) all.beginStation = ours.beginStation;
  return Object.keys(all).length > 0 ? all : null;
}

/**
 * The create body from the form, checked with the shared create schema. In straight mode the
 * profile is two points: the entry elevation at the begin station and the exit elevation at the
 * end station (begin + the alignment's plan length). The ground profile is the ground rows (may be none).
 */
export function toBoreCreate(values: BoreFormValues, style: StationStyle): { input: BoreCreateInput; errors: null } | { input: null; errors: PathErrors } {
  const { fields, errors, begin, length } = commonFields(values, style);
  let profile: { station: number; elevation: number | undefined }[];
  if (values.profileMode === 'straight') {
    const start = begin ?? 0;
    profile = [
      { station: start, elevation: numberOf(values.entryElevation) },
      { station: start + (length ?? 1), elevation: numberOf(values.exitElevation) },
    ];
  } else {
    profile = values.profilePoints.map((p, i) => {
      const s = station(p.station, style);
      if (s.error) errors[`profile.${i}.station`] = s.error;
      return { station: s.value ?? Number.NaN, elevation: numberOf(p.elevation) };
    });
  }
  const groundProfile = groundProfileOf(values, style, errors);
  const result = validate(boreCreateSchema, { ...fields, profile, groundProfile });
  let all = merge(result.errors, errors);
  if (all && values.profileMode === 'straight') {
    // Station problems of a straight profile come from the begin station or the alignment, already named there.
    all = Object.fromEntries(Object.entries(all).filter(([path]) => !/^profile\.\d+\.station$/.test(path) && path !== 'profile'));
    if (Object.keys(all).length === 0) all = null;
  }
  if (all) return { input: null, errors: all };
  return { input: result.data as BoreCreateInput, errors: null };
}

/**
 * The PATCH body from the form (everything but the casing profile, which Plan & profile edits, and
 * with the ground profile as the rows now stand), checked with the shared update schema.
 */
export function toBoreUpdate(values: BoreFormValues, style: StationStyle, version: number): { input: BoreUpdateInput; errors: null } | { input: null; errors: PathErrors } {
  const { fields, errors } = commonFields(values, style);
  const groundProfile = groundProfileOf(values, style, errors);
  const result = validate(boreUpdateSchema, { ...fields, groundProfile, version });
  const all = merge(result.errors, errors);
  if (all) return { input: null, errors: all };
  return { input: result.data as BoreUpdateInput, errors: null };
}

/** In straight mode the two profile points' elevations are shown on the entry and exit fields. */
export function displayPath(path: string, mode: BoreFormValues['profileMode']): string {
  if (mode === 'straight') {
    if (path === 'profile.0.elevation') return 'entryElevation';
    if (path === 'profile.1.elevation') return 'exitElevation';
  }
  return path;
}

/** Paths the form shows beside a field; any other server problem goes in the form's alert. */
export const SHOWN_PATH =
  /^(name|method|beginStation|alignment(\.\d+(\.[01])?)?|casingOd|carrierSize|toleranceHorizontal|toleranceVertical|minCover|notes|entryElevation|exitElevation|(groundProfile|profile)(\.\d+(\.(station|elevation))?)?)$/;

/**
 * When the alignment's stations no longer fall inside the casing profile's (the begin station or
 * the length changed), the profile must be edited too: the words saying so, or null.
 */
export function profileCoverageWarning(values: BoreFormValues, bore: BoreDto, style: StationStyle): string | null {
  if (bore.profile.length < 2) return null;
  const { begin, length } = commonFields(values, style);
  if (begin === undefined || length == null) return null;
  const first = bore.profile[0]!.station;
  const last = bore.profile[bore.profile.length - 1]!.station;
  const end = begin + length;
  const tolerance = 0.005;
  if (begin >= first - tolerance && end <= last + tolerance) return null;
  return `The alignment would run from ${formatStation(begin, style)} to ${formatStation(end, style)}, but the casing profile runs from ${formatStation(first, style)} to ${formatStation(last, style)}. After saving, extend or move the profile in Plan & profile, or clearances beyond it cannot be computed.`;
}
