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
  /** On a 409 `in_use` refusing a delete: what holds the record (hole numbers, conflict ids). */
  holds?: { holes?: string[]; conflicts?: number[] };
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
  /** Soil seen in the excavation (test-hole sheet). */
  soil: string | null;
  /** Groundwater seen (e.g. "none", "seepage at 4.5 ft"). */
  groundwater: string | null;
  /** How the hole was restored (backfill, compaction, patch). */
  restoration: string | null;
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
  /** The file exactly as uploaded (EXIF kept); `url` is the upright copy for viewing. */
  originalUrl: string;
  /**
   * `processing` until the upright copy and the thumbnail are made (just after the upload
   * answers); `url` and `thumbnailUrl` answer 404 with code `photo_processing` until then.
   * `failed` when the image could not be decoded: `url` serves the original as uploaded.
   */
  state: 'processing' | 'ready' | 'failed';
  /** Where `takenAt` came from: the photo's EXIF, or the device/form when EXIF had none. */
  takenAtSource: 'exif' | 'device' | null;
  /** Where `gpsLat`/`gpsLon` (WGS 84 degrees) came from: the photo's EXIF or the device's own fix. */
  gpsSource: 'exif' | 'device' | null;
  /** Horizontal accuracy of a device fix, in metres as the device reported it (EXIF: null). */
  gpsAccuracyMetres: number | null;
  /** The id the phone made when the photo was picked (null for uploads sent without one). */
  clientId: string | null;
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
  /** When the clearance check last looked at it. */
  checkedAt: string;
  /** True once a person set the status (the clearance check then never overwrites it). */
  statusSetByPerson: boolean;
  responsibleParty: string | null;
  ownerNotifiedAt: string | null;
  answerDueAt: string | null;
  closedAt: string | null;
  notes: string | null;
}

/** A pit a conflicting line enters or comes within the horizontal requirement of. */
export interface ConflictPitDto {
  pitId: number;
  kind: PitKind;
  enters: boolean;
  planGap: number;
  heightAbovePitBottom: number | null;
}

/**
 * One row of the conflict register (SPEC §8): the conflict with its line, bore, test holes and
 * the figures of the last clearance check flattened and typed. Lengths and elevations are in
 * the project's unit; elevations on the project's vertical datum; dates ISO 8601 (calendar
 * dates — dueDate, answerDueAt — are midnight UTC).
 */
