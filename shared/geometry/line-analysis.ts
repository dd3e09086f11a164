/**
 * One line against one bore: figures at each crossing (or the closest point), requirement,
 * margin, allowance, status, verification, suggested holes, and pit conflicts
 * (SPEC §4.4–4.9). See engine.ts for the simplifications.
 */
import type { BoreContext } from './bore-context';
import { clearanceAllowance, clearanceStatus, statusRank, verticalClearance } from './clearance';
import { polylineDistance3d } from './closest3d';
import { findClosest, findCrossings, type PlanPoint } from './crossing';
import { topFromHoles } from './line-elevation';
import { pitPlanRelation } from './pit';
import { boxDistance } from './planar';
import { profileElevation } from './profile';
import type { LineContext, Scene } from './scene';
import { stationOffset } from './station';
import type { ClearancePoint, ElevationBasis, Issue, LineClearance, PitConflict, SuggestedHole, VerifyingHole } from './types';

interface TopAt {
  top: number;
  basis: ElevationBasis;
  extrapolationDistance: number;
}

/** Top of line at a chainage: from holes, else record depth below the bore's ground at `groundStation`. */
function lineTopAt(b: BoreContext, l: LineContext, chainage: number, groundStation: number): TopAt | Issue {
  const fromHoles = topFromHoles(l.model, chainage);
  if (fromHoles) {
    return {
      top: fromHoles.top,
      basis: { source: 'holes', mode: fromHoles.mode, holes: fromHoles.holes, extrapolationDistance: fromHoles.extrapolationDistance },
      extrapolationDistance: fromHoles.extrapolationDistance,
    };
  }
  if (l.recordDepth === null) {
    return { code: 'NO_ELEVATION', message: `line ${l.input.label} has no usable dug hole and no valid record depth: its elevation is unknown`, boreId: b.input.id, lineId: l.input.id };
  }
  const ground = b.ground ? profileElevation(b.ground, groundStation) : null;
  if (ground === null) {
    return {
      code: 'NO_GROUND_FOR_RECORD_DEPTH',
      message: `line ${l.input.label} has no usable dug hole, and the bore's ground profile does not reach station ${groundStation.toFixed(2)} to apply the record depth`,
      boreId: b.input.id,
      lineId: l.input.id,
    };
  }
  return {
    top: ground - l.recordDepth,
    basis: { source: 'record', recordDepth: l.recordDepth, groundElevation: ground, groundStation },
    extrapolationDistance: 0,
  };
}

/** Closest approach of the casing and line centrelines in 3-D minus radius and half-height (see engine.ts). */
function clearDistance3d(b: BoreContext, l: LineContext, segs: readonly number[], recordTop: number | null): number | null {
  if (!b.bore3d) return null;
  const hh = l.size.height / 2;
  const poly = l.poly;
  const holes = l.model.holes;
  let best = Infinity;
  for (const j of segs) {
    const c0 = poly.cum[j]!;
    const c1 = poly.cum[j + 1]!;
    const breaks = [c0];
    for (const h of holes) if (h.chainage > c0 && h.chainage < c1) breaks.push(h.chainage);
    breaks.push(c1);
    const xs: number[] = [];
    const ys: number[] = [];
    const zs: number[] = [];
    for (const c of breaks) {
      const f = (c - c0) / (c1 - c0);
      const top = recordTop ?? topFromHoles(l.model, c)!.top;
      xs.push(poly.xs[j]! + f * (poly.xs[j + 1]! - poly.xs[j]!) - b.ox);
      ys.push(poly.ys[j]! + f * (poly.ys[j + 1]! - poly.ys[j]!) - b.oy);
      zs.push(top - hh);
    }
    best = polylineDistance3d(b.bore3d, { xs, ys, zs }, best);
  }
  return Number.isFinite(best) ? best - b.radius - hh : null;
}

/** Usable dug holes of the line within `distance` (plan) of a point, nearest first. */
function verifyingHoles(l: LineContext, x: number, y: number, distance: number): VerifyingHole[] {
  const out: VerifyingHole[] = [];
  l.model.positions.forEach((pos, i) => {
    const d = Math.hypot(pos.x - x, pos.y - y);
    const h = l.model.holes[i]!;
    if (d <= distance) out.push({ id: h.id, number: h.number, distance: d });
  });
  return out.sort((p, q) => p.distance - q.distance || p.id - q.id);
}

