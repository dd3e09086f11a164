/**
 * Coordinate reference systems (SPEC §4: plan geometry in the project grid; longitude/latitude
 * only for the map and phone GPS). A small catalogue of proj4 definitions with their area of
 * use, a validator for custom proj4 strings, and converters cached per CRS pair (a reused
 * proj4 converter is ~18× faster than `proj4(from, to, pt)` per call, STACK.md).
 *
 * proj4 returns grid coordinates in the CRS's own unit (US survey feet for EPSG:2278); pass
 * the project's unit to convert explicitly when the two differ.
 */
import proj4 from 'proj4';
import type { LinearUnit } from '../domain';
import { convertLength } from '../units';
import { GeometryError } from './errors';
import type { XY } from './planar';

/** Longitude/latitude bounds in degrees: [west, south, east, north]. */
export type LonLatBounds = readonly [number, number, number, number];

/** A catalogue entry: an EPSG code, its proj4 definition, grid unit and area of use. */
export interface CrsDefinition {
  code: string;
  name: string;
  proj4: string;
  unit: LinearUnit;
  /** Area of use (approximate, lon/lat degrees); null when unknown (custom definitions). */
  area: LonLatBounds | null;
  /** Where the definition and its area come from, and how sure we are. */
  note?: string;
}

/** proj4 definition of WGS 84 longitude/latitude (the map's and GPS's coordinates). */
export const WGS84_LONLAT = '+proj=longlat +datum=WGS84 +no_defs';

const TEXAS_SOUTH_CENTRAL_AREA: LonLatBounds = [-100.0, 27.78, -93.41, 30.67];

function utmZoneArea(zone: number, south: boolean, northLimit = 84): LonLatBounds {
  const west = -180 + 6 * (zone - 1);
  return south ? [west, -80, west + 6, 0] : [west, 0, west + 6, northLimit];
}

function buildCatalogue(): Map<string, CrsDefinition> {
  const list: CrsDefinition[] = [
    {
      code: 'EPSG:2278',
      name: 'NAD83 / Texas South Central (ftUS)',
      proj4:
        '+proj=lcc +lat_0=27.8333333333333 +lon_0=-99 +lat_1=30.2833333333333 +lat_2=28.3833333333333 ' +
        '+x_0=600000 +y_0=3999999.9998984 +ellps=GRS80 +towgs84=0,0,0,0,0,0,0 +units=us-ft +no_defs',
      unit: 'usft',
      area: TEXAS_SOUTH_CENTRAL_AREA,
      note: 'EPSG parameters (false northing 13,123,333.333 ftUS); NAD83 taken equal to WGS 84 for the map (about 1 m). Area approximate, from memory.',
    },
    {
      code: 'EPSG:32040',
      name: 'NAD27 / Texas South Central',
      proj4:
        '+proj=lcc +lat_0=27.8333333333333 +lon_0=-99 +lat_1=28.3833333333333 +lat_2=30.2833333333333 ' +
        '+x_0=609601.2192024384 +y_0=0 +ellps=clrk66 +towgs84=-8,160,176,0,0,0,0 +units=us-ft +no_defs',
      unit: 'usft',
      area: TEXAS_SOUTH_CENTRAL_AREA,
      note: 'EPSG parameters; NAD27→WGS 84 by the three-parameter CONUS mean shift (about 10 m, from memory): map use only.',
    },
    {
      code: 'EPSG:27700',
      name: 'OSGB36 / British National Grid',
      proj4:
        '+proj=tmerc +lat_0=49 +lon_0=-2 +k=0.9996012717 +x_0=400000 +y_0=-100000 +ellps=airy ' +
        '+towgs84=446.448,-125.157,542.06,0.15,0.247,0.842,-20.489 +units=m +no_defs',
      unit: 'm',
      area: [-9.01, 49.75, 2.01, 61.01],
      note: 'EPSG parameters; OSGB36→WGS 84 by the seven-parameter Helmert shift (a few metres). Area from memory.',
    },
  ];
  for (let zone = 1; zone <= 23; zone++) {
    list.push({
      code: `EPSG:${26900 + zone}`,
      name: `NAD83 / UTM zone ${zone}N`,
      proj4: `+proj=utm +zone=${zone} +ellps=GRS80 +towgs84=0,0,0,0,0,0,0 +units=m +no_defs`,
      unit: 'm',
      area: (() => {
        const [w, , e, n] = utmZoneArea(zone, false);
        return [w, 14, e, n] as const;
      })(),
      note: 'Area: the zone’s 6° strip over North America (latitude limits approximate).',
    });
  }
  for (let zone = 1; zone <= 60; zone++) {
    list.push({
      code: `EPSG:${32600 + zone}`,
      name: `WGS 84 / UTM zone ${zone}N`,
      proj4: `+proj=utm +zone=${zone} +datum=WGS84 +units=m +no_defs`,
      unit: 'm',
      area: utmZoneArea(zone, false),
    });
    list.push({
      code: `EPSG:${32700 + zone}`,
      name: `WGS 84 / UTM zone ${zone}S`,
      proj4: `+proj=utm +zone=${zone} +south +datum=WGS84 +units=m +no_defs`,
      unit: 'm',
      area: utmZoneArea(zone, true),
    });
  }
  return new Map(list.map((c) => [c.code, c]));
}

