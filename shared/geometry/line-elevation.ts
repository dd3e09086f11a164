/**
 * Top-of-line elevation along a line from its test holes (SPEC §4.4).
 *
 * Each dug hole gives a top elevation (surveyed top wins; else ground − depth, adjusted for a
 * depth measured to the centre or bottom using the line height) at its position projected onto
 * the line's plan polyline. Between holes the top is linear in distance along the line; beyond
 * the outermost hole it is held flat and marked extrapolated with the distance; with no usable
 * hole the caller falls back to the record depth (and the line is unverified).
 */
import type { HoleStatus, QualityLevel } from '../domain';
import type { ProjectSettings } from '../schemas/project';
import { closestOnPolyline, type PreparedPolyline } from './polyline';
import type { HoleInput, HoleUse, Issue, LineInput } from './types';

/** Hole statuses that mean the line was exposed ("dug"). */
export const DUG_STATUSES: ReadonlySet<HoleStatus> = new Set<HoleStatus>(['dug', 'surveyed', 'reviewed']);

/** True when the hole has been dug (dug, surveyed or reviewed). */
export function isDug(hole: Pick<HoleInput, 'status'>): boolean {
  return DUG_STATUSES.has(hole.status);
}

/** Outside size of a line: height (vertical extent) and width (plan extent). */
export interface LineSize {
  height: number;
  width: number;
}

/** Size of a line from its shape (round: diameter both ways; box: width × height), or null when missing/invalid. */
export function lineSize(line: Pick<LineInput, 'shape' | 'diameter' | 'width' | 'height'>): LineSize | null {
  const ok = (v: number | null | undefined): v is number => typeof v === 'number' && Number.isFinite(v) && v > 0;
  if (line.shape === 'box') return ok(line.width) && ok(line.height) ? { height: line.height, width: line.width } : null;
  return ok(line.diameter) ? { height: line.diameter, width: line.diameter } : null;
}

/**
 * Farthest a dug hole may lie from its line as drawn and still be used: the verification
 * distance plus the line's location uncertainty for its quality level. Farther holes are
 * flagged (HOLE_FAR_FROM_LINE) and not used: either the line is drawn in the wrong place or the
 * hole is linked to the wrong line, and a person must decide which.
 */
export function maxHoleOffset(settings: ProjectSettings, ql: QualityLevel): number {
  return settings.verificationDistance + settings.qualityLevelUncertainty[ql];
}

/** The grid position of a hole: the surveyed one when both surveyed coordinates are present. */
export function holePosition(hole: HoleInput): { x: number; y: number; surveyed: boolean } {
  const se = hole.surveyedEasting;
  const sn = hole.surveyedNorthing;
  if (se != null && sn != null) return { x: se, y: sn, surveyed: true };
  return { x: hole.easting, y: hole.northing, surveyed: false };
}

const fin = (v: number | null | undefined): v is number => typeof v === 'number' && Number.isFinite(v);
const bad = (v: number | null | undefined): boolean => v != null && !Number.isFinite(v);

/**
 * Top-of-line elevation at one hole, or an issue saying why it gives none. Surveyed top wins;
 * else (surveyed ground, else ground) − depth, plus half the height for a depth to centre or the
 * full height for a depth to bottom. The height is the hole's measured size when logged, else
 * the line's.
 */
export function holeTopElevation(
  hole: HoleInput, line: Pick<LineInput, 'shape'>, size: LineSize,
): { top: number; source: HoleUse['source'] } | Issue {
  const numbers = [hole.surveyedTopElevation, hole.surveyedGroundElevation, hole.groundElevation, hole.depthToTop, hole.measuredSize, hole.boxHeight];
  if (numbers.some(bad)) {
    return { code: 'HOLE_INVALID_NUMBER', message: `hole ${hole.number} has a value that is not a finite number`, holeId: hole.id, lineId: hole.lineId };
  }
  if (fin(hole.surveyedTopElevation)) return { top: hole.surveyedTopElevation, source: 'surveyed_top' };
  const ground = fin(hole.surveyedGroundElevation) ? hole.surveyedGroundElevation : hole.groundElevation;
  if (!fin(ground) || !fin(hole.depthToTop)) {
    return {
      code: 'HOLE_NO_ELEVATION',
      message: `hole ${hole.number} is dug but has no ${!fin(ground) ? 'ground elevation' : 'depth'} and no surveyed top elevation; it is not used`,
      holeId: hole.id,
      lineId: hole.lineId,
    };
  }
  const measured = line.shape === 'box' ? hole.boxHeight : hole.measuredSize;
  const height = fin(measured) && measured > 0 ? measured : size.height;
  const adjust = hole.depthReference === 'centre' ? height / 2 : hole.depthReference === 'bottom' ? height : 0;
  return { top: ground - hole.depthToTop + adjust, source: 'ground_minus_depth' };
}

/** The holes usable on one line, sorted along it. */
export interface LineElevationModel {
  /** Usable holes in order of chainage (holes at the same chainage are kept; their tops are averaged). */
  holes: HoleUse[];
  /** Plan positions of the usable holes (same order), for the verification check. */
  positions: { x: number; y: number }[];
  /** Chainage tolerance for "at a hole". */
  eps: number;
}

