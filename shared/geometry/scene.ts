/**
 * Phase 1 of the engine: check the project-wide input (settings, rules, ids) and prepare every
 * line once (polyline, size, requirements, hole-based elevation model). Bad lines and holes are
 * left out with a warning; only project-wide faults throw.
 */
import type { LineKind } from '../domain';
import { requiredClearance } from './clearance';
import { GeometryError, isGeometryError } from './errors';
import { buildLineElevationModel, lineSize, type LineElevationModel, type LineSize } from './line-elevation';
import { preparePolyline, type PreparedPolyline } from './polyline';
import { buildSegmentStore, type SegmentStore } from './spatial-index';
import type { ClearanceInput, HoleInput, Issue, LineInput, RuleInput } from './types';

/** A line ready for the engine. */
export interface LineContext {
  input: LineInput;
  poly: PreparedPolyline;
  size: LineSize;
  model: LineElevationModel;
  recordDepth: number | null;
  requiredVertical: { value: number; source: 'owner' | 'rule' | 'none' };
  requiredHorizontal: { value: number; source: 'owner' | 'rule' | 'none' };
  /** Half-width + horizontal requirement + quality-level uncertainty (the line's part of W). */
  reach: number;
}

/** Everything prepared once per computation. */
export interface Scene {
  input: ClearanceInput;
  rules: ReadonlyMap<LineKind, RuleInput>;
  lines: LineContext[];
  store: SegmentStore;
  /** Largest `reach` over the lines. */
  maxReach: number;
  warnings: Issue[];
}

/** True for a finite number, zero or more. */
export const finiteNonNegative = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v) && v >= 0;

function checkSettings(input: ClearanceInput): void {
  const s = input.settings;
  if (!s || typeof s !== 'object') throw new GeometryError('INVALID_SETTINGS', 'project settings are missing');
  if (!(finiteNonNegative(s.verificationDistance) && s.verificationDistance > 0)) {
    throw new GeometryError('INVALID_SETTINGS', 'verification distance must be a finite number greater than zero');
  }
  for (const ql of ['A', 'B', 'C', 'D'] as const) {
    if (!finiteNonNegative(s.qualityLevelUncertainty?.[ql])) {
      throw new GeometryError('INVALID_SETTINGS', `location uncertainty for quality level ${ql} must be a finite number, zero or more`);
    }
  }
  if (!finiteNonNegative(s.extrapolationFactor)) {
    throw new GeometryError('INVALID_SETTINGS', 'extrapolation factor must be a finite number, zero or more');
  }
}

function checkIds(items: readonly { id: number }[], what: string): void {
  const seen = new Set<number>();
  for (const it of items) {
    if (seen.has(it.id)) throw new GeometryError('DUPLICATE_ID', `${what} id ${it.id} appears twice in the input`, { id: it.id });
    seen.add(it.id);
  }
}

/** Phase 1: check the input and prepare lines, holes and rules. Throws GeometryError only for project-wide faults. */
export function prepareScene(input: ClearanceInput): Scene {
  checkSettings(input);
  checkIds(input.lines, 'line');
  checkIds(input.bores, 'bore');
  checkIds(input.holes, 'hole');
  const settings = input.settings;
  const rules = new Map<LineKind, RuleInput>();
  for (const r of input.rules) {
    if (!finiteNonNegative(r.vertical) || !finiteNonNegative(r.horizontal)) {
      throw new GeometryError('INVALID_RULE', `the clearance rule for ${r.kind} needs finite vertical and horizontal values, zero or more`);
    }
    if (rules.has(r.kind)) throw new GeometryError('INVALID_RULE', `there are two clearance rules for ${r.kind}`);
    rules.set(r.kind, r);
  }
  const warnings: Issue[] = [];
  const holesByLine = new Map<number, HoleInput[]>();
  for (const h of input.holes) {
    let list = holesByLine.get(h.lineId);
    if (!list) holesByLine.set(h.lineId, (list = []));
    list.push(h);
  }
  const lines: LineContext[] = [];
  const lineIds = new Set<number>();
  const kindsWithoutRule = new Set<LineKind>();
  for (const line of input.lines) {
    lineIds.add(line.id);
    let poly: PreparedPolyline;
    try {
      poly = preparePolyline(line.path, `line ${line.label} path`);
    } catch (e) {
      if (!isGeometryError(e)) throw e;
      warnings.push({ code: 'LINE_INVALID_PATH', message: `${e.message}; the line is left out of every clearance`, lineId: line.id });
      continue;
    }
    const size = lineSize(line);
    if (!size) {
      warnings.push({
        code: 'LINE_INVALID_SIZE',
        message: `line ${line.label} has no valid ${line.shape === 'box' ? 'width and height' : 'outside diameter'}; it is left out of every clearance`,
        lineId: line.id,
      });
      continue;
    }
    let recordDepth: number | null = line.recordDepth;
    if (!Number.isFinite(recordDepth)) {
      warnings.push({ code: 'LINE_INVALID_NUMBER', message: `line ${line.label} has no valid record depth; without a dug hole its elevation is unknown`, lineId: line.id });
      recordDepth = null;
    }
    const owner = { kind: line.kind, requiredVertical: line.requiredVertical, requiredHorizontal: line.requiredHorizontal };
    for (const key of ['requiredVertical', 'requiredHorizontal'] as const) {
      const v = line[key];
      if (v != null && !(Number.isFinite(v) && v >= 0)) {
        warnings.push({ code: 'LINE_INVALID_NUMBER', message: `line ${line.label}: the owner's ${key === 'requiredVertical' ? 'vertical' : 'horizontal'} clearance is not a valid number; the project rule is used`, lineId: line.id });
        owner[key] = null;
      }
    }
    const requiredVertical = requiredClearance(owner, rules, 'vertical');
    const requiredHorizontal = requiredClearance(owner, rules, 'horizontal');
    if (requiredVertical.source === 'none' || requiredHorizontal.source === 'none') kindsWithoutRule.add(line.kind);
    const { model, issues } = buildLineElevationModel(line, poly, size, holesByLine.get(line.id) ?? [], settings);
    warnings.push(...issues);
    lines.push({
      input: line,
      poly,
      size,
      model,
      recordDepth,
      requiredVertical,
      requiredHorizontal,
      reach: size.width / 2 + requiredHorizontal.value + settings.qualityLevelUncertainty[line.qualityLevel],
    });
  }
  for (const [lineId, holes] of holesByLine) {
    if (!lineIds.has(lineId)) {
      for (const h of holes) warnings.push({ code: 'HOLE_UNKNOWN_LINE', message: `hole ${h.number} is linked to line ${lineId}, which is not in the input; it is not used`, holeId: h.id, lineId });
    }
  }
  for (const kind of kindsWithoutRule) {
    warnings.push({ code: 'NO_RULE_FOR_KIND', message: `there is no clearance rule for ${kind} lines; the required clearance is taken as 0 where the owner gives none` });
  }
  const store = buildSegmentStore(lines.map((l) => l.poly));
  let maxReach = 0;
  for (const l of lines) maxReach = Math.max(maxReach, l.reach);
  return { input, rules, lines, store, maxReach, warnings };
}

