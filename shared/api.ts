/**
 * Response shapes of the API (presenters). The server builds exactly these; the client reads them.
 * Lengths and elevations are in the project's unit; dates are ISO 8601 strings.
 */
import type {
  BoreMethod,
  ClearanceStatus,
  ConflictStatus,
  DepthReference,
  ExcavationMethod,
  HoleStatus,
  LineKind,
  LineShape,
  LineStatus,
  LinearUnit,
  PitKind,
  PositionSource,
  QualityLevel,
  Role,
  Side,
  StationStyle,
} from './domain';
import type { ClearanceReport } from './geometry/types';
import type { GridPoint, ProfilePoint } from './schemas/common';
import type { ProjectSettings } from './schemas/project';

/** RFC 9457 problem details, with the failing field paths on a 400. */
export interface Problem {
  type: string;
  title: string;
  status: number;
  detail?: string;
  code?: string;
  errors?: { path: string; message: string }[];
  /** On a 409 for a stale version: the record as it stands now. */
  current?: unknown;
}

export interface UserDto {
  id: number;
  email: string;
  name: string;
  role: Role;
  active: boolean;
  version: number;
  createdAt: string;
  updatedAt: string;
}

export interface SessionDto {
  user: UserDto;
}

export interface ProjectCounts {
  lines: number;
  holes: number;
  openConflicts: number;
  bores: number;
}

export interface ProjectDto {
  id: number;
  name: string;
  client: string;
  description: string | null;
  crsCode: string;
  crsProj4: string;
  unit: LinearUnit;
  verticalDatum: string;
  stationStyle: StationStyle;
  settings: ProjectSettings;
  version: number;
  createdAt: string;
  updatedAt: string;
  counts: ProjectCounts;
}

export interface MemberDto {
  userId: number;
  name: string;
  email: string;
  role: Role;
  active: boolean;
  addedAt: string;
}

export interface BoreDto {
  id: number;
  projectId: number;
  name: string;
  method: BoreMethod;
  alignment: GridPoint[];
  beginStation: number;
  profile: ProfilePoint[];
  groundProfile: ProfilePoint[];
  casingOd: number;
  carrierSize: number | null;
  toleranceHorizontal: number;
  toleranceVertical: number;
  minCover: number;
  notes: string | null;
  version: number;
  createdAt: string;
  updatedAt: string;
}

export interface PitDto {
  id: number;
  boreId: number;
  kind: PitKind;
  footprint: GridPoint[];
  bottomElevation: number;
  notes: string | null;
  version: number;
  createdAt: string;
  updatedAt: string;
}

export interface LineDto {
  id: number;
  projectId: number;
  label: string;
  owner: string;
  kind: LineKind;
  shape: LineShape;
  diameter: number | null;
  width: number | null;
  height: number | null;
  material: string | null;
  status: LineStatus;
  qualityLevel: QualityLevel;
  path: GridPoint[];
  recordDepth: number;
  requiredVertical: number | null;
  requiredHorizontal: number | null;
  contactEmail: string | null;
  notes: string | null;
  version: number;
  createdAt: string;
  updatedAt: string;
}

export interface HoleDto {
  id: number;
  projectId: number;
  clientId: string;
  number: string;
  lineId: number;
  status: HoleStatus;
  positionSource: PositionSource;
  easting: number;
  northing: number;
  approximate: boolean;
  boreId: number | null;
  station: number | null;
  offset: number | null;
  offsetSide: Side | null;
  gpsAccuracy: number | null;
  groundElevation: number | null;
  depthToTop: number | null;
  depthReference: DepthReference;
  measuredSize: number | null;
  boxWidth: number | null;
  boxHeight: number | null;
  depthToBottom: number | null;
  material: string | null;
  condition: string | null;
  direction: string | null;
  method: ExcavationMethod | null;
  ticketNumber: string | null;
  surfaceType: string | null;
  markerSet: boolean | null;
  crew: string | null;
  dugAt: string | null;
  surveyedEasting: number | null;
  surveyedNorthing: number | null;
  surveyedTopElevation: number | null;
  surveyedGroundElevation: number | null;
  reviewNote: string | null;
  notes: string | null;
  createdById: number | null;
  photoCount: number;
  version: number;
  createdAt: string;
  updatedAt: string;
}

export interface PhotoDto {
  id: number;
  holeId: number;
  caption: string | null;
  takenAt: string | null;
  gpsLat: number | null;
  gpsLon: number | null;
  width: number;
  height: number;
  url: string;
  thumbnailUrl: string;
  uploadedById: number | null;
  createdAt: string;
}

export interface ClearanceRuleDto {
  id: number;
  projectId: number;
  kind: LineKind;
  vertical: number;
  horizontal: number;
  source: string | null;
  version: number;
  createdAt: string;
  updatedAt: string;
}

export interface ConflictDto {
  id: number;
  projectId: number;
  boreId: number;
  lineId: number;
  computedStatus: ClearanceStatus;
  figures: Record<string, unknown>;
  status: ConflictStatus;
  assigneeId: number | null;
  dueDate: string | null;
  resolutionNote: string | null;
  version: number;
  createdAt: string;
  updatedAt: string;
}

export interface ActivityDto {
  id: number;
  projectId: number | null;
  userId: number | null;
  userName: string | null;
  entity: string;
  entityId: number | null;
  action: string;
  changes: Record<string, { before: unknown; after: unknown }>;
  at: string;
}

export interface Page<T> {
  items: T[];
  total: number;
}

/** GET /api/projects/:id/clearances: the engine's report with the project's reference frame. */
export interface ClearancesDto {
  checkedAt: string;
  crsCode: string;
  unit: LinearUnit;
  verticalDatum: string;
  stationStyle: StationStyle;
  report: ClearanceReport;
}

/** One entry of a conflict's history. */
export interface ConflictEventDto {
  id: number;
  conflictId: number;
  kind: string;
  note: string | null;
  data: Record<string, unknown> | null;
  byId: number | null;
  byName: string | null;
  at: string;
}

/** One row of a survey point file, as matched against the test holes (preview and commit). */
export interface SurveyShotRowDto {
  /** Row number in the file, counting the header as row 1. */
  row: number;
  point: string;
  northing: number | null;
  easting: number | null;
  elevation: number | null;
  description: string;
  shot: 'top' | 'ground' | null;
  holeId: number | null;
  holeNumber: string | null;
  lineLabel: string | null;
  outcome: 'match' | 'no_hole' | 'ambiguous' | 'invalid' | 'locked';
  message: string | null;
  /** Field → before/after for a match, e.g. surveyedTopElevation. */
  changes: Record<string, { before: number | null; after: number | null }>;
}

/** What a survey import would do (preview) or did (commit). */
export interface SurveyImportResultDto {
  rows: SurveyShotRowDto[];
  matched: number;
  problems: number;
  holesChanged: number;
  committed: boolean;
}
