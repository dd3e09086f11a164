import { SAFETY_CAUTIONS } from '@shared/cautions';
import { LINE_KIND_LABELS, type LinearUnit } from '@shared/domain';
import { formatStation } from '@shared/geometry';
import { convertLength } from '@shared/units';
import type { ClearanceCheck, ExportFrame, LineRow } from './export-data';

/** `2026-12-01T14:03:09Z`: UTC, to the second. */
export function isoSeconds(d: Date): string {
  return d.toISOString().replace(/\.\d{3}Z$/, 'Z');
}

/** `2026-12-01`. */
export function isoDay(d: Date): string {
  return d.toISOString().slice(0, 10);
}

/** The design-aid caution of SPEC §7 (from shared/cautions.ts), one sentence pair. */
export const DESIGN_AID_CAUTION = (() => {
  const c = SAFETY_CAUTIONS.find((x) => x.lead.toLowerCase().includes('design aid'));
  return c ? `${c.lead} ${c.text}` : 'Clearances here are a design aid. A licensed engineer checks every figure against the line owner\'s and the local authority\'s requirements.';
})();

/** The digging cautions of SPEC §7 for files people take to the field (stake-out, zip). */
export const FIELD_CAUTIONS: string[] = SAFETY_CAUTIONS.map((c) => `${c.lead} ${c.text}`);

/**
 * When the figures of a file were checked, in words for its header (no commas: a CSV header
 * line stays one cell). `short` for running heads.
 */
export function checkText(check: ClearanceCheck, form: 'full' | 'short' = 'full'): string {
  if (check.basis === 'recomputed') return form === 'short' ? isoSeconds(check.at) : `${isoSeconds(check.at)} (UTC; recomputed when this file was made)`;
  if (!check.at) return form === 'short' ? 'never (no conflict on the register)' : 'no conflict on the register (every change that can move a clearance rechecks it)';
  return form === 'short'
    ? `${isoSeconds(check.at)} (the register's last check)`
    : `${isoSeconds(check.at)} (UTC; the conflict register's last check: every change that can move a clearance reruns it)`;
}

/**
 * The header block every export starts with (SPEC: CRS, unit, vertical datum and the time of
 * the last clearance check in every export header), as label/value pairs.
 */
export function headerBlock(frame: ExportFrame, title: string, extra: [string, string][] = []): [string, string][] {
  return [
    ['Threadline', title],
    ['Project', `${frame.projectName} (${frame.client})`],
    ['CRS', `${frame.crsCode} ${frame.crsName}`],
    ['Unit', `${frame.unitLabel} (${frame.unitSymbol}) for all coordinates and lengths and elevations`],
    ['Vertical datum', frame.verticalDatum],
    ['Clearances checked', checkText(frame.check)],
    ['Exported', `${isoSeconds(frame.exportedAt)} by ${frame.exportedBy}`],
    ...extra,
    ['Caution', DESIGN_AID_CAUTION],
  ];
}

/** A length with its unit symbol, for text cells: `1.50 US ft`. */
export function lengthText(value: number | null | undefined, frame: Pick<ExportFrame, 'unit' | 'unitSymbol'>): string {
  if (value == null || !Number.isFinite(value)) return '';
  return `${value.toFixed(decimalsOf(frame.unit))} ${frame.unitSymbol}`;
}

/** Decimals shown for lengths (mm in metres, hundredths in feet). */
export function decimalsOf(unit: LinearUnit): number {
  return unit === 'm' ? 3 : 2;
}

/** Round for a data file: 4 decimals, no float noise (84.60000000000001 → 84.6). */
export function round4(value: number | null | undefined): number | null {
  if (value == null || !Number.isFinite(value)) return null;
  const r = Math.round(value * 10_000) / 10_000;
  return r === 0 ? 0 : r;
}

/** A station in the project's style, or '' when unknown. */
export function stationText(value: number | null | undefined, frame: Pick<ExportFrame, 'stationStyle'>): string {
  if (value == null || !Number.isFinite(value)) return '';
  return formatStation(value, frame.stationStyle);
}

/** A line's outside size in words: `1.000 US ft (12.0 in)`, `duct bank 2.00 × 1.50 US ft`. */
export function sizeText(line: Pick<LineRow, 'shape' | 'diameter' | 'width' | 'height'>, frame: Pick<ExportFrame, 'unit' | 'unitSymbol'>): string {
  if (line.shape === 'box') {
    if (line.width == null || line.height == null) return '';
    const d = decimalsOf(frame.unit);
    return `box ${line.width.toFixed(d)} x ${line.height.toFixed(d)} ${frame.unitSymbol}`;
  }
  if (line.diameter == null) return '';
  const metres = convertLength(line.diameter, frame.unit, 'm');
  const usual = frame.unit === 'm' ? `${Math.round(metres * 1000)} mm` : `${(metres / 0.0254).toFixed(1)} in`;
  return `${line.diameter.toFixed(3)} ${frame.unitSymbol} (${usual})`;
}

export function kindLabel(line: Pick<LineRow, 'kind'>): string {
  return LINE_KIND_LABELS[line.kind];
}

/** A file-name-safe short form of the project name. */
export function slug(text: string): string {
  return (
    text
      .normalize('NFKD')
      .replace(/[^\w\s-]/g, '')
      .trim()
      .toLowerCase()
      .replace(/[\s_-]+/g, '-')
      .slice(0, 40)
      .replace(/-+$/, '') || 'project'
  );
}

/** `tallowmere-parkway-conflicts-20261201-1403.csv` */
export function exportFileName(frame: ExportFrame, what: string, ext: string): string {
  const stamp = isoSeconds(frame.exportedAt).replace(/[-:]/g, '').replace('T', '-').slice(0, 13);
  return `${slug(frame.projectName)}-${what}-${stamp}.${ext}`;
}
