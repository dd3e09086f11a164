/**
 * Checks of the demo data, shared by seeds/check-demo.ts (prints) and
 * tests/seeds/demo-data.test.ts (asserts): schema validity, coordinates inside each CRS's area
 * of use, holes on their lines, crossings where the data says, and the clearance picture each
 * line was designed to show, re-computed with plain planar math.
 */
import proj4 from 'proj4';
import { type ClearanceStatus, type LineKind, HOLE_STATUSES, ROLES } from '@shared/domain';
import { can } from '@shared/permissions';
import { userCreateSchema } from '@shared/schemas/auth';
import { boreCreateSchema, pitCreateSchema } from '@shared/schemas/bore';
import { holeCreateSchema, holeSurveySchema } from '@shared/schemas/hole';
import { lineCreateSchema } from '@shared/schemas/line';
import { clearanceRuleSchema, projectCreateSchema } from '@shared/schemas/project';
import {
  type Pt,
  acuteAngle,
  directionAt,
  dist,
  fromStationOffset,
  insideRing,
  polylineCrossings,
  polylineGap,
  profileAt,
  projectOnPolyline,
  stationOffset,
} from './plan';
import type { DemoBore, DemoHole, DemoLine, DemoScenario, DemoUser } from './types';

/** Longitude/latitude box of a CRS's area of use (degrees, west negative). */
export interface AreaOfUse {
  name: string;
  west: number;
  east: number;
  south: number;
  north: number;
  source: string;
}

/**
 * Areas of use of the CRSs the demo uses. EPSG:2278 is the box given in the team brief
 * (a little tighter than the EPSG record, which runs to about 27.78°N and 93.5°W);
 * EPSG:26914 is the 102°W–96°W strip of NAD83 / UTM zone 14N.
 */
export const AREAS_OF_USE: Record<string, AreaOfUse> = {
  'EPSG:2278': { name: 'NAD83 / Texas South Central (ftUS)', west: -100.7, east: -95.0, south: 28.2, north: 30.6, source: 'team brief (inside the EPSG area of use)' },
  'EPSG:26914': { name: 'NAD83 / UTM zone 14N', west: -102.0, east: -96.0, south: 25.83, north: 84.0, source: 'EPSG area of use, 102°W to 96°W' },
};

/** The invented region both demo projects sit in (to keep them "in the same place"). */
export const DEMO_REGION: AreaOfUse = { name: 'Tallowmere demo region', west: -97.8, east: -97.2, south: 29.1, north: 29.5, source: 'demo design' };

/** How far from the design point a hole may be and still count as "on its line". */
export const ON_LINE_TOLERANCE = 0.05;

export interface Problem {
  where: string;
  message: string;
}

export interface LineClearance {
  lineKey: string;
  label: string;
  kind: LineKind;
  relation: 'crossing' | 'parallel';
  /** Station of the crossing, or of the bore point closest to the line. */
  station: number;
  skewDeg?: number;
  topElevation?: number;
  bottomElevation?: number;
  boreCentreline?: number;
  above?: boolean;
  clearance: number;
  required: number;
  margin: number;
  allowance: number;
  extrapolatedBy: number;
  fromRecordDepth: boolean;
  verified: boolean;
  holesUsed: string[];
  status: ClearanceStatus;
  intended?: ClearanceStatus;
}

export interface ScenarioReport {
  key: string;
  problems: Problem[];
  clearances: LineClearance[];
  /** Pit footprints a line enters or passes within its horizontal requirement of. */
  pitNear: { lineKey: string; pit: string; distance: number }[];
}

const converters = new Map<string, proj4.Converter>();
function toLonLat(proj4Def: string, p: Pt): Pt {
  let c = converters.get(proj4Def);
  if (!c) {
    c = proj4(proj4Def, 'EPSG:4326');
    converters.set(proj4Def, c);
  }
  const r = c.forward([p[0], p[1]]);
  return [r[0]!, r[1]!];
}

function insideArea(lonLat: Pt, a: AreaOfUse): boolean {
  return lonLat[0] >= a.west && lonLat[0] <= a.east && lonLat[1] >= a.south && lonLat[1] <= a.north;
}

