import { describe, it, expect } from 'vitest';
import {
  CRS_CATALOGUE, GeometryError, getConverter, geodesicDistance, gridToLonLat, lonLatToGrid, resolveCrs, validateProj4,
  WGS84_LONLAT, getCrs, isInsideArea, projectCrs,
} from '../../shared/geometry';
import { METRES_PER_UNIT, convertLength } from '../../shared/units';

const USFT = 1200 / 3937;

describe('proj4 against the IOGP Guidance Note 7-2 worked examples', () => {
  it('when projecting the LCC 2SP example (EPSG:32040) then E 2,963,503.91 and N 254,759.80 US ft within 0.02 m', () => {
    // Source: IOGP Guidance Note 7-2 (EPSG), Lambert Conic Conformal (2SP) example, as quoted in
    // REFERENCES.md: NAD27 / Texas South Central, lat 28°30'00"N, lon 96°00'00"W.
    // The example is on the CRS's own datum (NAD27), hence datum: 'crs' (no datum shift).
    const [e, n] = lonLatToGrid('EPSG:32040', [-96, 28.5], { datum: 'crs' });
    const tolUsFt = 0.02 / USFT; // 0.02 m in US survey feet ≈ 0.0656
    expect(Math.abs(e - 2963503.91)).toBeLessThan(tolUsFt);
    expect(Math.abs(n - 254759.8)).toBeLessThan(tolUsFt);
  });

  it('when inverting the LCC example then the point returns to 28°30\'N 96°W', () => {
    // Source: IOGP GN 7-2 LCC 2SP example, reverse direction (same figures). 1e-7° ≈ 1 cm.
    const [lon, lat] = gridToLonLat('EPSG:32040', [2963503.91, 254759.8], { datum: 'crs' });
    expect(lon).toBeCloseTo(-96, 7);
    expect(lat).toBeCloseTo(28.5, 7);
  });

  it('when projecting the TM example (EPSG:27700) then E 577,274.99 m and N 69,740.50 m within 0.02 m', () => {
    // Source: IOGP GN 7-2, Transverse Mercator example, OSGB 1936 / British National Grid,
    // lat 50°30'00"N, lon 0°30'00"E (REFERENCES.md: use 0.02 m, the series form gives .984/.492).
    const [e, n] = lonLatToGrid('EPSG:27700', [0.5, 50.5], { datum: 'crs' });
    expect(Math.abs(e - 577274.99)).toBeLessThan(0.02);
    expect(Math.abs(n - 69740.5)).toBeLessThan(0.02);
  });
});