export interface ConflictRowDto extends ConflictDto {
  /** The register's number, `C-<id>`. */
  number: string;
  assigneeName: string | null;
  assigneeEmail: string | null;
  bore: { id: number; name: string };
  line: Pick<LineDto, 'id' | 'label' | 'owner' | 'contactEmail' | 'kind' | 'shape' | 'diameter' | 'width' | 'height' | 'material' | 'status' | 'qualityLevel'>;
  /** Test holes on the line, those verifying the governing point first and flagged. */
  holes: { id: number; number: string; status: HoleStatus; verifying: boolean }[];
  /** Pits the line conflicts with (empty when the conflict is with the bore alone). */
  pits: ConflictPitDto[];
  /** 'crossing' or 'near' (a line alongside the bore); null for a pit-only conflict. */
  relation: 'crossing' | 'near' | null;
  /** Station of the governing point, and the range over the line's points near the bore. */
  station: number | null;
  stationFrom: number | null;
  stationTo: number | null;
  offset: number | null;
  side: Side | null;
  /** Top of line at the governing point. */
  lineTop: number | null;
  /** Which clearance governs: vertical (crossings) or horizontal (near lines). */
  governing: 'vertical' | 'horizontal' | null;
  /** Measured (computed) clearance, edge to edge, and the requirement. */
  clearance: number | null;
  required: number | null;
  margin: number | null;
  allowance: number | null;
  clearDistance3d: number | null;
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

/** A point to stake (SPEC §5 Stake-out), in the project's grid, unit and vertical datum. */
export interface StakePointDto {
  /** Stable id: `crossing:<boreId>:<lineId>`, `suggested:<boreId>:<lineId>:<reason>`, `pit:<pitId>:<corner>`. */
  key: string;
  kind: 'crossing' | 'suggested_hole' | 'pit_corner';
  /** The point's name, made from its key (`stakePointName`: `X<boreId>-<lineId>`, `SH<boreId>-<lineId>`, `SH<boreId>-<lineId>N` at a nearest point, `P<pitId>-<corner>`), and its description; the point file, DXF and zip use both as they are. */
  name: string;
  description: string;
  boreId: number;
  boreName: string;
  lineId: number | null;
  lineLabel: string | null;
  lineKind: LineKind | null;
  pitId: number | null;
  pitKind: PitKind | null;
  easting: number;
  northing: number;
  /** Elevation and what it is: top of line (crossings), ground from the bore's ground profile (suggested holes), pit bottom (pit corners). */
  elevation: number | null;
  elevationRef: 'line_top' | 'ground' | 'pit_bottom';
  /** Why the elevation is missing or how it was found. */
  elevationNote: string | null;
  station: number;
  offset: number;
  side: Side;
  /** Set when the point projects past an end of the bore alignment. */
  beyond: 'start' | 'end' | null;
  /** Test holes that confirm a crossing. */
  holes: string[];
  mark: StakeMarkDto | null;
  /** Plan distance the point has moved since it was staked (null when not staked). */
  movedSinceStaked: number | null;
}

/** A point marked staked. */
export interface StakeMarkDto {
  id: number;
  key: string;
  kind: string;
  stakedAt: string;
  stakedById: number | null;
  stakedByName: string | null;
  note: string | null;
  /** Position and elevation as listed when it was staked. */
  easting: number;
  northing: number;
  elevation: number | null;
  createdAt: string;
}

/** GET /api/projects/:id/stakeout: the points to stake with the project's reference frame. */
export interface StakeoutDto {
  checkedAt: string;
  crsCode: string;
  unit: LinearUnit;
  verticalDatum: string;
  stationStyle: StationStyle;
  points: StakePointDto[];
  /** Marks whose point is no longer on the list (its line, bore or pit changed or went). */
  orphanMarks: StakeMarkDto[];
}

/** One recipient of the owners' mailing: who gets which conflicts. */
export interface OwnerMailPlanDto {
  to: string;
  owners: string[];
  lines: { id: number; label: string }[];
  conflicts: { id: number; number: string }[];
  subject: string;
  attachmentName: string;
  /** The outbox message once queued (null in a preview). */
  outboxId: number | null;
}

/** POST /api/projects/:id/mail/owners: the plan (preview) or what was queued (send). */
export interface MailOwnersResultDto {
  mode: 'preview' | 'send';
  recipients: OwnerMailPlanDto[];
  /** Owners with conflicts but no contact e-mail on their lines. */
  skipped: { owner: string; lines: string[]; conflicts: string[]; reason: string }[];
}

/** A message in the outbox: kept until the SMTP server accepts it. */
export interface OutboxMessageDto {
  id: number;
  projectId: number | null;
  purpose: string;
  to: string;
  subject: string;
  attachments: { filename: string; contentType: string; size: number }[];
  status: 'queued' | 'sent' | 'failed';
  attempts: number;
  nextAttemptAt: string | null;
  lastError: string | null;
  sentAt: string | null;
  createdAt: string;
}

/** A message caught by the built-in development SMTP server. */
export interface CapturedMailDto {
  id: number;
  receivedAt: string;
  envelopeFrom: string | null;
  envelopeTo: string[];
  from: string | null;
  to: string[];
  subject: string | null;
  attachments: { filename: string | null; contentType: string; size: number }[];
  size: number;
}

export interface CapturedMailDetailDto extends CapturedMailDto {
  text: string | null;
}

/** GET /api/admin/mail: how mail leaves, the outbox and (in development) the captured messages. */
export interface AdminMailDto {
  /** 'smtp': a real server from the environment; 'capture': the built-in development server; 'off': nothing sends (messages wait in the outbox). */
  mode: 'smtp' | 'capture' | 'off';
  from: string;
  /** host:port of the built-in server, in capture mode. */
  captureAddress: string | null;
  counts: { queued: number; sent: number; failed: number };
  outbox: OutboxMessageDto[];
  captured: CapturedMailDto[];
}

/** GET /api/projects/:id/exports: what the Exports screen offers, with the project's reference frame. */
export interface ExportSummaryDto {
  /** The clearances were recomputed for this answer, at this time (as the stake-out, GeoJSON and zip exports do; conflict lists state the register's last check). */
  checkedAt: string;
  crsCode: string;
  crsName: string;
  unit: LinearUnit;
  verticalDatum: string;
  counts: { conflicts: number; lines: number; holes: number; bores: number; photos: number; crossings: number; suggested: number };
  /** What the zip holds for the test holes: one PDF sheet per hole, or (until sheets exist) a CSV of the holes. */
  holeSheets: 'pdf' | 'csv';
}

/** The project zip being prepared: POST /exports/bundle starts it, GET /exports/bundle/:jobId follows it. */
export interface ExportJobDto {
  id: string;
  state: 'running' | 'done' | 'failed';
  phase: 'data' | 'sheets' | 'photos' | 'compressing' | 'done' | 'failed';
  /** What is happening, in words ("Reading photos 12 of 40"). */
  label: string;
  /** Steps done and in all (photos read, or percent compressed). */
  done: number;
  total: number;
  /** Overall progress 0–100. */
  percent: number;
  fileName: string;
  /** Size of the finished zip in bytes (null until done). */
  byteSize: number | null;
  error: string | null;
  /** Where to download the finished zip (null until done). */
  downloadUrl: string | null;
}

/** A bad row, feature or entity of an import file, or a missing choice. */
export interface LineImportProblemDto {
  /** Where, in the file's terms: `row 12`, `feature 3`, `entity 7 (LWPOLYLINE)`, or `mapping`. */
  ref: string;
  /** Field path (`file.rows.12.northing`, `file.features.3.geometry`, `mapping.WATER.kind`). */
  path: string;
  message: string;
}

/** A group of the file: a DXF layer, a GeoJSON property value, or a CSV point code. */
export interface LineImportGroupDto {
  key: string;
  /** Lines the group would give. */
  count: number;
  /** A kind guessed from the group's name (the user confirms or changes it). */
  suggestedKind: LineKind | null;
}

/** One line an import would create. */
export interface LineImportItemDto {
  ref: string;
  group: string;
  label: string;
  /** Values the file gives for the line (null where it gives none). */
  owner: string | null;
  diameter: number | null;
  vertexCount: number;
  /** Plan length in the project's unit. */
  length: number;
  /** First and last vertex in the project's grid and unit. */
  start: GridPoint;
  end: GridPoint;
  /** A line with this label is already in the register (a second import of the same file?). */
  labelExists: boolean;
}

/** POST /imports/lines/preview: what the import would create; nothing is written. */
export interface LineImportPreviewDto {
  format: 'geojson' | 'dxf' | 'csv';
  fileName: string | null;
  /** The coordinates' CRS and how it was chosen (file's `crs` member, RFC 7946 default, the user, the project grid). */
  source: { crs: string; name: string; how: string };
  targetCrs: string;
  unit: LinearUnit;
  groups: LineImportGroupDto[];
  /** The lines, at most the first 500 (see itemCount). */
  items: LineImportItemDto[];
  itemCount: number;
  /** Lines that the mapping (or its absence) leaves in; skipped groups are not counted. */
  willCreate: number;
  problems: LineImportProblemDto[];
  warnings: string[];
  /** Things in the file that are not lines and are left out (e.g. 4 × CIRCLE). */
  ignored: { what: string; count: number }[];
  /** True when a commit with this mapping would succeed. */
  ready: boolean;
}

/** POST /imports/lines/commit: what was written (all lines in one transaction). */
export interface LineImportResultDto {
  created: number;
  skipped: number;
  lineIds: number[];
  /** When the clearances were recomputed after the import. */
  checkedAt: string;
}

/** GET /api/projects/:id/tiles: the project's base map (MBTiles), if it has one. */
export interface TilesetDto {
  available: boolean;
  /** `uploaded` by an administrator, `bundled` demo tiles, or null when there is none. */
  source: 'uploaded' | 'bundled' | null;
  name: string | null;
  format: 'png' | 'jpg' | 'webp' | null;
  /** [west, south, east, north] in degrees (WGS 84). */
  bounds: [number, number, number, number] | null;
  minZoom: number | null;
  maxZoom: number | null;
  attribution: string | null;
  tileCount: number | null;
  /** Changes whenever the file changes; the map puts it in tile URLs so no cache shows an old map. */
  version: string | null;
  /** Set when the project's file exists but cannot be used. */
  problem: string | null;
}