/** The line's outside height (box) or diameter (round). */
export function lineHeight(l: DemoLine): number {
  return l.shape === 'box' ? l.height! : l.diameter!;
}

/** The line's outside width (box) or diameter (round). */
export function lineWidth(l: DemoLine): number {
  return l.shape === 'box' ? l.width! : l.diameter!;
}

/** Plan position of a hole: surveyed values win. */
export function holePosition(h: DemoHole): Pt {
  return [h.surveyedEasting ?? h.easting!, h.surveyedNorthing ?? h.northing!];
}

/** Top-of-line elevation a dug hole gives: surveyed value, else ground − depth. */
export function holeTop(h: DemoHole, l: DemoLine): number | null {
  if (h.status === 'planned') return null;
  if (h.surveyedTopElevation != null) return h.surveyedTopElevation;
  const ground = h.surveyedGroundElevation ?? h.groundElevation;
  if (ground == null || h.depthToTop == null) return null;
  if (h.depthReference === 'centre') return ground - h.depthToTop + lineHeight(l) / 2;
  if (h.depthReference === 'bottom') return ground - h.depthToTop + lineHeight(l);
  return ground - h.depthToTop;
}

function strip<T extends object, K extends keyof T>(o: T, keys: K[]): Omit<T, K> {
  const copy = { ...o };
  for (const k of keys) delete copy[k];
  return copy;
}

function zodProblems(where: string, result: { success: boolean; error?: { issues: { path: PropertyKey[]; message: string }[] } }): Problem[] {
  if (result.success) return [];
  return (result.error?.issues ?? []).map((i) => ({ where, message: `${i.path.map(String).join('.') || '(record)'}: ${i.message}` }));
}

/** Checks on the demo users: schema, unique e-mails, every role, reserved domains. */
export function checkUsers(users: DemoUser[]): Problem[] {
  const problems: Problem[] = [];
  const seen = new Set<string>();
  for (const u of users) {
    problems.push(...zodProblems(`user ${u.email}`, userCreateSchema.safeParse(strip(u, ['active']))));
    if (seen.has(u.email)) problems.push({ where: `user ${u.email}`, message: 'duplicate e-mail' });
    seen.add(u.email);
    if (!/@([a-z0-9-]+\.)*example\.com$|\.test$/.test(u.email)) problems.push({ where: `user ${u.email}`, message: 'e-mail must use example.com or a .test domain' });
  }
  for (const role of ROLES) {
    if (!users.some((u) => u.role === role && u.active !== false)) problems.push({ where: 'users', message: `no active user with role ${role}` });
  }
  return problems;
}