/** Everything computed for one line against one bore: its clearance (or null when it is not near) and pit conflicts. */
export function analyseLine(
  scene: Scene, b: BoreContext, l: LineContext, segs: readonly number[],
): { clearance: LineClearance | null; pitConflicts: PitConflict[] } {
  const settings = scene.input.settings;
  const line = l.input;
  const ql = line.qualityLevel;
  const bore = b.input;
  const hw = l.size.width / 2;
  // Plain properties rather than object spread: spread with extra keys is a slow path in V8 here (3× on the benchmark).
  const boreId = bore.id;
  const lineId = line.id;
  const crossings = findCrossings(b, l, segs);
  let raws: PlanPoint[] = crossings;
  let relation: LineClearance['relation'] = 'crossing';
  if (crossings.length === 0) {
    relation = 'near';
    const closest = findClosest(b, l, segs);
    const hClear = closest.planDistance - b.radius - hw;
    const reportWithin = l.requiredHorizontal.value + bore.toleranceHorizontal + settings.qualityLevelUncertainty[ql] + settings.verificationDistance;
    raws = hClear <= reportWithin ? [closest] : [];
  }
  const sharedDistance3d = raws.length > 0 && l.model.holes.length > 0 ? clearDistance3d(b, l, segs, null) : undefined;
  const points: ClearancePoint[] = raws.map((r) => {
    const problems: Issue[] = [];
    const boreStation = b.begin + r.boreChainage;
    const so = r.kind === 'crossing' ? null : stationOffset(b.align, b.begin, [r.x, r.y]);
    const elev = lineTopAt(b, l, r.lineChainage, boreStation);
    let top: number | null = null;
    let basis: ElevationBasis | null = null;
    let extrapolation = 0;
    if ('code' in elev) problems.push(elev);
    else {
      top = elev.top;
      basis = elev.basis;
      extrapolation = elev.extrapolationDistance;
    }
    const centre = profileElevation(b.profile, boreStation);
    if (centre === null) {
      problems.push({
        code: 'STATION_OUTSIDE_PROFILE',
        message: `station ${boreStation.toFixed(2)} is outside the bore profile (${b.profile.start} to ${b.profile.end}): no vertical figures`,
        boreId,
        lineId,
      });
    }
    const ground = b.ground ? profileElevation(b.ground, boreStation) : null;
    const cover = ground !== null && centre !== null ? ground - (centre + b.radius) : null;
    const vert = top !== null && centre !== null ? verticalClearance(top, l.size.height, centre, b.radius) : null;
    const horizontalClearance = r.kind === 'closest' ? r.planDistance - b.radius - hw : null;
    const governing: 'vertical' | 'horizontal' = r.kind === 'crossing' || (horizontalClearance !== null && horizontalClearance < 0) ? 'vertical' : 'horizontal';
    let d3: number | null = null;
    if (sharedDistance3d !== undefined) d3 = sharedDistance3d;
    else if (top !== null) d3 = clearDistance3d(b, l, segs, top);
    // Crossing: vertical clearance at the crossing. Near line whose plan footprint overlaps the
    // casing's (running right above or below it): the 3-D clear distance, the least gap along the
    // whole stretch. Otherwise: horizontal clearance.
    const clearance =
      governing === 'horizontal' ? horizontalClearance : r.kind === 'crossing' ? (vert?.clearance ?? null) : centre === null ? null : d3;
    const req = governing === 'vertical' ? l.requiredVertical : l.requiredHorizontal;
    const allowance = clearanceAllowance(governing === 'vertical' ? bore.toleranceVertical : bore.toleranceHorizontal, settings, ql, extrapolation);
    const verifying = verifyingHoles(l, r.x, r.y, settings.verificationDistance);
    const verified = verifying.length > 0;
    return {
      kind: r.kind,
      station: so ? so.station : boreStation,
      offset: so ? so.offset : 0,
      side: so ? so.side : 'R',
      beyond: so ? so.beyond : null,
      easting: r.x,
      northing: r.y,
      lineChainage: r.lineChainage,
      crossingAngle: r.angle,
      skew: r.angle === null ? null : 90 - r.angle,
      planDistance: r.planDistance,
      horizontalClearance,
      boreStation,
      position: vert?.position ?? null,
      lineTop: top,
      lineBottom: top === null ? null : top - l.size.height,
      boreCentreline: centre,
      ground,
      cover,
      verticalClearance: vert?.clearance ?? null,
      clearDistance3d: d3,
      governing,
      clearance,
      required: req.value,
      margin: clearance === null ? null : clearance - req.value,
      allowance,
      status: clearanceStatus(clearance, req.value, allowance, verified),
      verified,
      verifyingHoles: verifying,
      elevation: basis,
      problems,
    };
  });

  let clearance: LineClearance | null = null;
  if (points.length > 0) {
    let g = 0;
    points.forEach((p, i) => {
      const q = points[g]!;
      const byRank = statusRank(p.status) - statusRank(q.status);
      if (byRank < 0 || (byRank === 0 && (p.margin ?? -Infinity) < (q.margin ?? -Infinity))) g = i;
    });
    const gp = points[g]!;
    const suggestedHoles: SuggestedHole[] = points
      .filter((p) => !p.verified)
      .map((p) => ({
        boreId,
        lineId,
        reason: p.kind === 'crossing' ? 'crossing' : 'closest_point',
        easting: p.easting,
        northing: p.northing,
        station: p.station,
        offset: p.offset,
        side: p.side,
      }));
    const d3s = points.map((p) => p.clearDistance3d).filter((v): v is number => v !== null);
    clearance = {
      boreId,
      lineId,
      label: line.label,
      kind: line.kind,
      relation,
      status: gp.status,
      governingPoint: g,
      points,
      clearance: gp.clearance,
      required: gp.required,
      requiredSource: (gp.governing === 'vertical' ? l.requiredVertical : l.requiredHorizontal).source,
      margin: gp.margin,
      allowance: gp.allowance,
      clearDistance3d: d3s.length > 0 ? Math.min(...d3s) : null,
      verified: points.every((p) => p.verified),
      suggestedHoles,
    };
  }

  return { clearance, pitConflicts: pitConflictsOf(b, l, segs) };
}

