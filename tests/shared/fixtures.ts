/**
 * Builders for hand-worked scenes in the engine tests (metres, level bore at 90 m unless told).
 * Every number that a test checks is worked by hand in the test itself.
 */
import type { ProjectSettings } from '../../shared/schemas/project';
import type { BoreInput, ClearanceInput, HoleInput, LineInput, RuleInput } from '../../shared/geometry';

export const SETTINGS: ProjectSettings = {
  verificationDistance: 3,
  qualityLevelUncertainty: { A: 0.05, B: 0.3, C: 0.6, D: 1.0 },
  extrapolationFactor: 0.1,
  maxGpsAccuracy: 5,
};

export const RULES: RuleInput[] = [
  { kind: 'water', vertical: 0.6, horizontal: 0.6 },
  { kind: 'gas', vertical: 0.3, horizontal: 0.3 },
  { kind: 'sewer', vertical: 0.6, horizontal: 0.6 },
  { kind: 'communications', vertical: 0.6, horizontal: 0.6 },
  { kind: 'electric', vertical: 0.6, horizontal: 0.6 },
];

/** Straight bore east along y = 0 from x = 0 to 100, stations 1000 to 1100, centreline level at 90, casing OD 0.5. */
export function bore(over: Partial<BoreInput> = {}): BoreInput {
  return {
    id: 1,
    name: 'B-1',
    alignment: [[0, 0], [100, 0]],
    beginStation: 1000,
    profile: [{ station: 1000, elevation: 90 }, { station: 1100, elevation: 90 }],
    groundProfile: [{ station: 1000, elevation: 100 }, { station: 1100, elevation: 100 }],
    casingOd: 0.5,
    toleranceHorizontal: 0.1,
    toleranceVertical: 0.05,
    minCover: 1,
    pits: [],
    ...over,
  };
}

/** A round line (QL B, water) from over.path; override anything. */
export function line(id: number, path: [number, number][], over: Partial<LineInput> = {}): LineInput {
  return {
    id,
    label: `L-${id}`,
    kind: 'water',
    shape: 'round',
    diameter: 0.3,
    width: null,
    height: null,
    qualityLevel: 'B',
    path,
    recordDepth: 1.2,
    requiredVertical: null,
    requiredHorizontal: null,
    ...over,
  };
}

let holeSeq = 100;
/** A dug hole at (e, n) with ground and depth to top (override anything). */
export function hole(lineId: number, e: number, n: number, over: Partial<HoleInput> = {}): HoleInput {
  holeSeq++;
  return {
    id: holeSeq,
    number: `TH-${holeSeq}`,
    lineId,
    status: 'dug',
    easting: e,
    northing: n,
    approximate: false,
    groundElevation: 100,
    depthToTop: 8,
    depthReference: 'top',
    surveyedEasting: null,
    surveyedNorthing: null,
    surveyedTopElevation: null,
    ...over,
  };
}

export function scene(bores: BoreInput[], lines: LineInput[], holes: HoleInput[], over: Partial<ClearanceInput> = {}): ClearanceInput {
  return { unit: 'm', settings: SETTINGS, rules: RULES, bores, lines, holes, ...over };
}

type Pt = [number, number];

/** A scene drawn from a few parameters: a bent bore, crossing lines with holes, a near line, a pit. */
export function makeScene(p: {
  legs: [number, number][]; profile: number[]; crossings: { f: number; angle: number; top: number; holeAt: number; box: boolean }[]; nearOffset: number;
}): ClearanceInput {
  const alignment: Pt[] = [[0, 0]];
  let heading = 0;
  for (const [len, turn] of p.legs) {
    heading += turn;
    const last = alignment[alignment.length - 1]!;
    alignment.push([last[0] + len * Math.cos(heading), last[1] + len * Math.sin(heading)]);
  }
  let length = 0;
  for (let i = 1; i < alignment.length; i++) length += Math.hypot(alignment[i]![0] - alignment[i - 1]![0], alignment[i]![1] - alignment[i - 1]![1]);
  const profile = p.profile.map((z, i) => ({ station: 200 + (length * i) / (p.profile.length - 1), elevation: z }));
  const bore: BoreInput = {
    id: 1, name: 'P', alignment, beginStation: 200, profile,
    groundProfile: [{ station: 200, elevation: 100 }, { station: 200 + length, elevation: 101 }],
    casingOd: 0.6, toleranceHorizontal: 0.1, toleranceVertical: 0.05, minCover: 1,
    pits: [{ id: 9, kind: 'launch', footprint: [[-4, -2], [1, -2], [1, 2], [-4, 2]], bottomElevation: 85 }],
  };
  const lines: LineInput[] = [];
  const holes: HoleInput[] = [];
  // Crossing lines through points at fraction f along the first leg.
  const [ax, ay] = alignment[0]!;
  const [bx, by] = alignment[1]!;
  p.crossings.forEach((c, i) => {
    const cx = ax + c.f * (bx - ax);
    const cy = ay + c.f * (by - ay);
    const dir = Math.atan2(by - ay, bx - ax) + c.angle;
    const dx = Math.cos(dir) * 30;
    const dy = Math.sin(dir) * 30;
    const id = i + 1;
    lines.push({
      id, label: `X${id}`, kind: 'water', shape: c.box ? 'box' : 'round', diameter: c.box ? null : 0.3, width: c.box ? 0.8 : null, height: c.box ? 0.5 : null,
      qualityLevel: 'B', path: [[cx - dx, cy - dy], [cx + dx, cy + dy]], recordDepth: 1, requiredVertical: null, requiredHorizontal: null,
    });
    holes.push({
      id: 100 + id, number: `H${id}`, lineId: id, status: 'dug', easting: cx + (dx * c.holeAt) / 30, northing: cy + (dy * c.holeAt) / 30,
      approximate: false, groundElevation: 100, depthToTop: 100 - c.top, depthReference: 'top', surveyedEasting: null, surveyedNorthing: null, surveyedTopElevation: null,
    });
  });
  // A line alongside the first leg, to the left.
  const nx = -(by - ay) / Math.hypot(bx - ax, by - ay);
  const ny = (bx - ax) / Math.hypot(bx - ax, by - ay);
  lines.push({
    id: 50, label: 'N', kind: 'gas', shape: 'round', diameter: 0.2, width: null, height: null, qualityLevel: 'C',
    path: [[ax + 0.3 * (bx - ax) + nx * p.nearOffset, ay + 0.3 * (by - ay) + ny * p.nearOffset], [ax + 0.6 * (bx - ax) + nx * p.nearOffset, ay + 0.6 * (by - ay) + ny * p.nearOffset]],
    recordDepth: 1.5, requiredVertical: null, requiredHorizontal: null,
  });
  return { unit: 'm', settings: SETTINGS, rules: RULES, bores: [bore], lines, holes };
}

export function transform(input: ClearanceInput, theta: number, tx: number, ty: number): ClearanceInput {
  const c = Math.cos(theta);
  const s = Math.sin(theta);
  const f = ([x, y]: readonly [number, number]): [number, number] => [c * x - s * y + tx, s * x + c * y + ty];
  return {
    ...input,
    bores: input.bores.map((b) => ({ ...b, alignment: b.alignment.map(f), pits: (b.pits ?? []).map((p) => ({ ...p, footprint: p.footprint.map(f) })) })),
    lines: input.lines.map((l) => ({ ...l, path: l.path.map(f) })),
    holes: input.holes.map((h) => {
      const [e, n] = f([h.easting, h.northing]);
      return { ...h, easting: e, northing: n };
    }),
  };
}

