import DxfParser from 'dxf-parser';
import type { IEntity, ILineEntity, ILwpolylineEntity, IPolylineEntity } from 'dxf-parser';
import Papa from 'papaparse';
import { LINE_KINDS, LINE_STATUSES, QUALITY_LEVELS, type LineKind, type LineStatus, type QualityLevel } from '@shared/domain';
import type { LineImportFormat } from '@shared/schemas/line-import';

/**
 * Reading line-import files into plain items in the file's own coordinates, with every bad
 * row, feature or entity reported by its number. Nothing here knows the project.
 */

/** A problem with where it is in the file's terms and as a field path. */
export interface ImportProblem {
  ref: string;
  path: string;
  message: string;
  /** The group of the row or feature, when known: a skipped group's problems do not count. */
  group?: string;
}

/** Tag the problems added since `from` with their group. */
function tag(problems: ImportProblem[], from: number, group: string): void {
  for (let i = from; i < problems.length; i++) problems[i]!.group ??= group;
}

/** Values a GeoJSON feature may give for its line (checked one by one). */
export interface ItemProps {
  owner?: string;
  material?: string;
  diameter?: number;
  qualityLevel?: QualityLevel;
  status?: LineStatus;
  recordDepth?: number;
}

/** One line found in the file, in the file's coordinates. */
export interface RawItem {
  ref: string;
  /** Field path of the item (`file.features.3`, `file.entities.7`, `file.rows.12`). */
  path: string;
  group: string;
  /** The label the file gives, or null (one is made from the group). */
  label: string | null;
  props: ItemProps;
  coords: [number, number][];
}

export interface ParsedFile {
  items: RawItem[];
  problems: ImportProblem[];
  warnings: string[];
  ignored: Map<string, number>;
  /** EPSG code named by the file (GeoJSON `crs` member), normalised to `EPSG:<n>`; `EPSG:4326` for CRS84. */
  fileCrs: string | null;
  /** What the groups are (`layer`, `property "kind"`, `code`). */
  groupedBy: string;
  /** DXF $INSUNITS, when the drawing states it. */
  insunits: number | null;
  /** A problem with the whole file: nothing else is worth reading. */
  fatal: ImportProblem | null;
}

function empty(groupedBy: string): ParsedFile {
  return { items: [], problems: [], warnings: [], ignored: new Map(), fileCrs: null, groupedBy, insunits: null, fatal: null };
}

const count = (m: Map<string, number>, key: string) => m.set(key, (m.get(key) ?? 0) + 1);

export function parseImportFile(format: LineImportFormat, content: string, groupBy?: string): ParsedFile {
  switch (format) {
    case 'geojson':
      return parseGeojson(content, groupBy);
    case 'dxf':
      return parseDxf(content);
    case 'csv':
      return parseCsv(content);
  }
}

// ---------------------------------------------------------------------------------------------
// GeoJSON

/** `EPSG:2278` from a GeoJSON 2008 `crs` member (`urn:ogc:def:crs:EPSG::2278`, `EPSG:2278`, CRS84). */
export function crsFromMember(crs: unknown): string | null | 'unreadable' {
  if (crs === undefined || crs === null) return null;
  const name = (crs as { properties?: { name?: unknown } }).properties?.name;
  if (typeof name !== 'string') return 'unreadable';
  if (/CRS:?84$/i.test(name)) return 'EPSG:4326';
  const m = /EPSG:+(?:[\d.]*:)?(\d{4,6})$/i.exec(name.trim());
  return m ? `EPSG:${m[1]}` : 'unreadable';
}