describe('CRS catalogue', () => {
  it('when listing then it holds 2278, 32040, 27700, NAD83 UTM 1–23 N and WGS 84 UTM 1–60 N and S', () => {
    // Codes: EPSG registry numbering (269zz NAD83 UTM zones 1–23, 326zz/327zz WGS 84 UTM), from memory.
    expect(CRS_CATALOGUE.size).toBe(3 + 23 + 60 + 60);
    for (const code of ['EPSG:2278', 'EPSG:32040', 'EPSG:27700', 'EPSG:26901', 'EPSG:26923', 'EPSG:32601', 'EPSG:32660', 'EPSG:32701', 'EPSG:32760']) {
      expect(CRS_CATALOGUE.has(code)).toBe(true);
    }
    expect(CRS_CATALOGUE.has('EPSG:26924')).toBe(false);
    expect(getCrs('EPSG:2278').unit).toBe('usft');
    expect(getCrs('epsg:27700').unit).toBe('m');
  });

  it('when asking for an unknown code then UNKNOWN_CRS', () => {
    expect(() => getCrs('EPSG:9999999')).toThrowError(expect.objectContaining({ code: 'UNKNOWN_CRS' }));
  });

  it('when projecting the EPSG:2278 natural origin then the false origin in US survey feet', () => {
    // Source: EPSG:2278 parameters (from memory): latitude of false origin 27°50'N, longitude
    // 99°W, false easting 1,968,500 ftUS (600 km), false northing 13,123,333.333 ftUS (4,000 km).
    // proj4 returns the CRS's own unit (US survey feet).
    const [e, n] = lonLatToGrid('EPSG:2278', [-99, 27 + 50 / 60], { datum: 'crs' });
    expect(e).toBeCloseTo(1968500, 3);
    expect(n).toBeCloseTo(13123333.333, 2);
    // Same point asked for in metres: 600 km / 4,000 km.
    const [em, nm] = lonLatToGrid('EPSG:2278', [-99, 27 + 50 / 60], { datum: 'crs', unit: 'm' });
    expect(em).toBeCloseTo(600000, 4);
    expect(nm).toBeCloseTo(4000000, 3);
  });

  it('when measuring a short line on EPSG:2278 then grid = ellipsoid distance × the LCC scale factor', () => {
    // Source: Snyder, Map Projections — A Working Manual (USGS Professional Paper 1395), Lambert
    // Conformal Conic, ellipsoid, eqs. (14-15), (15-9), (15-10), (15-3), (15-4): scale factor
    // k = ρ·n / (a·m) (formulas from memory). GRS80: a = 6,378,137 m, 1/f = 298.257222101.
    // Reference distance: geographiclib-geodesic (WGS 84; NAD83 ≈ WGS 84 for this purpose).
    const a = 6378137;
    const f = 1 / 298.257222101;
    const e = Math.sqrt(2 * f - f * f);
    const rad = Math.PI / 180;
    const m = (phi: number) => Math.cos(phi) / Math.sqrt(1 - e * e * Math.sin(phi) ** 2);
    const t = (phi: number) => Math.tan(Math.PI / 4 - phi / 2) / ((1 - e * Math.sin(phi)) / (1 + e * Math.sin(phi))) ** (e / 2);
    const p1 = (30 + 17 / 60) * rad; // standard parallels of Texas South Central (EPSG:2278)
    const p2 = (28 + 23 / 60) * rad;
    const n = (Math.log(m(p1)) - Math.log(m(p2))) / (Math.log(t(p1)) - Math.log(t(p2)));
    const F = m(p1) / (n * t(p1) ** n);
    const k = (phi: number) => (a * F * t(phi) ** n * n) / (a * m(phi));
    for (const [lon, lat] of [[-99.5, 28.0], [-96.0, 29.5], [-94.0, 30.4]] as const) {
      const A: [number, number] = [lon, lat];
      const B: [number, number] = [lon + 0.0007, lat + 0.0005]; // about 90 m
      const ga = lonLatToGrid('EPSG:2278', A);
      const gb = lonLatToGrid('EPSG:2278', B);
      const gridMetres = convertLength(Math.hypot(gb[0] - ga[0], gb[1] - ga[1]), 'usft', 'm');
      const kMid = k((lat + 0.00025) * rad);
      expect(Math.abs(gridMetres / geodesicDistance(A, B) - kMid)).toBeLessThan(2e-7);
    }
    // On a standard parallel the scale is exact (k = 1).
    expect(k(p1)).toBeCloseTo(1, 12);
  });

  it('when projecting a point on a UTM central meridian then E is 500,000 m and the southern zone adds 10,000 km', () => {
    // Source: UTM definition (false easting 500 km on the central meridian; southern zones use a
    // false northing of 10,000 km) — common practice, from memory.
    const [e, n] = lonLatToGrid('EPSG:32614', [-99, 10]);
    expect(e).toBeCloseTo(500000, 6);
    const [es, ns] = lonLatToGrid('EPSG:32714', [-99, -10]);
    expect(es).toBeCloseTo(500000, 6);
    expect(ns).toBeCloseTo(10000000 - n, 6);
  });

  it('when a point lies outside the area of use then OUTSIDE_AREA_OF_USE, both ways', () => {
    // London is not in Texas: EPSG:2278 area of use (approximate, from memory).
    expect(() => lonLatToGrid('EPSG:2278', [-0.12, 51.5])).toThrowError(GeometryError);
    try {
      lonLatToGrid('EPSG:2278', [-0.12, 51.5]);
    } catch (e) {
      expect((e as GeometryError).code).toBe('OUTSIDE_AREA_OF_USE');
      expect((e as GeometryError).message).toMatch(/outside the area of use of EPSG:2278/);
    }
    expect(() => gridToLonLat('EPSG:27700', [-3e6, 0])).toThrowError(expect.objectContaining({ code: 'OUTSIDE_AREA_OF_USE' }));
    expect(isInsideArea('EPSG:27700', 0.5, 50.5)).toBe(true);
    // A check can be switched off for map panning.
    expect(() => lonLatToGrid('EPSG:2278', [-0.12, 51.5], { checkArea: false })).not.toThrow();
  });

  it('when converting grid → lon/lat → grid then the point comes back (converter reused)', () => {
    const p: [number, number] = [3100000, 13800000];
    const ll = gridToLonLat('EPSG:2278', p);
    const back = lonLatToGrid('EPSG:2278', ll);
    expect(back[0]).toBeCloseTo(p[0], 5);
    expect(back[1]).toBeCloseTo(p[1], 5);
    const def = getCrs('EPSG:2278').proj4;
    expect(getConverter(def, WGS84_LONLAT)).toBe(getConverter(def, WGS84_LONLAT));
  });

  it('when a project stores a catalogue code with its definition then the catalogue entry (with area) is used', () => {
    const c = getCrs('EPSG:27700');
    expect(projectCrs('EPSG:27700', c.proj4).area).not.toBeNull();
    const custom = projectCrs('CUSTOM', '+proj=tmerc +lat_0=0 +lon_0=-99 +k=0.9999 +x_0=500000 +y_0=0 +ellps=GRS80 +units=m +no_defs');
    expect(custom.area).toBeNull();
    expect(custom.unit).toBe('m');
  });
});

