/**
 * Stations and offsets along a bore alignment (SPEC §4.2).
 *
 * Station of a point = begin station + distance along the alignment to the point's
 * perpendicular foot; offset = perpendicular distance, right positive looking up-station.
 * Points past either end project onto the extended end segment and are flagged.
 * Zero-length segments of an alignment are skipped; fewer than two distinct vertices is an error.
 */
import type { Side, StationStyle } from '../domain';
import { GeometryError, assertFinite } from './errors';
import { type XY } from './planar';
import { closestOnPolyline, pointAtChainage, preparePolyline, type PreparedPolyline } from './polyline';

/** A prepared bore alignment (a PreparedPolyline whose chainage is distance from the begin station). */
export type Alignment = PreparedPolyline;

/** Either raw alignment vertices or an already prepared alignment. */
export type AlignmentLike = Alignment | readonly XY[];

const prepared = new WeakMap<readonly XY[], Alignment>();

/** Prepare an alignment (cached per array identity); throws DEGENERATE_ALIGNMENT with fewer than two distinct vertices. */
export function prepareAlignment(points: AlignmentLike): Alignment {
  if (!Array.isArray(points)) return points as Alignment;
  const raw = points as readonly XY[];
  let a = prepared.get(raw);
  if (!a) {
    a = preparePolyline(raw, 'bore alignment', 'DEGENERATE_ALIGNMENT');
    prepared.set(raw, a);
  }
  return a;
}

/** Plan length of an alignment (zero-length segments count for nothing). */
export function alignmentLength(alignment: AlignmentLike): number {
  return prepareAlignment(alignment).length;
}

/** A foot within this distance of an end (1e-9 of the length) is on the alignment, not beyond it. */
function endTolerance(a: Alignment): number {
  return 1e-9 * Math.max(1, a.length);
}

/** Station and offset of a point relative to an alignment. */
export interface StationOffset {
  /** Station of the perpendicular foot (begin station + chainage; outside the range when beyond). */
  station: number;
  /** Perpendicular distance, always ≥ 0. */
  offset: number;
  /** Side looking up-station; a point on the alignment (offset 0) is reported as 'R'. */
  side: Side;
  /** Offset with right positive, left negative. */
  signedOffset: number;
  /** Index, in the caller's vertex list, of the segment the point was measured from. */
  segmentIndex: number;
  /** 'start' or 'end' when the foot lies on the extension of an end segment, else null. */
  beyond: 'start' | 'end' | null;
  /** How far past the end the foot lies (0 when not beyond). */
  distanceBeyond: number;
}

/** Station, offset and side of a grid point against a bore alignment (SPEC §4.2). */
export function stationOffset(alignment: AlignmentLike, beginStation: number, point: XY): StationOffset {
  assertFinite(beginStation, 'begin station');
  assertFinite(point[0], 'easting');
  assertFinite(point[1], 'northing');
  const a = prepareAlignment(alignment);
  const [px, py] = point;
  const foot = closestOnPolyline(a, px, py);
  const k = foot.segment;
  const x0 = a.xs[k]!;
  const y0 = a.ys[k]!;
  const len = a.cum[k + 1]! - a.cum[k]!;
  const ux = (a.xs[k + 1]! - x0) / len;
  const uy = (a.ys[k + 1]! - y0) / len;
  // cross > 0: the point is to the left of the direction of travel (counter-clockwise in E/N).
  const cross = ux * (py - y0) - uy * (px - x0);
  let chainage = foot.chainage;
  let beyond: 'start' | 'end' | null = null;
  let distanceBeyond = 0;
  let offset = foot.distance;
  // Distance along the segment's direction from its start, exact for axis-parallel segments.
  const along = ux * (px - x0) + uy * (py - y0);
  const eps = endTolerance(a);
  if (k === 0 && along < -eps) {
    beyond = 'start';
    chainage = along;
    distanceBeyond = -along;
    offset = Math.abs(cross);
  } else if (k === a.segmentCount - 1 && along - len > eps) {
    beyond = 'end';
    chainage = a.cum[k]! + along;
    distanceBeyond = along - len;
    offset = Math.abs(cross);
  }
  const signedOffset = cross > 0 ? -offset : offset;
  return {
    station: beginStation + chainage,
    offset,
    side: signedOffset < 0 ? 'L' : 'R',
    signedOffset: signedOffset === 0 ? 0 : signedOffset,
    segmentIndex: a.sourceSegment[k]!,
    beyond,
    distanceBeyond,
  };
}

/** Grid point of a station and offset; beyond the ends it runs along the extended end segment. */
export interface StationPoint {
  easting: number;
  northing: number;
  beyond: 'start' | 'end' | null;
  distanceBeyond: number;
}

/** Grid E/N of a station + offset (distance ≥ 0) + side: the inverse of `stationOffset`. */
export function pointAtStationOffset(
  alignment: AlignmentLike, beginStation: number, station: number, offset: number, side: Side,
): StationPoint {
  assertFinite(offset, 'offset');
  if (offset < 0) {
    throw new GeometryError('INVALID_OFFSET', 'offset is a distance (zero or more); give the side as L or R');
  }
  if (side !== 'L' && side !== 'R') throw new GeometryError('INVALID_OFFSET', `side must be L or R (got ${String(side)})`);
  return pointAtStationSignedOffset(alignment, beginStation, station, side === 'R' ? offset : -offset);
}