/** The built-in CRS catalogue keyed by EPSG code (`EPSG:2278`). */
export const CRS_CATALOGUE: ReadonlyMap<string, CrsDefinition> = buildCatalogue();

/** Catalogue entry for an EPSG code, or undefined. */
export function findCrs(code: string): CrsDefinition | undefined {
  return CRS_CATALOGUE.get(code.trim().toUpperCase());
}

/** Catalogue entry for an EPSG code; throws UNKNOWN_CRS (the caller should then ask for a proj4 string). */
export function getCrs(code: string): CrsDefinition {
  const c = findCrs(code);
  if (!c) throw new GeometryError('UNKNOWN_CRS', `${code} is not in the built-in catalogue; give its proj4 definition`, { code });
  return c;
}

// ---------------------------------------------------------------------------------------------
// Validation of custom proj4 strings

/** The result of checking a proj4 string. */
export interface ValidatedProj4 {
  /** The definition, whitespace-normalised. */
  proj4: string;
  /** Projection method, e.g. `lcc`, `tmerc`, `utm`. */
  projection: string;
  /** Linear unit of the grid. */
  unit: LinearUnit;
  /** Things that work but deserve a word to the user. */
  warnings: string[];
}

const NUMERIC_KEYS = new Set([
  'lat_0', 'lon_0', 'lat_1', 'lat_2', 'lat_ts', 'x_0', 'y_0', 'k', 'k_0', 'a', 'b', 'rf', 'f', 'R',
  'zone', 'alpha', 'gamma', 'lonc', 'to_meter', 'h', 'from_greenwich',
]);
// proj4js's ellipsoid and datum names (anything else silently falls back to WGS 84 in proj4js).
const ELLIPSOIDS = new Set([
  'MERIT', 'SGS85', 'GRS80', 'IAU76', 'airy', 'APL4', 'NWL9D', 'mod_airy', 'andrae', 'aust_SA', 'GRS67',
  'bessel', 'bess_nam', 'clrk66', 'clrk80', 'clrk58', 'CPM', 'delmbr', 'engelis', 'evrst30', 'evrst48',
  'evrst56', 'evrst69', 'evrstSS', 'fschr60', 'fschr60m', 'fschr68', 'helmert', 'hough', 'intl', 'kaula',
  'lerch', 'mprts', 'new_intl', 'plessis', 'krass', 'SEasia', 'walbeck', 'WGS60', 'WGS66', 'WGS7', 'WGS72', 'WGS84', 'sphere',
]);
const DATUMS = new Set([
  'WGS84', 'ch1903', 'ggrs87', 'nad83', 'NAD83', 'nad27', 'NAD27', 'potsdam', 'carthage', 'hermannskogel',
  'osni52', 'ire65', 'rassadiran', 'nzgd49', 'osgb36', 'OSGB36', 's_jtsk', 'beduaram', 'gunung_segara', 'rnb72',
]);
const GEOGRAPHIC = new Set(['longlat', 'latlong', 'lonlat', 'latlon', 'geocent']);
const UNIT_OF: Record<string, LinearUnit> = { m: 'm', ft: 'ft', 'us-ft': 'usft' };