/** Every check on one scenario, plus the clearance picture per line. */
export function verifyScenario(s: DemoScenario, users: DemoUser[]): ScenarioReport {
  const problems: Problem[] = [];
  const p = (where: string, message: string) => problems.push({ where, message });
  const settings = s.project.settings;
  const unit = s.project.unit;

  // 1. schemas
  problems.push(...zodProblems('project', projectCreateSchema.safeParse(s.project)));
  for (const r of s.rules) problems.push(...zodProblems(`rule ${r.kind}`, clearanceRuleSchema.safeParse(r)));
  const ruleKinds = new Set(s.rules.map((r) => r.kind));
  if (ruleKinds.size !== s.rules.length) p('rules', 'more than one rule for a kind');
  for (const b of s.bores) {
    problems.push(...zodProblems(`bore ${b.key}`, boreCreateSchema.safeParse(strip(b, ['key', 'pits']))));
    for (const pit of b.pits) problems.push(...zodProblems(`bore ${b.key} ${pit.kind} pit`, pitCreateSchema.safeParse({ ...pit, boreId: 1 })));
  }
  const lineKeys = new Set<string>();
  for (const l of s.lines) {
    problems.push(...zodProblems(`line ${l.key}`, lineCreateSchema.safeParse(strip(l, ['key']))));
    if (lineKeys.has(l.key)) p(`line ${l.key}`, 'duplicate key');
    lineKeys.add(l.key);
    if (!ruleKinds.has(l.kind) && (l.requiredVertical == null || l.requiredHorizontal == null)) p(`line ${l.key}`, `no rule for kind ${l.kind}`);
    if (l.contactEmail && !/@([a-z0-9-]+\.)*example\.com$|\.test$/.test(l.contactEmail)) p(`line ${l.key}`, 'contact e-mail must use example.com or .test');
    if (!s.intended[l.key]) p(`line ${l.key}`, 'no intended clearance picture');
  }
  for (const k of Object.keys(s.intended)) if (!lineKeys.has(k)) p(`intended ${k}`, 'names no line');

  const userByEmail = new Map(users.map((u) => [u.email, u]));
  for (const m of s.members) if (!userByEmail.has(m)) p('members', `${m} is not a demo user`);

  const numbers = new Set<string>();
  const clientIds = new Set<string>();
  for (const h of s.holes) {
    const where = `hole ${h.number}`;
    const fields = strip(h, [
      'lineKey', 'boreKey', 'clientId', 'status', 'createdByEmail', 'photos',
      'surveyedEasting', 'surveyedNorthing', 'surveyedTopElevation', 'surveyedGroundElevation',
    ]);
    problems.push(...zodProblems(where, holeCreateSchema.safeParse({ ...fields, lineId: 1, boreId: h.boreKey ? 1 : undefined, clientId: h.clientId })));
    problems.push(
      ...zodProblems(
        `${where} survey`,
        holeSurveySchema.safeParse({
          surveyedEasting: h.surveyedEasting,
          surveyedNorthing: h.surveyedNorthing,
          surveyedTopElevation: h.surveyedTopElevation,
          surveyedGroundElevation: h.surveyedGroundElevation,
          version: 1,
        }),
      ),
    );
    if (numbers.has(h.number)) p(where, 'number used twice in the project');
    numbers.add(h.number);
    if (clientIds.has(h.clientId)) p(where, 'clientId used twice');
    clientIds.add(h.clientId);
    if (!lineKeys.has(h.lineKey)) p(where, `unknown line ${h.lineKey}`);
    if (h.boreKey && !s.bores.some((b) => b.key === h.boreKey)) p(where, `unknown bore ${h.boreKey}`);
    const author = userByEmail.get(h.createdByEmail);
    if (!author) p(where, `createdByEmail ${h.createdByEmail} is not a demo user`);
    else if (!can(author.role, 'hole.create')) p(where, `${author.email} (${author.role}) may not create holes`);
    else if (!s.members.includes(author.email) && author.role !== 'admin') p(where, `${author.email} is not a project member`);

    // status consistency
    const dugFields = h.groundElevation != null && h.depthToTop != null && h.dugAt != null && h.crew != null;
    const surveyed = h.surveyedTopElevation != null && h.surveyedEasting != null && h.surveyedNorthing != null && h.surveyedGroundElevation != null;
    if (h.status === 'planned') {
      if (h.depthToTop != null || h.dugAt != null || surveyed) p(where, 'a planned hole has no depth, dig date or survey');
      if (h.photos?.length) p(where, 'a planned hole has no photos');
    } else {
      if (!dugFields) p(where, `a ${h.status} hole needs ground, depth, dugAt and crew`);
      if (h.dugAt && !h.dugAt.startsWith('2026-')) p(where, 'dugAt should be in 2026');
      if (h.status === 'dug' && (h.surveyedTopElevation != null || h.surveyedEasting != null)) p(where, 'a dug hole is not surveyed yet');
      if ((h.status === 'surveyed' || h.status === 'reviewed') && !surveyed) p(where, `a ${h.status} hole needs surveyed E/N, top and ground`);
      if (surveyed && h.groundElevation != null && h.depthToTop != null) {
        const diff = h.surveyedTopElevation! - (h.groundElevation - h.depthToTop);
        const tol = unit === 'm' ? 0.03 : 0.1;
        if (Math.abs(diff) > tol) p(where, `surveyed top differs from ground − depth by ${diff.toFixed(3)}`);
        if (Math.abs(h.surveyedGroundElevation! - h.groundElevation) > tol) p(where, 'surveyed ground differs from the logged ground');
      }
    }
  }
  for (const st of HOLE_STATUSES) if (!s.holes.some((h) => h.status === st)) p('holes', `no hole with status ${st}`);

  // 2. coordinates inside the area of use
  const area = AREAS_OF_USE[s.project.crsCode];
  if (!area) p('project', `no area of use known for ${s.project.crsCode}`);
  const checkPt = (where: string, pt: Pt) => {
    const ll = toLonLat(s.project.crsProj4, pt);
    if (!Number.isFinite(ll[0]) || !Number.isFinite(ll[1])) return p(where, `does not convert: ${pt.join(', ')}`);
    if (area && !insideArea(ll, area)) p(where, `lon/lat ${ll[0].toFixed(5)}, ${ll[1].toFixed(5)} is outside ${area.name}`);
    if (!insideArea(ll, DEMO_REGION)) p(where, `lon/lat ${ll[0].toFixed(5)}, ${ll[1].toFixed(5)} is outside the demo region`);
  };
  for (const b of s.bores) {
    b.alignment.forEach((v, i) => checkPt(`bore ${b.key} vertex ${i}`, v));
    for (const pit of b.pits) pit.footprint.forEach((v, i) => checkPt(`bore ${b.key} ${pit.kind} pit corner ${i}`, v));
  }
  for (const l of s.lines) l.path.forEach((v, i) => checkPt(`line ${l.key} vertex ${i}`, v));
  for (const h of s.holes) {
    checkPt(`hole ${h.number}`, [h.easting!, h.northing!]);
    if (h.surveyedEasting != null) checkPt(`hole ${h.number} surveyed`, [h.surveyedEasting, h.surveyedNorthing!]);
  }

  // 3. holes on their lines; station holes agree with their grid position
  const lineByKey = new Map(s.lines.map((l) => [l.key, l]));
  const boreByKey = new Map(s.bores.map((b) => [b.key, b]));
  for (const h of s.holes) {
    const l = lineByKey.get(h.lineKey);
    if (!l) continue;
    const d = projectOnPolyline([h.easting!, h.northing!], l.path).distance;
    if (d >= ON_LINE_TOLERANCE) p(`hole ${h.number}`, `is ${d.toFixed(3)} off line ${l.key}`);
    if (h.surveyedEasting != null) {
      const ds = projectOnPolyline([h.surveyedEasting, h.surveyedNorthing!], l.path).distance;
      if (ds >= ON_LINE_TOLERANCE) p(`hole ${h.number}`, `surveyed position is ${ds.toFixed(3)} off line ${l.key}`);
    }
    if (h.positionSource === 'station') {
      const b = h.boreKey ? boreByKey.get(h.boreKey) : undefined;
      if (!b) continue;
      const signed = (h.offset ?? 0) * (h.offsetSide === 'L' ? -1 : 1);
      const q = fromStationOffset(b.alignment, b.beginStation, h.station!, signed);
      const e = dist(q, [h.easting!, h.northing!]);
      if (e > 0.02) p(`hole ${h.number}`, `station/offset gives a point ${e.toFixed(3)} from its easting/northing`);
    }
  }

  // 4. bores: ends in their pits, profile under the ground with cover, holes' ground plausible
  const pitNear: ScenarioReport['pitNear'] = [];
  for (const b of s.bores) {
    const r = b.casingOd / 2;
    const end = b.beginStation + b.alignment.slice(1).reduce((acc, v, i) => acc + dist(b.alignment[i]!, v), 0);
    for (const pit of b.pits) {
      const at = pit.kind === 'launch' ? b.alignment[0]! : b.alignment[b.alignment.length - 1]!;
      const st = pit.kind === 'launch' ? b.beginStation : end;
      if (!insideRing(at, pit.footprint)) p(`bore ${b.key} ${pit.kind} pit`, 'does not contain its end of the bore');
      const invert = profileAt(b.profile, st) - r;
      if (pit.bottomElevation > invert) p(`bore ${b.key} ${pit.kind} pit`, `bottom ${pit.bottomElevation} is above the casing invert ${invert.toFixed(2)}`);
    }
    if (Math.abs(b.profile[0]!.station - b.beginStation) > 1e-6 || Math.abs(b.profile[b.profile.length - 1]!.station - end) > 0.05) {
      p(`bore ${b.key}`, 'profile does not span the alignment');
    }
    const stations = [...new Set([...b.profile, ...b.groundProfile].map((q) => q.station))].filter((x) => x >= b.beginStation && x <= end);
    for (const st of stations) {
      const cover = profileAt(b.groundProfile, st) - (profileAt(b.profile, st) + r);
      if (cover < b.minCover - 1e-9) p(`bore ${b.key}`, `cover ${cover.toFixed(2)} at station ${st.toFixed(2)} is under the minimum ${b.minCover}`);
    }
  }

  // 5. crossings, gaps and the clearance picture
  const clearances: LineClearance[] = [];
  const bore = s.bores[0]!;
  for (const l of s.lines) {
    const c = lineClearance(s, bore, l);
    clearances.push(c);
    const want = s.intended[l.key];
    if (want && want.relation !== c.relation) p(`line ${l.key}`, `meant to be ${want.relation} but is ${c.relation} in plan`);
    if (want && want.status !== c.status) p(`line ${l.key}`, `meant to be ${want.status} but the planar check gives ${c.status}`);
    // crossing lines: their holes near the crossing agree with the bore's ground profile
    if (c.relation === 'crossing') {
      const x = polylineCrossings(l.path, bore.alignment)[0]!;
      for (const h of s.holes.filter((h) => h.lineKey === l.key && h.groundElevation != null)) {
        if (dist([h.easting!, h.northing!], x.point) > settings.verificationDistance) continue;
        const g = profileAt(bore.groundProfile, c.station);
        const tol = unit === 'm' ? 0.1 : 0.3;
        if (Math.abs(h.groundElevation! - g) > tol) p(`hole ${h.number}`, `ground ${h.groundElevation} differs from the bore's ground profile ${g.toFixed(2)} at the crossing`);
      }
    }
    // pits
    const requiredH = l.requiredHorizontal ?? s.rules.find((r) => r.kind === l.kind)?.horizontal ?? 0;
    for (const pit of bore.pits) {
      const ring = [...pit.footprint, pit.footprint[0]!];
      const enters = l.path.some((v) => insideRing(v, pit.footprint)) || polylineCrossings(l.path, ring).length > 0;
      const gap = enters ? 0 : polylineGap(l.path, ring).distance - lineWidth(l) / 2;
      if (gap < requiredH) pitNear.push({ lineKey: l.key, pit: pit.kind, distance: gap });
    }
  }
  const groundMin = Math.min(...bore.groundProfile.map((g) => g.elevation));
  const groundMax = Math.max(...bore.groundProfile.map((g) => g.elevation));
  for (const h of s.holes) {
    if (h.groundElevation != null && (h.groundElevation < groundMin - 0.5 || h.groundElevation > groundMax + 0.5)) {
      p(`hole ${h.number}`, `ground ${h.groundElevation} is outside the site's ground range ${groundMin}–${groundMax}`);
    }
  }

  return { key: s.key, problems, clearances, pitNear };
}