/** Grid E/N of a station and a signed offset (right positive). */
export function pointAtStationSignedOffset(
  alignment: AlignmentLike, beginStation: number, station: number, signedOffset: number,
): StationPoint {
  assertFinite(beginStation, 'begin station');
  assertFinite(station, 'station');
  assertFinite(signedOffset, 'offset');
  const a = prepareAlignment(alignment);
  const chainage = station - beginStation;
  const p = pointAtChainage(a, chainage);
  // Right-hand normal of the direction (ux, uy) is (uy, -ux).
  const eps = endTolerance(a);
  const beyond = chainage < -eps ? 'start' : chainage > a.length + eps ? 'end' : null;
  return {
    easting: p.x + p.uy * signedOffset,
    northing: p.y - p.ux * signedOffset,
    beyond,
    distanceBeyond: beyond === 'start' ? -chainage : beyond === 'end' ? chainage - a.length : 0,
  };
}

// ---------------------------------------------------------------------------------------------
// Parsing and formatting

const STATION_UNIT: Record<StationStyle, number> = { '100': 100, '1000': 1000 };
const STATION_DIGITS: Record<StationStyle, number> = { '100': 2, '1000': 3 };
const DEFAULT_DECIMALS: Record<StationStyle, number> = { '100': 2, '1000': 3 };

const PLUS_FORM = /^([+-])?(\d+)\+(\d+)(?:\.(\d*))?$/;
const PLAIN_FORM = /^([+-])?(\d+(?:\.\d*)?|\.\d+)$/;

/**
 * Parse a station typed in either the station form of the project's style (`12+34.56` for
 * 100-unit stations, `1+234.567` for 1000-unit stations) or as a plain distance (`1234.5`).
 * Negative stations (`-0+50.00`, `-1+23.45`) and spaces around the signs are accepted; the part
 * after `+` must have exactly two (100-unit) or three (1000-unit) whole digits. Anything else
 * throws INVALID_STATION with a message saying what is wrong.
 */
export function parseStation(text: string, style: StationStyle): number {
  if (typeof text !== 'string') throw new GeometryError('INVALID_STATION', 'a station must be text such as 12+34.56');
  const unit = STATION_UNIT[style];
  const digits = STATION_DIGITS[style];
  if (!unit || !digits) throw new GeometryError('INVALID_STATION', `unknown station style ${String(style)}`);
  const example = style === '100' ? '12+34.56' : '1+234.567';
  const cleaned = text
    .trim()
    .replace(/[\u2212\u2012\u2013]/g, '-') // typographic minus and dashes
    .replace(/^([+-])\s+/, '$1')
    .replace(/\s*\+\s*/g, '+');
  if (cleaned === '') throw new GeometryError('INVALID_STATION', `a station is required, e.g. ${example}`);
  if (/\s/.test(cleaned)) {
    throw new GeometryError('INVALID_STATION', `"${text}" is not a station: unexpected space (write e.g. ${example})`);
  }
  if (cleaned.includes(',')) {
    throw new GeometryError('INVALID_STATION', `"${text}" is not a station: use a point for decimals (e.g. ${example})`);
  }
  const plain = PLAIN_FORM.exec(cleaned);
  if (plain) return normaliseZero(Number(`${plain[1] ?? ''}${plain[2]!}`));
  const m = PLUS_FORM.exec(cleaned);
  if (!m) {
    throw new GeometryError('INVALID_STATION', `"${text}" is not a station (write e.g. ${example} or a plain distance such as 1234.5)`);
  }
  const [, sign, whole, part, decimals] = m;
  if (part!.length !== digits) {
    const partValue = Number(`${part!}.${decimals ?? ''}`);
    const hint =
      partValue >= unit
        ? `the part after + must be below ${unit} in ${unit}-unit stations`
        : `write ${digits} digits after + (e.g. ${whole!}+${String(Number(part!)).padStart(digits, '0')}${decimals !== undefined ? `.${decimals}` : ''})`;
    const other = style === '100' && part!.length === 3 ? '; this looks like a 1000-unit station' : style === '1000' && part!.length === 2 ? '; this looks like a 100-unit station' : '';
    throw new GeometryError('INVALID_STATION', `"${text}" is not a ${unit}-unit station: ${hint}${other}`);
  }
  return normaliseZero(Number(`${sign === '-' ? '-' : ''}${whole!}${part!}.${decimals ?? ''}`));
}

function normaliseZero(n: number): number {
  return n === 0 ? 0 : n;
}

/**
 * Format a station in the project's style: `12+34.56` (100-unit) or `1+234.567` (1000-unit),
 * negative stations with a leading minus (`-0+50.00`). Rounds first, so 1299.999 is `13+00.00`.
 */
export function formatStation(value: number, style: StationStyle, decimals: number = DEFAULT_DECIMALS[style]): string {
  assertFinite(value, 'station');
  if (!Number.isInteger(decimals) || decimals < 0 || decimals > 6) {
    throw new GeometryError('INVALID_INPUT', 'decimals must be a whole number from 0 to 6');
  }
  const unit = STATION_UNIT[style];
  const width = STATION_DIGITS[style];
  const scale = 10 ** decimals;
  const n = Math.round(Math.abs(value) * scale);
  const perStation = unit * scale;
  const whole = Math.floor(n / perStation);
  const rest = n - whole * perStation;
  const restWhole = Math.floor(rest / scale).toString().padStart(width, '0');
  const restDec = decimals > 0 ? `.${(rest % scale).toString().padStart(decimals, '0')}` : '';
  const sign = value < 0 && n !== 0 ? '-' : '';
  return `${sign}${whole}+${restWhole}${restDec}`;
}

/** Format an offset as a distance and a side, e.g. `12.50 R` (trade habit: no sign is guessed). */
export function formatOffset(signedOffset: number, decimals = 2): string {
  assertFinite(signedOffset, 'offset');
  const d = Math.abs(signedOffset).toFixed(decimals);
  if (Number(d) === 0) return d;
  return `${d} ${signedOffset < 0 ? 'L' : 'R'}`;
}
