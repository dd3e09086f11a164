/**
 * Vocabulary of the register: the enumerations every layer shares.
 * Names are terms of the trade (quality levels from ASCE 38, APWA marking colours).
 */

export const ROLES = ['admin', 'manager', 'designer', 'surveyor', 'field', 'viewer'] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  admin: 'Administrator',
  manager: 'Project manager',
  designer: 'Design engineer',
  surveyor: 'Survey crew chief',
  field: 'Field crew',
  viewer: 'Reviewer (read only)',
};

/** Linear units: metre, international foot (0.3048 m), US survey foot (1200/3937 m). */
export const LINEAR_UNITS = ['m', 'ft', 'usft'] as const;
export type LinearUnit = (typeof LINEAR_UNITS)[number];

export const UNIT_LABELS: Record<LinearUnit, string> = {
  m: 'metres',
  ft: 'international feet',
  usft: 'US survey feet',
};

/** Station styles: 100-unit stations (`12+34.56`) or 1000-unit stations (`1+234.567`). */
export const STATION_STYLES = ['100', '1000'] as const;
export type StationStyle = (typeof STATION_STYLES)[number];

export const BORE_METHODS = ['auger_bore', 'hdd', 'pipe_ramming', 'microtunnel', 'open_cut'] as const;
export type BoreMethod = (typeof BORE_METHODS)[number];
export const BORE_METHOD_LABELS: Record<BoreMethod, string> = {
  auger_bore: 'Auger bore / jack-and-bore',
  hdd: 'Horizontal directional drill',
  pipe_ramming: 'Pipe ramming',
  microtunnel: 'Microtunnel',
  open_cut: 'Open cut',
};

export const PIT_KINDS = ['launch', 'receiving'] as const;
export type PitKind = (typeof PIT_KINDS)[number];

/** Line kinds, each with its APWA uniform colour code marking colour. */
export const LINE_KINDS = [
  'electric',
  'gas',
  'oil',
  'steam',
  'communications',
  'water',
  'reclaimed_water',
  'sewer',
  'storm',
  'unknown',
] as const;
export type LineKind = (typeof LINE_KINDS)[number];

export const LINE_KIND_LABELS: Record<LineKind, string> = {
  electric: 'Electric',
  gas: 'Gas',
  oil: 'Oil / petroleum',
  steam: 'Steam',
  communications: 'Communications',
  water: 'Potable water',
  reclaimed_water: 'Reclaimed water',
  sewer: 'Sanitary sewer',
  storm: 'Storm drain',
  unknown: 'Unidentified',
};

/** APWA uniform colour code (ANSI Z535.1 hues) for temporary marking. */
export const APWA_COLOURS = {
  red: '#d7191c',
  yellow: '#f2c500',
  orange: '#f07f13',
  blue: '#1f63c6',
  purple: '#7b3fa0',
  green: '#2e9a3d',
  pink: '#e86fb0',
  white: '#ffffff',
} as const;

export const LINE_KIND_COLOURS: Record<LineKind, string> = {
  electric: APWA_COLOURS.red,
  gas: APWA_COLOURS.yellow,
  oil: APWA_COLOURS.yellow,
  steam: APWA_COLOURS.yellow,
  communications: APWA_COLOURS.orange,
  water: APWA_COLOURS.blue,
  reclaimed_water: APWA_COLOURS.purple,
  sewer: APWA_COLOURS.green,
  storm: APWA_COLOURS.green,
  unknown: '#6b7280',
};

export const LINE_STATUSES = ['active', 'abandoned', 'unknown'] as const;
export type LineStatus = (typeof LINE_STATUSES)[number];
/** The words every screen and export uses for a line's status. */
export const LINE_STATUS_LABELS: Record<LineStatus, string> = { active: 'In service', abandoned: 'Abandoned', unknown: 'Status unknown' };

/** ASCE/UESI/CI 38-22 utility quality levels, D (records) to A (exposed and measured). */
export const QUALITY_LEVELS = ['D', 'C', 'B', 'A'] as const;
export type QualityLevel = (typeof QUALITY_LEVELS)[number];

export const LINE_SHAPES = ['round', 'box'] as const;
export type LineShape = (typeof LINE_SHAPES)[number];

export const HOLE_STATUSES = ['planned', 'dug', 'surveyed', 'reviewed'] as const;
export type HoleStatus = (typeof HOLE_STATUSES)[number];

export const POSITION_SOURCES = ['grid', 'station', 'gps', 'map', 'survey'] as const;
export type PositionSource = (typeof POSITION_SOURCES)[number];

export const DEPTH_REFERENCES = ['top', 'centre', 'bottom'] as const;
export type DepthReference = (typeof DEPTH_REFERENCES)[number];

export const EXCAVATION_METHODS = ['air', 'water'] as const;
export type ExcavationMethod = (typeof EXCAVATION_METHODS)[number];

export const SIDES = ['L', 'R'] as const;
export type Side = (typeof SIDES)[number];

export const CONFLICT_STATUSES = [
  'open',
  'in_review',
  'resolved_redesign',
  'resolved_relocation',
  'waived',
  'void',
] as const;
export type ConflictStatus = (typeof CONFLICT_STATUSES)[number];
export const CONFLICT_STATUS_LABELS: Record<ConflictStatus, string> = {
  open: 'Open',
  in_review: 'In review',
  resolved_redesign: 'Resolved by redesign',
  resolved_relocation: 'Resolved by relocation',
  waived: 'Waived',
  void: 'Void',
};

/** Computed clearance status of a line against a bore, worst first. */
export const CLEARANCE_STATUSES = ['overlap', 'conflict', 'marginal', 'unverified', 'clear'] as const;
export type ClearanceStatus = (typeof CLEARANCE_STATUSES)[number];

/** The words every screen and file uses for the computed status of a line against a bore (SPEC §4). */
export const CLEARANCE_STATUS_LABELS: Record<ClearanceStatus, string> = {
  overlap: 'Overlap',
  conflict: 'Conflict',
  marginal: 'Marginal',
  unverified: 'Unverified',
  clear: 'Clear',
};

/** What each status means, for legends and tooltips. */
export const CLEARANCE_STATUS_MEANINGS: Record<ClearanceStatus, string> = {
  overlap: 'the line and the casing overlap (clearance below zero)',
  conflict: 'clearance below the requirement',
  marginal: 'meets the requirement by less than the allowance (bore tolerance + location uncertainty)',
  unverified: 'no dug test hole near the crossing or closest point',
  clear: 'meets the requirement with the allowance to spare',
};
