/**
 * Input and output shapes of the clearance engine. Inputs are Pick<> of the API DTOs, so the
 * server can pass DTOs straight in; all lengths and elevations are in the project's unit.
 */
import type { BoreDto, ClearanceRuleDto, HoleDto, LineDto, PitDto } from '../api';
import type { ClearanceStatus, LineKind, LinearUnit, PitKind, Side } from '../domain';
import type { ProjectSettings } from '../schemas/project';

/** A launch or receiving pit as the engine needs it. */
export type PitInput = Pick<PitDto, 'id' | 'kind' | 'footprint' | 'bottomElevation'>;

/** A bore as the engine needs it, with its pits attached. */
export type BoreInput = Pick<
  BoreDto,
  | 'id' | 'name' | 'alignment' | 'beginStation' | 'profile' | 'groundProfile' | 'casingOd'
  | 'toleranceHorizontal' | 'toleranceVertical' | 'minCover'
> & { pits?: readonly PitInput[] };

/** An existing buried line as the engine needs it. */
export type LineInput = Pick<
  LineDto,
  | 'id' | 'label' | 'kind' | 'shape' | 'diameter' | 'width' | 'height' | 'qualityLevel' | 'path'
  | 'recordDepth' | 'requiredVertical' | 'requiredHorizontal'
>;

/** A test hole as the engine needs it (surveyed values win over ground − depth). */
export type HoleInput = Pick<
  HoleDto,
  | 'id' | 'number' | 'lineId' | 'status' | 'easting' | 'northing' | 'approximate' | 'groundElevation'
  | 'depthToTop' | 'depthReference' | 'surveyedEasting' | 'surveyedNorthing' | 'surveyedTopElevation'
> &
  Partial<Pick<HoleDto, 'surveyedGroundElevation' | 'measuredSize' | 'boxHeight'>>;

/** A project clearance rule for a line kind. */
export type RuleInput = Pick<ClearanceRuleDto, 'kind' | 'vertical' | 'horizontal'>;

/** Everything the engine reads. Pure data: no I/O happens inside. */
export interface ClearanceInput {
  unit: LinearUnit;
  settings: ProjectSettings;
  rules: readonly RuleInput[];
  bores: readonly BoreInput[];
  lines: readonly LineInput[];
  holes: readonly HoleInput[];
}

/** Stable codes of warnings and per-figure problems in a report. */
export type IssueCode =
  // input
  | 'LINE_INVALID_PATH' | 'LINE_INVALID_SIZE' | 'LINE_INVALID_NUMBER' | 'HOLE_UNKNOWN_LINE'
  | 'HOLE_INVALID_POSITION' | 'HOLE_INVALID_NUMBER' | 'HOLE_NO_ELEVATION' | 'HOLE_FAR_FROM_LINE'
  | 'NO_RULE_FOR_KIND'
  // bore
  | 'BORE_INVALID' | 'PROFILE_DOES_NOT_COVER_ALIGNMENT' | 'NO_GROUND_PROFILE' | 'GROUND_DOES_NOT_COVER_ALIGNMENT'
  | 'COVER_BELOW_MINIMUM' | 'PIT_INVALID' | 'LINES_WITHOUT_FIGURES'
  // per figure
  | 'STATION_OUTSIDE_PROFILE' | 'NO_GROUND_FOR_RECORD_DEPTH' | 'NO_ELEVATION';

/** A warning or problem with a stable code and a plain message, and the records it concerns. */
export interface Issue {
  code: IssueCode;
  message: string;
  boreId?: number;
  lineId?: number;
  holeId?: number;
  pitId?: number;
}

/** A test hole that gave a top-of-line elevation. */
export interface HoleUse {
  id: number;
  number: string;
  /** Distance along the line to the hole's foot on the line. */
  chainage: number;
  /** Plan distance from the hole's position to the line as drawn. */
  offsetFromLine: number;
  topElevation: number;
  source: 'surveyed_top' | 'ground_minus_depth';
  approximate: boolean;
}

/** Where a line's elevation at a point came from. */
export type ElevationBasis =
  | {
      source: 'holes';
      /** At a hole, linear between two holes, or held flat beyond the outermost hole. */
      mode: 'at_hole' | 'interpolated' | 'extrapolated';
      /** The hole(s) the value came from (one, or the two either side). */
      holes: HoleUse[];
      /** Distance beyond the outermost hole (0 unless extrapolated). */
      extrapolationDistance: number;
    }
  | {
      source: 'record';
      /** Record depth to top assumed (no usable dug hole on this line). */
      recordDepth: number;
      /** Ground elevation used, from the bore's ground profile. */
      groundElevation: number;
      /** Station of the bore ground profile where the ground was read. */
      groundStation: number;
    };

/** A dug hole near a crossing or closest point, verifying it. */
export interface VerifyingHole {
  id: number;
  number: string;
  /** Plan distance from the hole to the point on the line. */
  distance: number;
}

