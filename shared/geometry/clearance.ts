/**
 * Requirement, allowance and status of a clearance (SPEC §4.5, §4.8, §4.9).
 */
import type { ClearanceStatus, LineKind, QualityLevel } from '../domain';
import type { ProjectSettings } from '../schemas/project';
import type { LineInput, RuleInput } from './types';

/** Which way a clearance is measured. */
export type ClearanceDirection = 'vertical' | 'horizontal';

/** Required clearance and where it came from: the owner's value on the line wins over the project rule. */
export function requiredClearance(
  line: Pick<LineInput, 'kind' | 'requiredVertical' | 'requiredHorizontal'>,
  rules: ReadonlyMap<LineKind, RuleInput>,
  direction: ClearanceDirection,
): { value: number; source: 'owner' | 'rule' | 'none' } {
  const owner = direction === 'vertical' ? line.requiredVertical : line.requiredHorizontal;
  if (owner != null && Number.isFinite(owner)) return { value: owner, source: 'owner' };
  const rule = rules.get(line.kind);
  if (rule) return { value: direction === 'vertical' ? rule.vertical : rule.horizontal, source: 'rule' };
  return { value: 0, source: 'none' };
}

/**
 * Allowance = bore construction tolerance (vertical for crossings, horizontal otherwise) + the
 * line's location uncertainty for its quality level + extrapolationFactor × distance beyond the
 * outermost hole.
 */
export function clearanceAllowance(
  boreTolerance: number, settings: ProjectSettings, ql: QualityLevel, extrapolationDistance: number,
): number {
  return boreTolerance + settings.qualityLevelUncertainty[ql] + settings.extrapolationFactor * extrapolationDistance;
}

/**
 * Status, worst first: overlap (clearance < 0), conflict (margin < 0), marginal
 * (0 ≤ margin < allowance), unverified (no dug hole near), clear. A clearance that could not be
 * computed is 'unverified' (the point carries a problem saying why).
 */
export function clearanceStatus(clearance: number | null, required: number, allowance: number, verified: boolean): ClearanceStatus {
  if (clearance === null) return 'unverified';
  if (clearance < 0) return 'overlap';
  const margin = clearance - required;
  if (margin < 0) return 'conflict';
  if (margin < allowance) return 'marginal';
  if (!verified) return 'unverified';
  return 'clear';
}

/** Rank of a status, 0 = worst (overlap). */
export function statusRank(status: ClearanceStatus): number {
  return ['overlap', 'conflict', 'marginal', 'unverified', 'clear'].indexOf(status);
}

/**
 * Vertical clearance edge to edge (SPEC §4.5). Line above: line bottom − (centreline + radius);
 * below: (centreline − radius) − line top. The side is decided by the centrelines.
 */
export function verticalClearance(
  lineTop: number, lineHeight: number, boreCentreline: number, casingRadius: number,
): { position: 'above' | 'below'; clearance: number } {
  const lineCentre = lineTop - lineHeight / 2;
  if (lineCentre > boreCentreline) {
    return { position: 'above', clearance: lineTop - lineHeight - (boreCentreline + casingRadius) };
  }
  return { position: 'below', clearance: boreCentreline - casingRadius - lineTop };
}
