import type { EntityManager } from '@mikro-orm/sqlite';
import Papa from 'papaparse';
import type { SurveyImportResultDto, SurveyShotRowDto } from '@shared/api';
import { UNIT_LABELS } from '@shared/domain';
import { AppError } from '../../errors';
import { logActivity } from '../activity/activity.service';
import { recompute } from '../clearances/recompute-hook';
import { Project } from '../projects/project.entity';
import { User } from '../users/user.entity';
import { presentHole } from './hole.presenter';
import { TestHole } from './test-hole.entity';

/** The columns of a point file (SPEC §6), matched case-insensitively; others are ignored. */
export const SURVEY_COLUMNS = ['point', 'northing', 'easting', 'elevation', 'description'] as const;
type Column = (typeof SURVEY_COLUMNS)[number];

type SurveyField = 'surveyedTopElevation' | 'surveyedEasting' | 'surveyedNorthing' | 'surveyedGroundElevation';

const NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;

/** `TOP` or `GND` first, then optionally the line's label (`TOP W-1`, `GND: G-2`). */
const DESCRIPTION = /^\s*(TOP|GND)\b[\s:;,/-]*(.*?)\s*$/i;

interface ParsedRow {
  row: number;
  cells: Record<Column, string>;
  parseError: string | null;
}

/**
 * Read the CSV: a header row naming the columns (any order, any case, extra columns ignored),
 * then one shot per row. Row numbers count the header as row 1. A missing column is a 400
 * naming it; blank rows are skipped.
 */
export function parseSurveyCsv(csv: string): ParsedRow[] {
  const text = csv.replace(/^\uFEFF/, '');
  const parsed = Papa.parse<string[]>(text, { skipEmptyLines: false });
  const data = parsed.data;
  const header = (data[0] ?? []).map((h) => String(h).trim().toLowerCase());
  const missing = SURVEY_COLUMNS.filter((c) => !header.includes(c));
  if (missing.length > 0) {
    throw new AppError(400, 'missing_columns', `The point file has no ${missing.map((m) => `"${m}"`).join(', ')} column${missing.length > 1 ? 's' : ''}.`, {
      errors: missing.map((m) => ({
        path: 'csv',
        message: `missing column "${m}": the first row must be the header, with the columns point, northing, easting, elevation, description`,
      })),
    });
  }
  const index = Object.fromEntries(SURVEY_COLUMNS.map((c) => [c, header.indexOf(c)])) as Record<Column, number>;
  const rowErrors = new Map<number, string>();
  for (const e of parsed.errors) {
    if (e.type === 'Delimiter' || e.row === undefined) continue;
    rowErrors.set(e.row, e.message);
  }
  const rows: ParsedRow[] = [];
  for (let i = 1; i < data.length; i++) {
    const raw = data[i] ?? [];
    if (raw.every((c) => String(c).trim() === '')) continue;
    const cells = Object.fromEntries(SURVEY_COLUMNS.map((c) => [c, String(raw[index[c]] ?? '').trim()])) as Record<Column, string>;
    rows.push({ row: i + 1, cells, parseError: rowErrors.get(i) ?? null });
  }
  if (rows.length === 0) {
    throw new AppError(400, 'no_shots', 'The point file has a header but no shots.', { errors: [{ path: 'csv', message: 'no rows after the header' }] });
  }
  return rows;
}

function numberOf(text: string): number | null | 'invalid' {
  if (text === '') return null;
  return NUMBER.test(text) ? Number(text) : 'invalid';
}

interface Match {
  dto: SurveyShotRowDto;
  hole: TestHole | null;
  values: Partial<Record<SurveyField, number>>;
}

/**
 * Match each shot to a test hole by number (and by line label when one excavation exposed
 * several lines) and work out what would change. Nothing is written.
 */
