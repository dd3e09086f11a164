/**
 * Trade presets as data, each with its source (REFERENCES.md). The server seeds project rules
 * from these; users edit them. Owners, agencies and local codes override every value here.
 * (Project settings and method tolerances have their defaults in shared/defaults.ts.)
 * "memory" marks a value recalled and not confirmed against a public copy of the source.
 */
import type { LineKind, LinearUnit } from '../domain';
import { convertLength } from '../units';

/** A length as the source states it. */
export interface SourcedLength {
  value: number;
  unit: 'in' | 'ft' | 'm' | 'mm';
}

/** How sure the team is of a value. */
export type SourceStatus = 'confirmed' | 'memory' | 'common practice' | 'assumption';

/** A published or customary source of a value. */
export interface PresetSource {
  text: string;
  status: SourceStatus;
}

const METRES: Record<SourcedLength['unit'], number> = { in: 0.0254, ft: 0.3048, m: 1, mm: 0.001 };

/**
 * A sourced length in a project unit, rounded to 0.0001 unit (below any field measurement, and
 * exact for the inch and foot values here in metres). Feet in these sources are international
 * feet; on a US-survey-foot project the 2 ppm difference disappears in the rounding.
 */
export function presetLength(length: SourcedLength, unit: LinearUnit): number {
  const v = convertLength(length.value * METRES[length.unit], 'm', unit);
  return Math.round(v * 1e4) / 1e4;
}

const inches = (value: number): SourcedLength => ({ value, unit: 'in' });
const feet = (value: number): SourcedLength => ({ value, unit: 'ft' });

/** Bore near existing lines: 24 in unless a larger figure applies (REFERENCES: assumption, common practice). */
export const BORE_DEFAULT_CLEARANCE = {
  length: inches(24),
  source: {
    text: 'No published consensus; a reasonable default is the larger of 24 in and twice the cut diameter, with the owner’s value winning',
    status: 'memory',
  } satisfies PresetSource,
};

/** The larger of 24 in and twice the cut (casing or reamer) diameter, in the project unit. */
export function boreDefaultClearance(cutDiameter: number, unit: LinearUnit): number {
  return Math.max(presetLength(BORE_DEFAULT_CLEARANCE.length, unit), 2 * cutDiameter);
}

/** Water main and sewer: 10 ft horizontal outside to outside; water 18 in above the sewer where they cross. */
export const WATER_SEWER_SEPARATION = {
  horizontal: feet(10),
  vertical: inches(18),
  source: { text: 'Recommended Standards for Water Works (2018), as adopted by several state codes', status: 'confirmed' } satisfies PresetSource,
} as const;

/** Top of casing under a main railroad track: 5.5 ft below base of rail, 3 ft below ditches. */
export const RAILROAD_CASING_DEPTH = {
  belowBaseOfRail: feet(5.5),
  belowDitches: feet(3),
  source: { text: 'AREMA Manual for Railway Engineering, ch. 1 part 5, and adopting state rules', status: 'confirmed' } satisfies PresetSource,
} as const;

/** Locate tolerance zone: the width of the line plus 18 in each side (24 in in some states). */
export const TOLERANCE_ZONE_EACH_SIDE = {
  length: inches(18),
  source: { text: 'Common Ground Alliance best practices; state one-call laws (some use 24 in)', status: 'confirmed' } satisfies PresetSource,
} as const;

/**
 * 250 ft, a round corridor length used as a check of the foot conversion (250 ft = 76.2 m).
 * Common practice; no rule in the product depends on it.
 */
export const LENGTH_250_FT: SourcedLength = feet(250);

/** A default clearance rule for one line kind, with its sources. */
export interface ClearancePreset {
  kind: LineKind;
  vertical: SourcedLength;
  horizontal: SourcedLength;
  sources: PresetSource[];
  note: string;
}

const boreDefaultNote = 'Bore default (24 in); the larger of this and any kind-specific minimum.';

/**
 * Default clearance between a proposed bore's casing and an existing line, per line kind:
 * the larger of the bore default (24 in) and any published minimum for that kind.
 */