function fail(message: string): never {
  throw new GeometryError('INVALID_PROJ4', message);
}

function parseTokens(def: string): Map<string, string> {
  const params = new Map<string, string>();
  for (const token of def.split(/\s+/)) {
    const m = /^\+([A-Za-z_][A-Za-z0-9_]*)(?:=(\S*))?$/.exec(token);
    if (!m) fail(`"${token}" is not a proj4 parameter (expected +name or +name=value)`);
    if (params.has(m[1]!)) fail(`+${m[1]!} is given twice`);
    params.set(m[1]!, m[2] ?? '');
  }
  return params;
}

/** `+proj=longlat` on the same datum and ellipsoid as `def` (for conversions with no datum shift). */
export function geographicBaseOf(def: string): string {
  const keep = ['ellps', 'datum', 'towgs84', 'a', 'b', 'rf', 'f', 'R', 'nadgrids', 'pm'];
  const params = parseTokens(def.trim());
  const parts = ['+proj=longlat'];
  for (const k of keep) {
    const v = params.get(k);
    if (v !== undefined) parts.push(v === '' ? `+${k}` : `+${k}=${v}`);
  }
  parts.push('+no_defs');
  return parts.join(' ');
}

/**
 * Check a custom proj4 definition for a project grid: a projected CRS (not longitude/latitude)
 * in metres, international feet or US survey feet, with known ellipsoid and datum names and
 * finite numeric parameters, that proj4 can build and invert at its own origin. Throws
 * INVALID_PROJ4 with a plain message; returns the unit and any warnings.
 */
