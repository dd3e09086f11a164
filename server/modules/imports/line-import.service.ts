import type { EntityManager } from '@mikro-orm/sqlite';
import type { LineImportItemDto, LineImportPreviewDto, LineImportProblemDto, LineImportResultDto } from '@shared/api';
import { LINE_KIND_LABELS, UNIT_LABELS, type LinearUnit, type LineKind } from '@shared/domain';
import { findCrs, gridToLonLat, isGeometryError, lonLatToGrid, projectCrs, type CrsDefinition } from '@shared/geometry';
import type { GridPoint } from '@shared/schemas/common';
import { lineCreateSchema, type LineCreateInput } from '@shared/schemas/line';
import { LINE_IMPORT_MAX_LINES, type LineImportInput } from '@shared/schemas/line-import';
import { convertLength } from '@shared/units';
import { AppError } from '../../errors';
import { logActivity } from '../activity/activity.service';
import { recomputeConflicts } from '../clearances/clearance.service';
import { presentLine } from '../lines/line.presenter';
import { UtilityLine } from '../lines/utility-line.entity';
import type { Project } from '../projects/project.entity';
import type { User } from '../users/user.entity';
import { parseImportFile, suggestKind, type ImportProblem, type RawItem } from './line-import-parse';

/**
 * Line imports: preview (reads the file, reprojects it into the project grid and unit, checks
 * every line against the same schema as a typed-in line, writes nothing) and commit (the same
 * checks; then every line, its activity entry and one recomputation in one transaction, or
 * nothing at all).
 */

const LONLAT = 'EPSG:4326';
/** Lines shown in a preview (the count covers them all). */
const PREVIEW_ITEMS = 500;

interface Source {
  code: string;
  name: string;
  how: string;
}

interface CheckedItem {
  raw: RawItem;
  path: GridPoint[];
  length: number;
  label: string;
  input: LineCreateInput | null;
}

interface Analysis {
  preview: LineImportPreviewDto;
  valid: CheckedItem[];
  skipped: number;
}

function chooseSource(body: LineImportInput, fileCrs: string | null, project: Project): Source {
  if (body.sourceCrs) return { code: body.sourceCrs.toUpperCase(), name: '', how: 'chosen for this import' };
  if (body.format === 'geojson') {
    if (fileCrs) return { code: fileCrs, name: '', how: 'named by the file\u2019s crs member' };
    return { code: LONLAT, name: '', how: 'RFC 7946 default: the file names no CRS, so WGS 84 longitude/latitude' };
  }
  return { code: project.crsCode, name: '', how: 'the project grid: DXF and point files are read in the project\u2019s coordinates unless a CRS is chosen' };
}

/** Reproject a path into the project grid and unit; throws a GeometryError with a plain message. */
function reproject(coords: [number, number][], source: Source, src: CrsDefinition | null, target: CrsDefinition, unit: LinearUnit, sameAsProject: boolean): GridPoint[] {
  if (sameAsProject) return coords.map(([x, y]) => [x, y]);
  if (source.code === LONLAT) return coords.map((p) => lonLatToGrid(target, p, { unit }));
  if (src && src.proj4 === target.proj4) return coords.map(([x, y]) => [convertLength(x, src.unit, unit), convertLength(y, src.unit, unit)]);
  return coords.map((p) => lonLatToGrid(target, gridToLonLat(src!, p), { unit }));
}

function distinct(path: GridPoint[]): GridPoint[] {
  return path.filter((p, i) => i === 0 || p[0] !== path[i - 1]![0] || p[1] !== path[i - 1]![1]);
}

function planLength(path: GridPoint[]): number {
  let s = 0;
  for (let i = 1; i < path.length; i++) s += Math.hypot(path[i]![0] - path[i - 1]![0], path[i]![1] - path[i - 1]![1]);
  return s;
}