export const CLEARANCE_PRESETS: readonly ClearancePreset[] = [
  {
    kind: 'electric', vertical: inches(24), horizontal: inches(24),
    sources: [
      { text: 'National Electrical Safety Code, rule 353: 12 in deliberate separation from other underground structures', status: 'confirmed' },
      BORE_DEFAULT_CLEARANCE.source,
    ],
    note: 'NESC 12 in is below the bore default, so 24 in governs.',
  },
  {
    kind: 'gas', vertical: inches(24), horizontal: inches(24),
    sources: [
      { text: '49 CFR 192.325: 12 in from unrelated structures, else protection', status: 'memory' },
      BORE_DEFAULT_CLEARANCE.source,
    ],
    note: '49 CFR 192.325 12 in is below the bore default, so 24 in governs.',
  },
  {
    kind: 'oil', vertical: inches(24), horizontal: inches(24),
    sources: [
      { text: '49 CFR 195.250: 12 in from other structures (drainage tile 2 in)', status: 'memory' },
      BORE_DEFAULT_CLEARANCE.source,
    ],
    note: '49 CFR 195.250 12 in is below the bore default, so 24 in governs.',
  },
  { kind: 'steam', vertical: inches(24), horizontal: inches(24), sources: [BORE_DEFAULT_CLEARANCE.source], note: boreDefaultNote },
  { kind: 'communications', vertical: inches(24), horizontal: inches(24), sources: [BORE_DEFAULT_CLEARANCE.source], note: boreDefaultNote },
  {
    kind: 'water', vertical: inches(24), horizontal: inches(24),
    sources: [BORE_DEFAULT_CLEARANCE.source, WATER_SEWER_SEPARATION.source],
    note: `${boreDefaultNote} When the bore carries sewage use presetRules(unit, 'sewer'): 10 ft horizontal, 18 in vertical.`,
  },
  { kind: 'reclaimed_water', vertical: inches(24), horizontal: inches(24), sources: [BORE_DEFAULT_CLEARANCE.source], note: boreDefaultNote },
  {
    kind: 'sewer', vertical: inches(24), horizontal: inches(24),
    sources: [BORE_DEFAULT_CLEARANCE.source, WATER_SEWER_SEPARATION.source],
    note: `${boreDefaultNote} When the bore carries potable water use presetRules(unit, 'water'): 10 ft horizontal, 18 in vertical.`,
  },
  { kind: 'storm', vertical: inches(24), horizontal: inches(24), sources: [BORE_DEFAULT_CLEARANCE.source], note: boreDefaultNote },
  { kind: 'unknown', vertical: inches(24), horizontal: inches(24), sources: [BORE_DEFAULT_CLEARANCE.source], note: boreDefaultNote },
];

/** A rule ready to seed (the ClearanceRule create shape), in the project unit. */
export interface PresetRule {
  kind: LineKind;
  vertical: number;
  horizontal: number;
  source: string;
}

/**
 * Clearance rules to seed a project, in its unit. With `carrier` 'water' the sewer rule rises to
 * the water–sewer separation (and with 'sewer' the water rule does): 10 ft horizontal, 18 in
 * vertical, whichever is larger.
 */
export function presetRules(unit: LinearUnit, carrier: LineKind | null = null): PresetRule[] {
  return CLEARANCE_PRESETS.map((p) => {
    let vertical = presetLength(p.vertical, unit);
    let horizontal = presetLength(p.horizontal, unit);
    const sources = p.sources.map((s) => `${s.text} (${s.status})`);
    const pair = (carrier === 'water' && p.kind === 'sewer') || (carrier === 'sewer' && p.kind === 'water');
    if (pair) {
      vertical = Math.max(vertical, presetLength(WATER_SEWER_SEPARATION.vertical, unit));
      horizontal = Math.max(horizontal, presetLength(WATER_SEWER_SEPARATION.horizontal, unit));
    }
    return { kind: p.kind, vertical, horizontal, source: sources.join('; ') };
  });
}