/** Build the elevation model of a line from its holes; unusable dug holes come back as issues. */
export function buildLineElevationModel(
  line: LineInput, poly: PreparedPolyline, size: LineSize, holes: readonly HoleInput[], settings: ProjectSettings,
): { model: LineElevationModel; issues: Issue[] } {
  const issues: Issue[] = [];
  const used: { use: HoleUse; x: number; y: number }[] = [];
  const limit = maxHoleOffset(settings, line.qualityLevel);
  for (const hole of holes) {
    if (!isDug(hole)) continue;
    const pos = holePosition(hole);
    if (!Number.isFinite(pos.x) || !Number.isFinite(pos.y)) {
      issues.push({ code: 'HOLE_INVALID_POSITION', message: `hole ${hole.number} has no valid grid position; it is not used`, holeId: hole.id, lineId: line.id });
      continue;
    }
    const top = holeTopElevation(hole, line, size);
    if ('code' in top) {
      issues.push(top);
      continue;
    }
    const foot = closestOnPolyline(poly, pos.x, pos.y);
    if (foot.distance > limit) {
      issues.push({
        code: 'HOLE_FAR_FROM_LINE',
        message:
          `hole ${hole.number} lies ${foot.distance.toFixed(2)} from line ${line.label} as drawn (more than ${limit.toFixed(2)}); ` +
          'it is not used: check the line position or the hole’s line',
        holeId: hole.id,
        lineId: line.id,
      });
      continue;
    }
    used.push({
      use: {
        id: hole.id,
        number: hole.number,
        chainage: foot.chainage,
        offsetFromLine: foot.distance,
        topElevation: top.top,
        source: top.source,
        approximate: hole.approximate,
      },
      x: pos.x,
      y: pos.y,
    });
  }
  used.sort((a, b) => a.use.chainage - b.use.chainage || a.use.id - b.use.id);
  return {
    model: { holes: used.map((u) => u.use), positions: used.map((u) => ({ x: u.x, y: u.y })), eps: 1e-9 * Math.max(1, poly.length) },
    issues,
  };
}

/** Top elevation at a chainage from holes, with its basis; null when the line has no usable hole. */
export interface TopFromHoles {
  top: number;
  mode: 'at_hole' | 'interpolated' | 'extrapolated';
  holes: HoleUse[];
  extrapolationDistance: number;
}

/** Group holes sharing a chainage: their mean top and the holes. */
function groupAt(holes: readonly HoleUse[], index: number, eps: number): { top: number; holes: HoleUse[]; chainage: number } {
  const c = holes[index]!.chainage;
  const group: HoleUse[] = [];
  for (let i = index; i >= 0 && Math.abs(holes[i]!.chainage - c) <= eps; i--) group.unshift(holes[i]!);
  for (let i = index + 1; i < holes.length && Math.abs(holes[i]!.chainage - c) <= eps; i++) group.push(holes[i]!);
  const top = group.reduce((s, h) => s + h.topElevation, 0) / group.length;
  return { top, holes: group, chainage: c };
}

/** Top-of-line elevation at a chainage: at a hole, linear between holes, or held flat beyond the outermost. */
export function topFromHoles(model: LineElevationModel, chainage: number): TopFromHoles | null {
  const h = model.holes;
  const n = h.length;
  if (n === 0) return null;
  const eps = model.eps;
  const first = h[0]!;
  const last = h[n - 1]!;
  if (chainage <= first.chainage + eps) {
    const g = groupAt(h, 0, eps);
    const d = g.chainage - chainage;
    return d <= eps
      ? { top: g.top, mode: 'at_hole', holes: g.holes, extrapolationDistance: 0 }
      : { top: g.top, mode: 'extrapolated', holes: g.holes, extrapolationDistance: d };
  }
  if (chainage >= last.chainage - eps) {
    const g = groupAt(h, n - 1, eps);
    const d = chainage - g.chainage;
    return d <= eps
      ? { top: g.top, mode: 'at_hole', holes: g.holes, extrapolationDistance: 0 }
      : { top: g.top, mode: 'extrapolated', holes: g.holes, extrapolationDistance: d };
  }
  // Last hole at or before the chainage.
  let lo = 0;
  let hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (h[mid]!.chainage <= chainage) lo = mid;
    else hi = mid;
  }
  const a = groupAt(h, lo, eps);
  if (chainage - a.chainage <= eps) return { top: a.top, mode: 'at_hole', holes: a.holes, extrapolationDistance: 0 };
  let next = lo + 1;
  while (next < n && h[next]!.chainage - a.chainage <= eps) next++;
  const b = groupAt(h, next, eps);
  if (b.chainage - chainage <= eps) return { top: b.top, mode: 'at_hole', holes: b.holes, extrapolationDistance: 0 };
  const f = (chainage - a.chainage) / (b.chainage - a.chainage);
  return { top: a.top + f * (b.top - a.top), mode: 'interpolated', holes: [...a.holes, ...b.holes], extrapolationDistance: 0 };
}