/** Figures of one line against one bore at one place: a plan crossing or the closest point. */
export interface ClearancePoint {
  kind: 'crossing' | 'closest';
  /** Bore station of the point on the line, its offset and side (0 / 'R' at a crossing). */
  station: number;
  offset: number;
  side: Side;
  /** Set when the point projects past an end of the bore alignment. */
  beyond: 'start' | 'end' | null;
  /** Grid position of the point on the line (the crossing point, or the line's closest point). */
  easting: number;
  northing: number;
  /** Distance along the line to this point. */
  lineChainage: number;
  /** Acute plan angle between bore and line in degrees (90 = square crossing); crossings only. */
  crossingAngle: number | null;
  /** Skew from a square crossing in degrees (0 = square) = 90 − crossingAngle; crossings only. */
  skew: number | null;
  /** Plan distance between the centrelines (0 at a crossing). */
  planDistance: number;
  /** Edge-to-edge plan clearance = planDistance − casing radius − line half-width (near lines only). */
  horizontalClearance: number | null;
  /** Station on the bore used for the bore's elevation (the crossing, or the bore's closest point). */
  boreStation: number;
  /** Whether the line passes above or below the casing (by centrelines); null without elevations. */
  position: 'above' | 'below' | null;
  lineTop: number | null;
  lineBottom: number | null;
  boreCentreline: number | null;
  /** Ground from the bore's ground profile at boreStation. */
  ground: number | null;
  /** Cover over the casing at boreStation. */
  cover: number | null;
  /** Vertical clearance, edge to edge, on the line's side. */
  verticalClearance: number | null;
  /** Closest approach of the two 3-D centrelines minus the casing radius and the line's half-height. */
  clearDistance3d: number | null;
  /** Which clearance is compared with the requirement at this point. */
  governing: 'vertical' | 'horizontal';
  clearance: number | null;
  required: number;
  margin: number | null;
  allowance: number;
  status: ClearanceStatus;
  verified: boolean;
  verifyingHoles: VerifyingHole[];
  elevation: ElevationBasis | null;
  problems: Issue[];
}

/** Where to dig next: the crossing point or the line's closest point to the bore. */
export interface SuggestedHole {
  boreId: number;
  lineId: number;
  reason: 'crossing' | 'closest_point';
  easting: number;
  northing: number;
  station: number;
  offset: number;
  side: Side;
}

/** One line against one bore. */
export interface LineClearance {
  boreId: number;
  lineId: number;
  label: string;
  kind: LineKind;
  /** 'crossing' when the line crosses the alignment in plan, else 'near'. */
  relation: 'crossing' | 'near';
  /** Worst status over the points. */
  status: ClearanceStatus;
  /** Index in `points` of the point that sets the status (worst, then least margin). */
  governingPoint: number;
  points: ClearancePoint[];
  clearance: number | null;
  required: number;
  requiredSource: 'owner' | 'rule' | 'none';
  margin: number | null;
  allowance: number;
  /** Least 3-D clear distance over the points. */
  clearDistance3d: number | null;
  /** True when every point has a dug hole within the verification distance. */
  verified: boolean;
  suggestedHoles: SuggestedHole[];
}

/** A line that enters a pit, or comes within its horizontal requirement, above the pit bottom. */
export interface PitConflict {
  boreId: number;
  pitId: number;
  pitKind: PitKind;
  lineId: number;
  label: string;
  /** True when the line's plan path enters the footprint (or its edge touches it). */
  enters: boolean;
  /** Edge-to-edge plan gap from the line to the footprint (0 when it enters). */
  planGap: number;
  requiredHorizontal: number;
  /** Highest line bottom found near the pit; null when the line's elevation is unknown. */
  lineBottom: number | null;
  pitBottom: number;
  /** lineBottom − pitBottom (positive: the line is above the pit bottom); null when unknown. */
  heightAbovePitBottom: number | null;
  /** Grid position on the line nearest the pit. */
  easting: number;
  northing: number;
  elevation: ElevationBasis | null;
  problems: Issue[];
}

/** The range of whole-profile vertical shift keeping every crossed line clear on its side. */
export interface ShiftWindow {
  /** True when no shift satisfies every constraint. */
  empty: boolean;
  /** Lowest allowed shift (negative = lower the bore); null when nothing limits it. */
  down: number | null;
  /** Highest allowed shift (positive = raise the bore); null when nothing limits it. */
  up: number | null;
  /** Lines (below the bore) that set `down`. */
  downGoverning: number[];
  /** Lines (above the bore) that set `up`. */
  upGoverning: number[];
  /** True when minimum cover sets `up` (at `coverStation`). */
  upGovernedByCover: boolean;
  coverStation: number | null;
}

/** The feasible (shift, grade change) polygon; see window.ts for the parametrisation. */
export interface WindowPolygon {
  /** Station about which the grade change pivots (the bore's begin station). */
  pivotStation: number;
  /** Convex polygon vertices [shift, gradeChange], counter-clockwise; empty when infeasible. */
  vertices: [number, number][];
  /** The search box that bounds the polygon where no constraint does. */
  shiftBound: number;
  gradeBound: number;
}

/** Both windows: for the requirement alone, and for requirement + allowance. */
export interface BoreWindow {
  requirement: { shift: ShiftWindow; polygon: WindowPolygon };
  withAllowance: { shift: ShiftWindow; polygon: WindowPolygon };
  /** Crossed lines left out because their figures could not be computed. */
  linesWithoutFigures: number[];
}

/** Everything computed for one bore. */
export interface BoreReport {
  boreId: number;
  name: string;
  /** False when the bore's own geometry is unusable (see `error`). */
  computed: boolean;
  error: Issue | null;
  length: number | null;
  beginStation: number;
  endStation: number | null;
  casingRadius: number | null;
  cover: { minimum: number; station: number; belowMinimum: boolean } | null;
  lines: LineClearance[];
  pitConflicts: PitConflict[];
  suggestedHoles: SuggestedHole[];
  window: BoreWindow | null;
  counts: Record<ClearanceStatus, number>;
  warnings: Issue[];
}

/** The engine's output. */
export interface ClearanceReport {
  unit: LinearUnit;
  bores: BoreReport[];
  /** Input-level warnings (bad lines and holes). */
  warnings: Issue[];
}