/** Read, reproject and check an import; the preview, and the lines a commit would write. */
export async function analyseImport(em: EntityManager, project: Project, body: LineImportInput, forCommit: boolean): Promise<Analysis> {
  const parsed = parseImportFile(body.format, body.content, body.groupBy);
  const problems: ImportProblem[] = [];
  const warnings = [...parsed.warnings];
  const source = chooseSource(body, parsed.fileCrs, project);
  let target: CrsDefinition;
  try {
    target = projectCrs(project.crsCode, project.crsProj4);
    // A project's own definition of a catalogue code still has that code's area of use.
    const known = findCrs(project.crsCode);
    if (!target.area && known) target = { ...target, area: known.area };
  } catch {
    throw new AppError(400, 'bad_request', 'The project\u2019s CRS definition cannot be used for reprojection; fix it in Settings first.');
  }
  const sameAsProject = source.code === project.crsCode.toUpperCase();
  let src: CrsDefinition | null = null;
  if (sameAsProject) {
    source.name = target.name;
  } else if (source.code === LONLAT) {
    source.name = 'WGS 84 longitude/latitude';
  } else {
    src = findCrs(source.code) ?? null;
    if (!src) {
      problems.push({
        ref: 'file',
        path: body.sourceCrs ? 'sourceCrs' : 'file.crs',
        message: `${source.code} is not in the built-in CRS catalogue; choose the coordinates\u2019 CRS from the list (or reproject the file first)`,
      });
    } else source.name = src.name;
  }
  if (body.sourceCrs && parsed.fileCrs && parsed.fileCrs !== source.code) {
    warnings.push(`The file names ${parsed.fileCrs}; ${source.code} is used as chosen.`);
  }
  if (body.format === 'dxf' && parsed.insunits !== null && sameAsProject) {
    const drawingUnit = parsed.insunits === 6 ? 'm' : parsed.insunits === 2 || parsed.insunits === 21 ? 'ft' : null;
    const projectFamily = project.unit === 'm' ? 'm' : 'ft';
    if (drawingUnit && drawingUnit !== projectFamily) {
      warnings.push(`The drawing says its units are ${drawingUnit === 'm' ? 'metres' : 'feet'}, but the project is in ${UNIT_LABELS[project.unit]}: check the coordinates (or choose the drawing\u2019s CRS).`);
    }
  }

  if (parsed.fatal) problems.push(parsed.fatal);
  // A bad row or feature in a group the person skips does not hold the import up.
  problems.push(...parsed.problems.filter((p) => !(p.group !== undefined && body.mapping?.[p.group]?.kind === 'skip')));
  if (parsed.items.length > LINE_IMPORT_MAX_LINES) {
    problems.push({ ref: 'file', path: 'content', message: `the file holds ${parsed.items.length} lines; one import takes at most ${LINE_IMPORT_MAX_LINES}` });
  }

  // Groups and what the person chose for them.
  const groupCounts = new Map<string, number>();
  for (const it of parsed.items) groupCounts.set(it.group, (groupCounts.get(it.group) ?? 0) + 1);
  const mapping = body.mapping ?? {};
  const defaults = body.defaults ?? {};
  const groups = [...groupCounts].map(([key, n]) => ({ key, count: n, suggestedKind: suggestKind(key) }));
  const unmapped = groups.filter((g) => !mapping[g.key]);
  if (forCommit) {
    for (const g of unmapped) problems.push({ ref: `group ${g.key}`, path: `mapping.${g.key}.kind`, message: `group ${g.key} (${g.count} lines): choose a line kind, or skip it` });
  }

  const existing = new Set(
    ((await em.createQueryBuilder(UtilityLine).select(['label']).where({ project: project.id }).execute('all')) as unknown as { label: string }[]).map((r) => r.label),
  );

  const checked: CheckedItem[] = [];
  const missing = new Map<string, { owner: number; diameter: number; recordDepth: number }>();
  const counters = new Map<string, number>();
  let skipped = 0;
  const canConvert = !(src === null && !sameAsProject && source.code !== LONLAT);
  for (const raw of parsed.items) {
    const m = mapping[raw.group];
    if (m?.kind === 'skip') {
      skipped++;
      continue;
    }
    let path: GridPoint[] | null = null;
    if (canConvert) {
      try {
        path = distinct(reproject(raw.coords, source, src, target, project.unit, sameAsProject));
      } catch (e) {
        problems.push({ ref: raw.ref, path: `${raw.path}.geometry`, message: `${raw.ref}: ${isGeometryError(e) ? e.message : 'the coordinates could not be converted'}` });
        continue;
      }
      if (path.length < 2) {
        problems.push({ ref: raw.ref, path: `${raw.path}.geometry`, message: `${raw.ref}: a line needs at least two distinct points (got ${path.length})` });
        continue;
      }
      if (path.length > 10_000) {
        problems.push({ ref: raw.ref, path: `${raw.path}.geometry`, message: `${raw.ref}: ${path.length} vertices; a line takes at most 10,000` });
        continue;
      }
    }
    const n = (counters.get(raw.group) ?? 0) + 1;
    counters.set(raw.group, n);
    const label = raw.label ?? `${raw.group}-${n}`;
    let input: LineCreateInput | null = null;
    if (m && path) {
      const owner = raw.props.owner ?? m.owner ?? defaults.owner ?? null;
      const diameter = raw.props.diameter ?? m.diameter ?? defaults.diameter ?? null;
      const recordDepth = raw.props.recordDepth ?? defaults.recordDepth;
      const miss = missing.get(raw.group) ?? { owner: 0, diameter: 0, recordDepth: 0 };
      if (!owner) miss.owner++;
      if (diameter == null) miss.diameter++;
      if (recordDepth === undefined) miss.recordDepth++;
      missing.set(raw.group, miss);
      if (owner && diameter != null && recordDepth !== undefined) {
        const candidate = {
          label,
          owner,
          kind: m.kind as LineKind,
          shape: 'round' as const,
          diameter,
          material: raw.props.material ?? null,
          status: raw.props.status ?? defaults.status ?? 'active',
          qualityLevel: raw.props.qualityLevel ?? defaults.qualityLevel ?? 'D',
          path,
          recordDepth,
        };
        const result = lineCreateSchema.safeParse(candidate);
        if (result.success) input = result.data;
        else for (const issue of result.error.issues) problems.push({ ref: raw.ref, path: `${raw.path}.${issue.path.map(String).join('.')}`, message: `${raw.ref}: ${issue.path.map(String).join('.') || 'line'} ${issue.message}` });
      }
    }
    checked.push({ raw, path: path ?? [], length: path ? planLength(path) : 0, label, input });
  }
  for (const [group, miss] of missing) {
    const g = `group ${group}`;
    if (miss.owner) problems.push({ ref: g, path: `mapping.${group}.owner`, message: `${miss.owner} line${miss.owner === 1 ? '' : 's'} of ${group} name no owner: give an owner for the group, or a default owner` });
    if (miss.diameter) problems.push({ ref: g, path: `mapping.${group}.diameter`, message: `${miss.diameter} line${miss.diameter === 1 ? '' : 's'} of ${group} give no size: give an outside diameter for the group, or a default size` });
  }
  const depthMissing = [...missing.values()].reduce((s, m) => s + m.recordDepth, 0);
  if (depthMissing) problems.push({ ref: 'defaults', path: 'defaults.recordDepth', message: `${depthMissing} line${depthMissing === 1 ? '' : 's'} give no record depth: give the assumed depth to top for lines without a test hole` });

  const labelsExisting = checked.filter((c) => existing.has(c.label)).length;
  if (labelsExisting > 0) warnings.push(`${labelsExisting} of the labels are already in the register: importing the same file twice makes the lines twice.`);

  const valid = checked.filter((c) => c.input !== null);
  const willCreate = checked.length;
  const items: LineImportItemDto[] = checked.slice(0, PREVIEW_ITEMS).map((c) => ({
    ref: c.raw.ref,
    group: c.raw.group,
    label: c.label,
    owner: c.raw.props.owner ?? null,
    diameter: c.raw.props.diameter ?? null,
    vertexCount: c.path.length,
    length: Math.round(c.length * 1000) / 1000,
    start: c.path[0] ?? [0, 0],
    end: c.path[c.path.length - 1] ?? [0, 0],
    labelExists: existing.has(c.label),
  }));
  const ignored = [...parsed.ignored].map(([what, n]) => ({ what, count: n }));
  const ready = problems.length === 0 && unmapped.length === 0 && valid.length > 0 && valid.length === willCreate;
  return {
    preview: {
      format: body.format,
      fileName: body.fileName ?? null,
      source: { crs: source.code, name: source.name || source.code, how: source.how },
      targetCrs: project.crsCode,
      unit: project.unit,
      groups,
      items,
      itemCount: checked.length,
      willCreate,
      problems: problems.map((p): LineImportProblemDto => ({ ref: p.ref, path: p.path, message: p.message })),
      warnings,
      ignored,
      ready,
    },
    valid,
    skipped,
  };
}