describe('validateProj4', () => {
  it('when the definition is a proper grid then its unit is reported', () => {
    expect(validateProj4(getCrs('EPSG:2278').proj4).unit).toBe('usft');
    expect(validateProj4('+proj=utm +zone=14 +datum=WGS84 +units=m').unit).toBe('m');
    expect(validateProj4('+proj=tmerc +lat_0=0 +lon_0=-99 +k=0.9999 +x_0=0 +y_0=0 +ellps=GRS80 +to_meter=0.3048').unit).toBe('ft');
    expect(resolveCrs('+proj=utm +zone=14 +datum=WGS84 +units=m').code).toBe('CUSTOM');
  });

  it('when NAD27 is given without a shift then a warning about grid files', () => {
    const v = validateProj4('+proj=lcc +lat_0=27.8333333333333 +lon_0=-99 +lat_1=28.3833333333333 +lat_2=30.2833333333333 +x_0=609601.2192024384 +y_0=0 +datum=NAD27 +units=us-ft +no_defs');
    expect(v.warnings.join(' ')).toMatch(/grid shift/);
  });

  const bad: [string, RegExp][] = [
    ['', /empty/],
    ['garbage', /starts with \+proj/],
    ['PROJCS["x",GEOGCS["y"]]', /WKT/],
    ['+proj=foo +ellps=GRS80', /proj4 cannot use/],
    ['+proj=longlat +datum=WGS84', /not a projected grid/],
    ['+proj=utm +zone=99 +ellps=GRS80', /zone/],
    ['+proj=lcc +lat_1=abc +ellps=GRS80', /lat_1 must be a number/],
    ['+proj=tmerc +units=furlong +ellps=GRS80', /furlong is not supported/],
    ['+proj=utm +zone=14 +ellps=foo', /unknown ellipsoid/],
    ['+proj=utm +zone=14', /which ellipsoid/],
    ['+proj=utm +zone=14 +ellps=GRS80 +towgs84=1,2', /towgs84/],
    ['+proj=utm zone=14', /not a proj4 parameter/],
  ];
  for (const [def, message] of bad) {
    it(`when given ${JSON.stringify(def)} then INVALID_PROJ4 saying ${message}`, () => {
      let err: unknown;
      try {
        validateProj4(def);
      } catch (e) {
        err = e;
      }
      expect(err).toBeInstanceOf(GeometryError);
      expect((err as GeometryError).code).toBe('INVALID_PROJ4');
      expect((err as GeometryError).message).toMatch(message);
    });
  }
});

describe('units', () => {
  it('when comparing the US survey foot and the international foot then 5,280 ft differ by about 0.0106 ft', () => {
    // Source: US Federal Register notice on the foot (NIST/NGS, 2020): US survey foot =
    // 1200/3937 m = 0.3048006096012192 m; international foot = 0.3048 m (REFERENCES.md).
    expect(METRES_PER_UNIT.usft).toBeCloseTo(0.3048006096012192, 16);
    expect(METRES_PER_UNIT.ft).toBe(0.3048);
    const diff = convertLength(5280, 'usft', 'ft') - 5280;
    expect(diff).toBeGreaterThan(0.0105);
    expect(diff).toBeLessThan(0.0107);
  });
});