export async function matchShots(em: EntityManager, project: Project, rows: ParsedRow[]): Promise<Match[]> {
  const holes = await em.find(TestHole, { project }, { populate: ['line'] });
  const byNumber = new Map<string, TestHole[]>();
  for (const h of holes) {
    const key = h.number.trim().toLowerCase();
    byNumber.set(key, [...(byNumber.get(key) ?? []), h]);
  }
  const unitText = `${project.crsCode} grid, ${UNIT_LABELS[project.unit]}`;
  const seen = new Map<string, number>();

  return rows.map(({ row, cells, parseError }) => {
    const northing = numberOf(cells.northing);
    const easting = numberOf(cells.easting);
    const elevation = numberOf(cells.elevation);
    const dto: SurveyShotRowDto = {
      row,
      point: cells.point,
      northing: typeof northing === 'number' ? northing : null,
      easting: typeof easting === 'number' ? easting : null,
      elevation: typeof elevation === 'number' ? elevation : null,
      description: cells.description,
      shot: null,
      holeId: null,
      holeNumber: null,
      lineLabel: null,
      outcome: 'invalid',
      message: null,
      changes: {},
    };
    const result: Match = { dto, hole: null, values: {} };
    const invalid = (message: string) => {
      dto.outcome = 'invalid';
      dto.message = message;
      return result;
    };

    const desc = DESCRIPTION.exec(cells.description);
    if (desc) {
      dto.shot = desc[1]!.toUpperCase() === 'TOP' ? 'top' : 'ground';
      dto.lineLabel = desc[2] ? desc[2] : null;
    }
    if (parseError) return invalid(`the row cannot be read: ${parseError}`);
    if (cells.point === '') return invalid('the point (test-hole number) is empty');
    const problems: string[] = [];
    if (!desc) problems.push(`description "${cells.description}" must start with TOP (top of line) or GND (ground), optionally followed by the line label`);
    if (elevation === 'invalid') problems.push(`elevation "${cells.elevation}" is not a number`);
    else if (elevation === null) problems.push('elevation is empty');
    if (northing === 'invalid') problems.push(`northing "${cells.northing}" is not a number`);
    if (easting === 'invalid') problems.push(`easting "${cells.easting}" is not a number`);
    if (dto.shot === 'top' && (northing === null || easting === null)) problems.push('a TOP shot needs its northing and easting');
    if (problems.length > 0) return invalid(problems.join('; '));
    if (typeof northing === 'number' && typeof easting === 'number' && Math.abs(northing) <= 90 && Math.abs(easting) <= 180) {
      return invalid(`northing ${northing} and easting ${easting} look like latitude and longitude; the file must be in the project's grid (${unitText})`);
    }

    const candidates = byNumber.get(cells.point.toLowerCase()) ?? [];
    if (candidates.length === 0) {
      dto.outcome = 'no_hole';
      dto.message = `no test hole numbered ${cells.point} in this project`;
      return result;
    }
    let hole: TestHole | undefined;
    if (dto.lineLabel) {
      const label = dto.lineLabel.toLowerCase();
      const hits = candidates.filter((h) => h.line.label.trim().toLowerCase() === label);
      if (hits.length !== 1) {
        dto.outcome = 'no_hole';
        dto.message = `test hole ${candidates[0]!.number} exposes ${candidates.map((h) => h.line.label).join(', ')}; no line labelled "${dto.lineLabel}"`;
        return result;
      }
      hole = hits[0];
    } else if (candidates.length === 1) {
      hole = candidates[0];
    } else {
      dto.outcome = 'ambiguous';
      dto.holeNumber = candidates[0]!.number;
      dto.message = `test hole ${candidates[0]!.number} exposes ${candidates.length} lines (${candidates.map((h) => h.line.label).join(', ')}): put the line label after ${dto.shot === 'top' ? 'TOP' : 'GND'}, e.g. "${dto.shot === 'top' ? 'TOP' : 'GND'} ${candidates[0]!.line.label}"`;
      return result;
    }
    result.hole = hole!;
    dto.holeId = hole!.id;
    dto.holeNumber = hole!.number;
    dto.lineLabel = hole!.line.label;
    const key = `${hole!.id}:${dto.shot}`;
    const earlier = seen.get(key);
    if (earlier !== undefined) {
      return invalid(`test hole ${hole!.number} (${hole!.line.label}) already has a ${dto.shot === 'top' ? 'TOP' : 'GND'} shot in row ${earlier}`);
    }
    seen.set(key, row);
    if (hole!.status === 'reviewed') {
      dto.outcome = 'locked';
      dto.message = `test hole ${hole!.number} (${hole!.line.label}) is reviewed and locked; a designer must reopen it first`;
      return result;
    }
    result.values =
      dto.shot === 'top'
        ? { surveyedTopElevation: elevation as number, surveyedEasting: easting as number, surveyedNorthing: northing as number }
        : { surveyedGroundElevation: elevation as number };
    for (const [field, after] of Object.entries(result.values) as [SurveyField, number][]) {
      const before = hole![field] ?? null;
      if (before !== after) dto.changes[field] = { before, after };
    }
    dto.outcome = 'match';
    dto.message = Object.keys(dto.changes).length === 0 ? 'no change: the hole already holds these values' : null;
    return result;
  });
}