/**
 * Clearance of one line against one bore, following SPEC §4 in the simplest planar way.
 * Vertical at a plan crossing, horizontal for a line that never crosses.
 */
export function lineClearance(s: DemoScenario, bore: DemoBore, l: DemoLine): LineClearance {
  const settings = s.project.settings;
  const rule = s.rules.find((r) => r.kind === l.kind);
  const r = bore.casingOd / 2;
  const ql = settings.qualityLevelUncertainty[l.qualityLevel];
  const dugHoles = s.holes.filter((h) => h.lineKey === l.key && h.status !== 'planned');
  const crossings = polylineCrossings(l.path, bore.alignment);

  if (crossings.length > 0) {
    const x = crossings[0]!;
    const station = bore.beginStation + x.alongQ;
    const skewDeg = acuteAngle(directionAt(l.path, x.alongP), directionAt(bore.alignment, x.alongQ));
    // top of line at the crossing from the holes (linear along the line, flat beyond them)
    const samples = dugHoles
      .map((h) => ({ number: h.number, along: projectOnPolyline(holePosition(h), l.path).along, top: holeTop(h, l) }))
      .filter((q): q is { number: string; along: number; top: number } => q.top != null)
      .sort((a, b) => a.along - b.along);
    let top: number;
    let extrapolatedBy = 0;
    let holesUsed: string[] = [];
    const fromRecordDepth = samples.length === 0;
    if (fromRecordDepth) {
      top = profileAt(bore.groundProfile, station) - l.recordDepth;
    } else if (x.alongP <= samples[0]!.along) {
      top = samples[0]!.top;
      extrapolatedBy = samples[0]!.along - x.alongP;
      holesUsed = [samples[0]!.number];
    } else if (x.alongP >= samples[samples.length - 1]!.along) {
      const last = samples[samples.length - 1]!;
      top = last.top;
      extrapolatedBy = x.alongP - last.along;
      holesUsed = [last.number];
    } else {
      const i = samples.findIndex((q) => q.along >= x.alongP);
      const a = samples[i - 1]!;
      const b = samples[i]!;
      top = a.top + ((x.alongP - a.along) / (b.along - a.along)) * (b.top - a.top);
      holesUsed = [a.number, b.number];
    }
    const height = lineHeight(l);
    const bottom = top - height;
    const centre = profileAt(bore.profile, station);
    const above = top - height / 2 > centre;
    const clearance = above ? bottom - (centre + r) : centre - r - top;
    const required = l.requiredVertical ?? rule?.vertical ?? 0;
    const allowance = bore.toleranceVertical + ql + settings.extrapolationFactor * extrapolatedBy;
    const verified = dugHoles.some((h) => dist(holePosition(h), x.point) <= settings.verificationDistance);
    return finish({
      lineKey: l.key, label: l.label, kind: l.kind, relation: 'crossing', station, skewDeg,
      topElevation: top, bottomElevation: bottom, boreCentreline: centre, above,
      clearance, required, margin: clearance - required, allowance, extrapolatedBy, fromRecordDepth, verified, holesUsed,
      intended: s.intended[l.key]?.status,
    });
  }

  const gap = polylineGap(l.path, bore.alignment);
  const station = stationOffset(bore.alignment, bore.beginStation, gap.onQ).station;
  const clearance = gap.distance - r - lineWidth(l) / 2;
  const required = l.requiredHorizontal ?? rule?.horizontal ?? 0;
  const allowance = bore.toleranceHorizontal + ql;
  const near = dugHoles.filter((h) => dist(holePosition(h), gap.onP) <= settings.verificationDistance);
  return finish({
    lineKey: l.key, label: l.label, kind: l.kind, relation: 'parallel', station,
    clearance, required, margin: clearance - required, allowance, extrapolatedBy: 0,
    fromRecordDepth: false, verified: near.length > 0, holesUsed: near.map((h) => h.number),
    intended: s.intended[l.key]?.status,
  });
}

function finish(c: Omit<LineClearance, 'status'>): LineClearance {
  let status: ClearanceStatus;
  if (c.clearance < 0) status = 'overlap';
  else if (c.margin < 0) status = 'conflict';
  else if (c.margin < c.allowance) status = 'marginal';
  else if (!c.verified) status = 'unverified';
  else status = 'clear';
  return { ...c, status };
}

/** Station text in the project's style, for the printed summary. */
export function formatStation(value: number, style: '100' | '1000', decimals = 2): string {
  const size = style === '100' ? 100 : 1000;
  const sign = value < 0 ? '-' : '';
  const scale = 10 ** decimals;
  const v = Math.round(Math.abs(value) * scale) / scale;
  const whole = Math.floor(v / size);
  const rest = (v - whole * size).toFixed(decimals).padStart(style === '100' ? decimals + 3 : decimals + 4, '0');
  return `${sign}${whole}+${rest}`;
}