/**
 * Pit conflicts of one line (SPEC §4.7): the line's plan path enters a pit footprint (centreline
 * inside, or its edge within half its width) or comes within its horizontal requirement, and its
 * bottom is above the pit bottom. The bottom is the highest found at the closest point and where
 * the path enters the footprint; an unknown elevation counts as a conflict (with the problem).
 */
export function pitConflictsOf(b: BoreContext, l: LineContext, segs: readonly number[]): PitConflict[] {
  const boreId = b.input.id;
  const lineId = l.input.id;
  const hw = l.size.width / 2;
  const pitConflicts: PitConflict[] = [];
  for (const pit of b.pits) {
    // Only segments whose boxes come within half-width + requirement of the pit's box can matter.
    const limit = hw + l.requiredHorizontal.value;
    const [px0, py0, px1, py1] = pit.bbox;
    const near = segs.filter((j) => {
      const p = l.poly;
      const x0 = p.xs[j]!, y0 = p.ys[j]!, x1 = p.xs[j + 1]!, y1 = p.ys[j + 1]!;
      return boxDistance(Math.min(x0, x1), Math.min(y0, y1), Math.max(x0, x1), Math.max(y0, y1), px0, py0, px1, py1) <= limit;
    });
    if (near.length === 0) continue;
    const rel = pitPlanRelation(pit, l.poly, near);
    const enters = rel.entersCentreline || rel.distance <= hw;
    const planGap = enters ? 0 : rel.distance - hw;
    const req = l.requiredHorizontal.value;
    if (!(enters || planGap < req)) continue;
    const groundStation = stationOffset(b.align, b.begin, [rel.x, rel.y]).station;
    const problems: Issue[] = [];
    let lineBottom: number | null = -Infinity;
    let basis: ElevationBasis | null = null;
    for (const c of [rel.chainage, ...rel.insideChainages]) {
      const t = lineTopAt(b, l, c, groundStation);
      if ('code' in t) {
        problems.push({ code: t.code, message: t.message, boreId, lineId, pitId: pit.input.id });
        lineBottom = null;
        break;
      }
      const bottom = t.top - l.size.height;
      if (lineBottom !== null && bottom > lineBottom) {
        lineBottom = bottom;
        basis = t.basis;
      }
    }
    const pitBottom = pit.input.bottomElevation;
    if (lineBottom !== null && lineBottom <= pitBottom) continue;
    pitConflicts.push({
      boreId,
      lineId,
      pitId: pit.input.id,
      pitKind: pit.input.kind,
      label: l.input.label,
      enters,
      planGap,
      requiredHorizontal: req,
      lineBottom,
      pitBottom,
      heightAbovePitBottom: lineBottom === null ? null : lineBottom - pitBottom,
      easting: rel.x,
      northing: rel.y,
      elevation: basis,
      problems,
    });
  }
  return pitConflicts;
}