function isObject(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

function positions(value: unknown, path: string, ref: string, problems: ImportProblem[]): [number, number][] | null {
  if (!Array.isArray(value)) {
    problems.push({ ref, path, message: `${ref}: coordinates must be a list of positions` });
    return null;
  }
  const out: [number, number][] = [];
  for (let j = 0; j < value.length; j++) {
    const p: unknown = value[j];
    if (!Array.isArray(p) || p.length < 2 || typeof p[0] !== 'number' || typeof p[1] !== 'number' || !Number.isFinite(p[0]) || !Number.isFinite(p[1])) {
      problems.push({ ref, path: `${path}.${j + 1}`, message: `${ref}: position ${j + 1} is not a pair of numbers` });
      return null;
    }
    out.push([p[0], p[1]]);
  }
  return out;
}

function readProps(raw: Record<string, unknown>, path: string, ref: string, problems: ImportProblem[]): ItemProps {
  const props: ItemProps = {};
  const bad = (key: string, message: string) => problems.push({ ref, path: `${path}.properties.${key}`, message: `${ref}: ${key} ${message}` });
  const text = (key: string, max: number): string | undefined => {
    const v = raw[key];
    if (v === undefined || v === null || v === '') return undefined;
    if (typeof v !== 'string' && typeof v !== 'number') {
      bad(key, 'must be text');
      return undefined;
    }
    const s = String(v).trim();
    if (s.length > max) {
      bad(key, `is longer than ${max} characters`);
      return undefined;
    }
    return s || undefined;
  };
  const number = (key: string, positive: boolean): number | undefined => {
    const v = raw[key];
    if (v === undefined || v === null || v === '') return undefined;
    const n = typeof v === 'number' ? v : typeof v === 'string' ? Number(v.trim()) : NaN;
    if (!Number.isFinite(n) || (positive ? n <= 0 : n < 0)) {
      bad(key, `must be a number ${positive ? 'greater than zero' : 'of zero or more'} (got ${JSON.stringify(v)})`);
      return undefined;
    }
    return n;
  };
  props.owner = text('owner', 160);
  props.material = text('material', 80);
  props.diameter = number('diameter', true);
  props.recordDepth = number('recordDepth', false);
  const ql = raw.qualityLevel;
  if (ql !== undefined && ql !== null && ql !== '') {
    const q = String(ql).trim().toUpperCase().replace(/^QL-?/, '');
    if ((QUALITY_LEVELS as readonly string[]).includes(q)) props.qualityLevel = q as QualityLevel;
    else bad('qualityLevel', `must be A, B, C or D (got ${JSON.stringify(ql)})`);
  }
  const st = raw.status;
  if (st !== undefined && st !== null && st !== '') {
    const s = String(st).trim().toLowerCase();
    if ((LINE_STATUSES as readonly string[]).includes(s)) props.status = s as LineStatus;
    else bad('status', `must be one of ${LINE_STATUSES.join(', ')} (got ${JSON.stringify(st)})`);
  }
  return props;
}

function labelOf(raw: Record<string, unknown>): string | null {
  for (const key of ['label', 'name', 'id']) {
    const v = raw[key];
    if ((typeof v === 'string' && v.trim() !== '') || (typeof v === 'number' && Number.isFinite(v))) return String(v).trim();
  }
  return null;
}

function parseGeojson(content: string, groupBy?: string): ParsedFile {
  let root: unknown;
  try {
    root = JSON.parse(content);
  } catch (e) {
    const out = empty('');
    out.fatal = { ref: 'file', path: 'content', message: `the file is not valid JSON (${e instanceof Error ? e.message : 'unreadable'})` };
    return out;
  }
  let features: unknown[];
  if (isObject(root) && root.type === 'FeatureCollection' && Array.isArray(root.features)) features = root.features;
  else if (isObject(root) && root.type === 'Feature') features = [root];
  else if (isObject(root) && (root.type === 'LineString' || root.type === 'MultiLineString')) features = [{ type: 'Feature', geometry: root, properties: {} }];
  else {
    const out = empty('');
    out.fatal = { ref: 'file', path: 'content', message: 'the file is JSON but not GeoJSON: expected a FeatureCollection, a Feature or a LineString' };
    return out;
  }
  const props = features.map((f) => (isObject(f) && isObject(f.properties) ? f.properties : {}));
  const key = groupBy ?? (props.some((p) => p.kind != null) ? 'kind' : props.some((p) => p.layer != null) ? 'layer' : null);
  const out = empty(key ? `property "${key}"` : 'one group');
  const crs = crsFromMember(isObject(root) ? root.crs : undefined);
  if (crs === 'unreadable') out.warnings.push('The file\u2019s crs member names no EPSG code this import reads; choose the coordinates\u2019 CRS.');
  else out.fileCrs = crs;
  let hadZ = false;
  features.forEach((f, index) => {
    const i = index + 1;
    const ref = `feature ${i}`;
    const path = `file.features.${i}`;
    if (!isObject(f) || f.type !== 'Feature') {
      out.problems.push({ ref, path, message: `${ref} is not a GeoJSON Feature` });
      return;
    }
    const g = f.geometry;
    if (!isObject(g)) {
      count(out.ignored, 'feature without geometry');
      return;
    }
    const raw = props[index]!;
    const group = key ? (raw[key] == null || raw[key] === '' ? '(none)' : String(raw[key]).trim()) : '(all features)';
    const label = labelOf(raw);
    const from = out.problems.length;
    const itemProps = readProps(raw, path, ref, out.problems);
    if (g.type === 'LineString') {
      const c = positions(g.coordinates, `${path}.geometry.coordinates`, ref, out.problems);
      if (Array.isArray(g.coordinates) && g.coordinates.some((p) => Array.isArray(p) && p.length > 2)) hadZ = true;
      if (c) out.items.push({ ref, path, group, label, props: itemProps, coords: c });
    } else if (g.type === 'MultiLineString') {
      if (!Array.isArray(g.coordinates)) {
        out.problems.push({ ref, path: `${path}.geometry.coordinates`, message: `${ref}: coordinates must be a list of lines` });
        return;
      }
      const parts = g.coordinates as unknown[];
      parts.forEach((part, k) => {
        const partRef = parts.length > 1 ? `${ref}, part ${k + 1}` : ref;
        const c = positions(part, `${path}.geometry.coordinates.${k + 1}`, partRef, out.problems);
        if (Array.isArray(part) && part.some((p) => Array.isArray(p) && p.length > 2)) hadZ = true;
        if (c) out.items.push({ ref: partRef, path: parts.length > 1 ? `${path}.parts.${k + 1}` : path, group, label: label && parts.length > 1 ? `${label}/${k + 1}` : label, props: itemProps, coords: c });
      });
    } else {
      count(out.ignored, `${String(g.type)} feature`);
    }
    tag(out.problems, from, group);
  });
  if (hadZ) out.warnings.push('Heights in the coordinates are not used: Threadline takes line elevations from test holes.');
  return out;
}

// ---------------------------------------------------------------------------------------------
// DXF

function parseDxf(content: string): ParsedFile {
  const out = empty('layer');
  let dxf;
  try {
    dxf = new DxfParser().parseSync(content);
  } catch (e) {
    out.fatal = { ref: 'file', path: 'content', message: `the DXF could not be read (${e instanceof Error ? e.message : 'unreadable'})` };
    return out;
  }
  if (!dxf) {
    out.fatal = { ref: 'file', path: 'content', message: 'the DXF could not be read' };
    return out;
  }
  const units = (dxf.header as Record<string, unknown> | undefined)?.$INSUNITS;
  out.insunits = typeof units === 'number' ? units : null;
  const counters = new Map<string, number>();
  let bulges = 0;
  let hadZ = false;
  (dxf.entities ?? []).forEach((e: IEntity, index: number) => {
    const i = index + 1;
    const ref = `entity ${i} (${e.type}${e.handle !== undefined ? `, handle ${String(e.handle)}` : ''})`;
    const path = `file.entities.${i}`;
    if (e.inPaperSpace) {
      count(out.ignored, `${e.type} in paper space`);
      return;
    }
    let pts: { x: number; y: number; z?: number }[];
    if (e.type === 'LWPOLYLINE') {
      const lw = e as ILwpolylineEntity;
      pts = [...(lw.vertices ?? [])];
      if (pts.some((v) => (v as { bulge?: number }).bulge)) bulges++;
      if (lw.shape && pts.length > 2) pts.push(pts[0]!);
      if (lw.elevation) hadZ = true;
    } else if (e.type === 'POLYLINE') {
      const pl = e as IPolylineEntity;
      if (pl.is3dPolygonMesh || pl.isPolyfaceMesh) {
        count(out.ignored, 'POLYLINE mesh');
        return;
      }
      pts = [...(pl.vertices ?? [])];
      if (pts.some((v) => (v as { bulge?: number }).bulge)) bulges++;
      if (pl.shape && pts.length > 2) pts.push(pts[0]!);
    } else if (e.type === 'LINE') {
      pts = [...((e as ILineEntity).vertices ?? [])];
    } else {
      count(out.ignored, e.type);
      return;
    }
    const group = (e.layer ?? '0').trim() || '0';
    const coords: [number, number][] = [];
    for (let j = 0; j < pts.length; j++) {
      const v = pts[j]!;
      if (typeof v.x !== 'number' || typeof v.y !== 'number' || !Number.isFinite(v.x) || !Number.isFinite(v.y)) {
        out.problems.push({ ref, path: `${path}.vertices.${j + 1}`, message: `${ref}: vertex ${j + 1} has no finite x and y`, group });
        return;
      }
      if (v.z) hadZ = true;
      coords.push([v.x, v.y]);
    }
    const n = (counters.get(group) ?? 0) + 1;
    counters.set(group, n);
    out.items.push({ ref, path, group, label: `${group}-${n}`, props: {}, coords });
  });
  if (bulges > 0) out.warnings.push(`${bulges} polyline${bulges === 1 ? ' has' : 's have'} arc segments (bulges); they are imported as straight chords between the vertices.`);
  if (hadZ) out.warnings.push('Elevations (Z) in the drawing are not used: Threadline takes line elevations from test holes.');
  const inserts = out.ignored.get('INSERT');
  if (inserts) out.warnings.push(`${inserts} block reference${inserts === 1 ? ' is' : 's are'} not expanded: explode blocks in CAD first if they hold lines.`);
  return out;
}

// ---------------------------------------------------------------------------------------------
// CSV point file

const HEADER_NAMES: Record<'point' | 'northing' | 'easting' | 'elevation' | 'description', RegExp> = {
  point: /^(point|pt|pnt|point ?(no|number|id)|name|id)$/i,
  northing: /^(northing|north|n|y)$/i,
  easting: /^(easting|east|e|x)$/i,
  elevation: /^(elevation|elev|z|height|el)$/i,
  description: /^(description|desc|code|descriptor|d)$/i,
};

const isNumeric = (s: string | undefined) => s !== undefined && s.trim() !== '' && Number.isFinite(Number(s.trim()));

/**
 * A point file (`point, northing, easting, elevation, description`, with or without a header
 * row; `#` lines are comments): each code (the description's first word) becomes one line
 * through its points in file order.
 */
function parseCsv(content: string): ParsedFile {
  const out = empty('code');
  const parsed = Papa.parse<string[]>(content, { skipEmptyLines: false });
  const rows = parsed.data;
  let columns = { point: 0, northing: 1, easting: 2, elevation: 3, description: 4 };
  let headerSeen = false;
  const groups = new Map<string, { rows: number[]; coords: [number, number][] }>();
  let elevations = 0;
  for (let index = 0; index < rows.length; index++) {
    const cells = rows[index]!;
    const r = index + 1;
    const ref = `row ${r}`;
    const path = `file.rows.${r}`;
    if (cells.every((c) => c.trim() === '')) continue;
    if (cells[0]!.trim().startsWith('#')) continue;
    if (!headerSeen) {
      headerSeen = true;
      if (!isNumeric(cells[1]) && !isNumeric(cells[2])) {
        const found: Partial<typeof columns> = {};
        cells.forEach((c, k) => {
          for (const [name, re] of Object.entries(HEADER_NAMES) as [keyof typeof columns, RegExp][]) if (found[name] === undefined && re.test(c.trim())) found[name] = k;
        });
        if (found.northing === undefined || found.easting === undefined || found.description === undefined) {
          out.fatal = { ref, path, message: `${ref}: the header row needs northing, easting and description columns (found ${cells.map((c) => `"${c.trim()}"`).join(', ')})` };
          return out;
        }
        columns = { point: found.point ?? -1, northing: found.northing, easting: found.easting, elevation: found.elevation ?? -1, description: found.description };
        continue;
      }
    }
    const cell = (k: number) => (k >= 0 ? (cells[k] ?? '').trim() : '');
    const problemsBefore = out.problems.length;
    const n = cell(columns.northing);
    const e = cell(columns.easting);
    if (!isNumeric(n)) out.problems.push({ ref, path: `${path}.northing`, message: `${ref}: northing ${n === '' ? 'is empty' : `"${n}" is not a number`}` });
    if (!isNumeric(e)) out.problems.push({ ref, path: `${path}.easting`, message: `${ref}: easting ${e === '' ? 'is empty' : `"${e}" is not a number`}` });
    const z = cell(columns.elevation);
    if (z !== '' && !isNumeric(z)) out.problems.push({ ref, path: `${path}.elevation`, message: `${ref}: elevation "${z}" is not a number (leave it empty if unknown)` });
    const description = cell(columns.description);
    if (description === '') out.problems.push({ ref, path: `${path}.description`, message: `${ref}: description is empty; its first word is the code naming the line the point belongs to` });
    if (out.problems.length > problemsBefore) continue;
    if (z !== '') elevations++;
    const code = description.split(/\s+/)[0]!;
    const g = groups.get(code) ?? { rows: [], coords: [] };
    g.rows.push(r);
    g.coords.push([Number(e), Number(n)]);
    groups.set(code, g);
  }
  for (const [code, g] of groups) {
    const first = g.rows[0]!;
    const last = g.rows[g.rows.length - 1]!;
    const ref = g.rows.length === 1 ? `row ${first} (code ${code})` : `rows ${first}\u2013${last} (code ${code})`;
    out.items.push({ ref, path: `file.rows.${first}`, group: code, label: code, props: {}, coords: g.coords });
  }
  if (elevations > 0) out.warnings.push(`${elevations} point${elevations === 1 ? ' has an elevation' : 's have elevations'}; they are not stored on lines: Threadline takes line elevations from test holes (import the surveyor's hole shots under Test holes, Import survey shots).`);
  return out;
}

// ---------------------------------------------------------------------------------------------
// Kind suggestions

const KIND_WORDS: [RegExp, LineKind][] = [
  [/reclaim|recycled|(^|[^a-z])rw([^a-z]|$)|purple/i, 'reclaimed_water'],
  [/sanitary|sewer|waste|(^|[^a-z])(ss|san|sww)([^a-z]|$)/i, 'sewer'],
  [/storm|(^|[^a-z])(sd|stm)([^a-z]|$)|drain/i, 'storm'],
  [/water|(^|[^a-z])(wtr|wm|w)([^a-z0-9]|$)|potable/i, 'water'],
  [/(^|[^a-z])(gas|ng|g)([^a-z0-9]|$)/i, 'gas'],
  [/oil|petrol|fuel/i, 'oil'],
  [/steam/i, 'steam'],
  [/elec|power|(^|[^a-z])(pwr|ep|ue|e)([^a-z0-9]|$)/i, 'electric'],
  [/comm|tele|(^|[^a-z])(tel|fo|catv|tv|c)([^a-z0-9]|$)|fib(er|re)|cable/i, 'communications'],
  [/unknown|unid/i, 'unknown'],
];

/** A kind guessed from a group name (`UTIL-WATER` → water, `E-UG` → electric); the user confirms it. */
export function suggestKind(group: string): LineKind | null {
  const norm = group.trim().toLowerCase().replace(/[\s-]+/g, '_');
  if ((LINE_KINDS as readonly string[]).includes(norm)) return norm as LineKind;
  for (const [re, kind] of KIND_WORDS) if (re.test(group)) return kind;
  return null;
}