/** Write the import: every line, one activity entry each and a summary, one recomputation; all or nothing. */
export async function commitImport(em: EntityManager, project: Project, user: User, body: LineImportInput): Promise<LineImportResultDto> {
  const { preview, valid, skipped } = await analyseImport(em, project, body, true);
  if (!preview.ready) {
    const errors = preview.problems.length
      ? preview.problems.map((p) => ({ path: p.path, message: p.message }))
      : [{ path: 'content', message: 'the file holds no line to import (every group skipped, or nothing readable)' }];
    throw new AppError(400, 'import_invalid', 'Nothing was imported: fix the rows listed (or skip their groups) and try again.', { errors });
  }
  return em.transactional(async (tem) => {
    const lines = valid.map(({ input }) => {
      const i = input!;
      const line = new UtilityLine(project, i.label, i.owner, i.kind, i.path);
      Object.assign(line, {
        shape: i.shape,
        diameter: i.diameter ?? null,
        material: i.material ?? null,
        status: i.status,
        qualityLevel: i.qualityLevel,
        recordDepth: i.recordDepth,
      });
      tem.persist(line);
      return line;
    });
    await tem.flush();
    for (const line of lines) {
      logActivity(tem, { project, user, entity: 'line', entityId: line.id, action: 'import', before: null, after: presentLine(line) });
    }
    logActivity(tem, {
      project,
      user,
      entity: 'line-import',
      entityId: null,
      action: 'import',
      before: null,
      after: {
        format: body.format,
        fileName: body.fileName ?? null,
        sourceCrs: preview.source.crs,
        created: lines.length,
        skipped,
        kinds: [...new Set(lines.map((l) => LINE_KIND_LABELS[l.kind]))].join(', '),
      },
    });
    await recomputeConflicts(tem, project, user);
    await tem.flush();
    return { created: lines.length, skipped, lineIds: lines.map((l) => l.id), checkedAt: new Date().toISOString() };
  });
}