export function validateProj4(def: string): ValidatedProj4 {
  if (typeof def !== 'string') fail('a proj4 definition must be text');
  const text = def.trim().replace(/\s+/g, ' ');
  if (text === '') fail('the proj4 definition is empty');
  if (text.length > 1000) fail('the proj4 definition is too long (1000 characters at most)');
  if (/^(PROJCS|GEOGCS|PROJCRS|GEOGCRS|COMPD_CS)\[/i.test(text)) fail('WKT is not accepted here; give a proj4 string such as +proj=lcc ...');
  if (!text.startsWith('+')) fail('a proj4 string starts with +proj=...');
  const params = parseTokens(text);
  const projection = params.get('proj');
  if (!projection) fail('+proj=... is missing');
  if (GEOGRAPHIC.has(projection)) fail(`+proj=${projection} is not a projected grid; the project needs grid coordinates (e.g. +proj=lcc, +proj=tmerc, +proj=utm)`);
  for (const [k, v] of params) {
    if (NUMERIC_KEYS.has(k) && (v === '' || !Number.isFinite(Number(v)))) fail(`+${k} must be a number (got "${v}")`);
  }
  const towgs84 = params.get('towgs84');
  if (towgs84 !== undefined) {
    const values = towgs84.split(',');
    if (!(values.length === 3 || values.length === 7) || values.some((x) => x === '' || !Number.isFinite(Number(x)))) {
      fail('+towgs84 needs 3 or 7 comma-separated numbers');
    }
  }
  const ellps = params.get('ellps');
  if (ellps !== undefined && !ELLIPSOIDS.has(ellps)) fail(`unknown ellipsoid +ellps=${ellps}`);
  const datum = params.get('datum');
  if (datum !== undefined && !DATUMS.has(datum)) fail(`unknown datum +datum=${datum}`);
  if (ellps === undefined && datum === undefined && !params.has('a') && !params.has('R')) {
    fail('say which ellipsoid: +ellps=..., +datum=... or +a=...');
  }
  if (projection === 'utm') {
    const zone = Number(params.get('zone'));
    if (!Number.isInteger(zone) || zone < 1 || zone > 60) fail('+zone must be a whole number from 1 to 60 for UTM');
  }
  const unitsParam = params.get('units');
  let unit: LinearUnit;
  if (unitsParam !== undefined) {
    const u = UNIT_OF[unitsParam];
    if (!u) fail(`+units=${unitsParam} is not supported; use m, ft (international foot) or us-ft (US survey foot)`);
    unit = u;
  } else if (params.has('to_meter')) {
    const f = Number(params.get('to_meter'));
    const match = (['m', 'ft', 'usft'] as const).find((u) => Math.abs(convertLength(1, u, 'm') - f) < 1e-12);
    if (!match) fail(`+to_meter=${f} is not metres, international feet or US survey feet`);
    unit = match;
  } else {
    unit = 'm';
  }
  const warnings: string[] = [];
  if ((datum === 'NAD27' || datum === 'nad27' || params.has('nadgrids')) && towgs84 === undefined) {
    warnings.push('this datum needs grid shift files that are not loaded: map positions may be off by tens of metres; add +towgs84=... for the map');
  }
  let converter: proj4.Converter;
  try {
    converter = proj4(geographicBaseOf(text), text);
  } catch (e) {
    fail(`proj4 cannot use this definition: ${e instanceof Error ? e.message : String(e)}`);
  }
  const lon0 = projection === 'utm' ? -183 + 6 * Number(params.get('zone')) : Number(params.get('lon_0') ?? 0);
  const lat0 = projection === 'utm' ? (params.has('south') ? -10 : 10) : Number(params.get('lat_0') ?? 0);
  const probe: [number, number] = [lon0 + 0.01, lat0 + 0.01];
  let back: number[];
  try {
    const grid = converter.forward([...probe]);
    back = converter.inverse([...grid]);
    if (!grid.every(Number.isFinite)) throw new Error('non-finite grid coordinates');
  } catch (e) {
    fail(`proj4 cannot compute with this definition near its origin: ${e instanceof Error ? e.message : String(e)}`);
  }
  if (!(Math.abs(back[0]! - probe[0]) < 1e-7 && Math.abs(back[1]! - probe[1]) < 1e-7)) {
    fail('the definition does not convert back to the same longitude/latitude near its origin');
  }
  return { proj4: text, projection, unit, warnings };
}

// ---------------------------------------------------------------------------------------------
// Conversions

/** A CRS given as a catalogue code (`EPSG:2278`), a proj4 string (`+proj=...`) or a definition. */
export type CrsInput = string | CrsDefinition;

const customCache = new Map<string, CrsDefinition>();

/** Resolve a CRS input to a definition; proj4 strings are validated once and cached. */
export function resolveCrs(crs: CrsInput): CrsDefinition {
  if (typeof crs !== 'string') return crs;
  const text = crs.trim();
  if (!text.startsWith('+')) return getCrs(text);
  let c = customCache.get(text);
  if (!c) {
    const v = validateProj4(text);
    c = { code: 'CUSTOM', name: 'Custom definition', proj4: v.proj4, unit: v.unit, area: null };
    customCache.set(text, c);
  }
  return c;
}

/**
 * The project's CRS from its stored code and definition: the catalogue entry (with its area of
 * use) when the code is known and the definition is the catalogue's, else the custom definition.
 */
export function projectCrs(code: string, proj4Def: string): CrsDefinition {
  const known = findCrs(code);
  if (known && known.proj4 === proj4Def.trim().replace(/\s+/g, ' ')) return known;
  const custom = resolveCrs(proj4Def);
  return { ...custom, code: code || 'CUSTOM' };
}

const converters = new Map<string, proj4.Converter>();

/** A proj4 converter between two definitions, built once per pair and reused. */
export function getConverter(fromDef: string, toDef: string): proj4.Converter {
  const key = `${fromDef}\u0000${toDef}`;
  let c = converters.get(key);
  if (!c) {
    try {
      c = proj4(fromDef, toDef);
    } catch (e) {
      throw new GeometryError('INVALID_PROJ4', `proj4 cannot use this definition: ${e instanceof Error ? e.message : String(e)}`);
    }
    converters.set(key, c);
  }
  return c;
}

/** Options of grid ↔ longitude/latitude conversions. */
export interface ConvertOptions {
  /** The unit the grid coordinates are given or wanted in (default: the CRS's own unit). */
  unit?: LinearUnit;
  /** Refuse points outside the CRS's area of use (default true; no check for custom CRSs). */
  checkArea?: boolean;
  /**
   * Datum of the longitude/latitude: 'wgs84' (map, GPS; default) or 'crs' (the CRS's own
   * geodetic datum, no datum shift, as in the IOGP worked examples).
   */
  datum?: 'wgs84' | 'crs';
}

/** True when the lon/lat lies inside the CRS's area of use (always true when the area is unknown). */
export function isInsideArea(crs: CrsInput, lon: number, lat: number): boolean {
  const c = resolveCrs(crs);
  if (!c.area) return true;
  const [w, s, e, n] = c.area;
  return lon >= w && lon <= e && lat >= s && lat <= n;
}

function checkArea(c: CrsDefinition, lon: number, lat: number): void {
  if (!isInsideArea(c, lon, lat)) {
    const [w, s, e, n] = c.area!;
    throw new GeometryError(
      'OUTSIDE_AREA_OF_USE',
      `the point at longitude ${lon.toFixed(5)}, latitude ${lat.toFixed(5)} is outside the area of use of ${c.code} ` +
        `(${c.name}: longitude ${w} to ${e}, latitude ${s} to ${n}); check the coordinates and the project's CRS`,
      { code: c.code, lon, lat },
    );
  }
}

function lonLatDef(c: CrsDefinition, datum: 'wgs84' | 'crs' | undefined): string {
  return datum === 'crs' ? geographicBaseOf(c.proj4) : WGS84_LONLAT;
}

/** Grid easting/northing → [longitude, latitude] in degrees (WGS 84 unless datum 'crs'). */
export function gridToLonLat(crs: CrsInput, point: XY, options: ConvertOptions = {}): [number, number] {
  const c = resolveCrs(crs);
  if (!Number.isFinite(point[0]) || !Number.isFinite(point[1])) {
    throw new GeometryError('INVALID_NUMBER', 'easting and northing must be finite numbers');
  }
  const from = options.unit ?? c.unit;
  const e = convertLength(point[0], from, c.unit);
  const n = convertLength(point[1], from, c.unit);
  const out = getConverter(c.proj4, lonLatDef(c, options.datum)).forward([e, n]);
  const lon = out[0]!;
  const lat = out[1]!;
  if (!Number.isFinite(lon) || !Number.isFinite(lat)) {
    throw new GeometryError('OUTSIDE_AREA_OF_USE', `grid point ${point[0]}, ${point[1]} has no longitude/latitude in ${c.code}`);
  }
  if (options.checkArea !== false) checkArea(c, lon, lat);
  return [lon, lat];
}

/** [longitude, latitude] in degrees (WGS 84 unless datum 'crs') → grid [easting, northing]. */
export function lonLatToGrid(crs: CrsInput, lonLat: XY, options: ConvertOptions = {}): [number, number] {
  const c = resolveCrs(crs);
  const [lon, lat] = lonLat;
  if (!Number.isFinite(lon) || !Number.isFinite(lat) || Math.abs(lat) > 90 || Math.abs(lon) > 540) {
    throw new GeometryError('INVALID_NUMBER', 'longitude and latitude must be finite degrees (latitude within ±90)');
  }
  if (options.checkArea !== false) checkArea(c, lon, lat);
  const out = getConverter(lonLatDef(c, options.datum), c.proj4).forward([lon, lat]);
  const to = options.unit ?? c.unit;
  const e = out[0]!;
  const n = out[1]!;
  if (!Number.isFinite(e) || !Number.isFinite(n)) {
    throw new GeometryError('OUTSIDE_AREA_OF_USE', `longitude ${lon}, latitude ${lat} cannot be projected to ${c.code}`);
  }
  return [convertLength(e, c.unit, to), convertLength(n, c.unit, to)];
}