function summary(matches: Match[], committed: boolean): SurveyImportResultDto {
  const changed = new Set(matches.filter((m) => Object.keys(m.dto.changes).length > 0).map((m) => m.dto.holeId));
  return {
    rows: matches.map((m) => m.dto),
    matched: matches.filter((m) => m.dto.outcome === 'match').length,
    problems: matches.filter((m) => m.dto.outcome !== 'match').length,
    holesChanged: changed.size,
    committed,
  };
}

/** What an import would do: matches, mismatches and changes. Writes nothing. */
export async function previewSurveyImport(em: EntityManager, project: Project, csv: string): Promise<SurveyImportResultDto> {
  return summary(await matchShots(em, project, parseSurveyCsv(csv)), false);
}

/**
 * Write the import, all or nothing: any row that is not a match refuses the whole file (400,
 * one error per row), otherwise one transaction updates the holes (versions bumped, a dug or
 * planned hole with a surveyed top and position becomes surveyed), writes an activity entry per
 * hole and recomputes the clearances once.
 */
export async function commitSurveyImport(em: EntityManager, project: Project, user: User, csv: string, fileName?: string): Promise<SurveyImportResultDto> {
  const rows = parseSurveyCsv(csv);
  return em.transactional(async (tem) => {
    const matches = await matchShots(tem, project, rows);
    const bad = matches.filter((m) => m.dto.outcome !== 'match');
    if (bad.length > 0) {
      throw new AppError(400, 'import_refused', `${bad.length} of ${matches.length} rows cannot be imported; nothing was written.`, {
        errors: bad.map((m) => ({ path: `row ${m.dto.row}`, message: `${m.dto.outcome.replace('_', ' ')}: ${m.dto.message ?? ''}`.trim() })),
      });
    }
    const valuesByHole = new Map<number, Match['values']>();
    for (const m of matches) {
      if (!m.hole || Object.keys(m.dto.changes).length === 0) continue;
      valuesByHole.set(m.hole.id, { ...valuesByHole.get(m.hole.id), ...m.values });
    }
    // Forget the holes read for matching and load only those that change, so no other record
    // is flushed along (each flushed record gets a new version).
    tem.clear();
    const changing = valuesByHole.size ? await tem.find(TestHole, { id: { $in: [...valuesByHole.keys()] }, project: project.id }) : [];
    const projectRef = tem.getReference(Project, project.id);
    const userRef = tem.getReference(User, user.id);
    for (const hole of changing) {
      const values = valuesByHole.get(hole.id)!;
      const before = presentHole(hole);
      Object.assign(hole, values);
      const surveyed = hole.surveyedTopElevation != null && hole.surveyedEasting != null && hole.surveyedNorthing != null;
      if (surveyed && (hole.status === 'dug' || hole.status === 'planned')) hole.status = 'surveyed';
      const after = presentHole(hole);
      logActivity(tem, {
        project: projectRef,
        user: userRef,
        entity: 'hole',
        entityId: hole.id,
        action: 'survey-import',
        before: fileName ? { ...before, importFile: null } : before,
        after: fileName ? { ...after, importFile: fileName } : after,
      });
    }
    await tem.flush();
    if (changing.length > 0) await recompute(projectRef, userRef)(tem);
    await tem.flush();
    return summary(matches, true);
  });
}
