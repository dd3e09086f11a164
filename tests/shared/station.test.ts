import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import {
  GeometryError, alignmentLength, formatOffset, formatStation, parseStation, pointAtStationOffset, prepareAlignment, stationOffset,
} from '../../shared/geometry';

describe('parseStation', () => {
  // Source for the forms: REFERENCES.md, Stationing — one station = 100 ft, `12+34.56` = 1,234.56;
  // metric `1+234.567` = 1,234.567 (surveying practice texts, confirmed).
  const good: [string, '100' | '1000', number][] = [
    ['12+34.56', '100', 1234.56],
    ['1+234.567', '1000', 1234.567],
    ['-0+50.00', '100', -50],
    ['-1+23.45', '100', -123.45],
    ['\u22121+23.45', '100', -123.45],
    ['1234.5', '100', 1234.5],
    ['1234.5', '1000', 1234.5],
    ['12+34.5', '100', 1234.5],
    ['12+34', '100', 1234],
    [' 12 + 34.56 ', '100', 1234.56],
    ['- 0+05', '100', -5],
    ['0+00', '100', 0],
    ['-0+00.00', '100', 0],
    ['125+00.00', '100', 12500],
    ['0+000.5', '1000', 0.5],
  ];
  for (const [text, style, value] of good) {
    it(`when reading ${JSON.stringify(text)} (${style}-unit) then ${value}`, () => {
      expect(parseStation(text, style)).toBeCloseTo(value, 9);
    });
  }

  const badInput: [string, '100' | '1000', RegExp][] = [
    ['12+345.6', '100', /must be below 100/],
    ['1+23.45', '1000', /3 digits after \+/],
    ['12+4.5', '100', /2 digits after \+ \(e\.g\. 12\+04\.5\)/],
    // A leading zero too many: the example drops it rather than echoing the input back.
    ['0+0501', '1000', /3 digits after \+ \(e\.g\. 0\+501\)/],
    ['', '100', /required/],
    ['abc', '100', /not a station/],
    ['12+', '100', /not a station/],
    ['+', '100', /not a station/],
    ['12++34', '100', /not a station/],
    ['12+34.5.6', '100', /not a station/],
    ['1+2+3', '100', /not a station/],
    ['12 34', '100', /unexpected space/],
    ['12+34,56', '100', /point for decimals/],
    ['NaN', '100', /not a station/],
    ['Infinity', '100', /not a station/],
    ['1e3', '100', /not a station/],
  ];
  for (const [text, style, message] of badInput) {
    it(`when reading ${JSON.stringify(text)} (${style}-unit) then INVALID_STATION ${message}`, () => {
      let err: unknown;
      try {
        parseStation(text, style);
      } catch (e) {
        err = e;
      }
      expect(err).toBeInstanceOf(GeometryError);
      expect((err as GeometryError).code).toBe('INVALID_STATION');
      expect((err as GeometryError).message).toMatch(message);
    });
  }
});

describe('formatStation', () => {
  it('when formatting then the trade forms, negatives and rounding carry', () => {
    // Source: REFERENCES.md Stationing (surveying practice texts).
    expect(formatStation(1234.56, '100')).toBe('12+34.56');
    expect(formatStation(1234.567, '1000')).toBe('1+234.567');
    expect(formatStation(-50, '100')).toBe('-0+50.00');
    expect(formatStation(-123.45, '100')).toBe('-1+23.45');
    expect(formatStation(1299.999, '100')).toBe('13+00.00');
    expect(formatStation(5, '100')).toBe('0+05.00');
    expect(formatStation(5, '1000')).toBe('0+005.000');
    expect(formatStation(-0.001, '100')).toBe('0+00.00');
    expect(formatStation(1234.56, '100', 0)).toBe('12+35');
  });

  it('when formatting then parsing any station then the value comes back (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: -10_000_000, max: 10_000_000 }), fc.constantFrom('100', '1000' as const), (cents, style) => {
        const value = cents / 1000;
        const text = formatStation(value, style as '100' | '1000', 3);
        return Math.abs(parseStation(text, style as '100' | '1000') - value) < 1e-9;
      }),
    );
  });

  it('when formatting an offset then distance and side, never a sign', () => {
    // Source: REFERENCES.md — offsets judged looking up-station, left negative in signed form (common practice).
    expect(formatOffset(12.5)).toBe('12.50 R');
    expect(formatOffset(-3.456)).toBe('3.46 L');
    expect(formatOffset(0)).toBe('0.00');
  });
});

describe('stationOffset (hand-worked)', () => {
  // Straight alignment east from (0,0) to (100,0), begin station 1000.
  const straight: [number, number][] = [[0, 0], [100, 0]];
  // Bent alignment: east 100 then north 100 (a left turn), begin station 0.
  const bent: [number, number][] = [[0, 0], [100, 0], [100, 100]];

  it('when a point is south of an eastbound alignment then it is right of it', () => {
    // Looking up-station (east), south is on the right (REFERENCES.md, common practice).
    // (40, −7): foot (40, 0), chainage 40 → station 1040, offset 7 R.
    const r = stationOffset(straight, 1000, [40, -7]);
    expect(r).toMatchObject({ station: 1040, offset: 7, side: 'R', signedOffset: 7, segmentIndex: 0, beyond: null, distanceBeyond: 0 });
    expect(stationOffset(straight, 1000, [40, 7])).toMatchObject({ station: 1040, offset: 7, side: 'L', signedOffset: -7 });
  });

  it('when the alignment bends then stations run along both legs', () => {
    // (50, −10): first leg, station 50, 10 R.
    expect(stationOffset(bent, 0, [50, -10])).toMatchObject({ station: 50, offset: 10, side: 'R', segmentIndex: 0 });
    // (110, 50): second leg runs north; east of it is right. Station 100 + 50 = 150, 10 R.
    expect(stationOffset(bent, 0, [110, 50])).toMatchObject({ station: 150, offset: 10, side: 'R', segmentIndex: 1 });
    // (95, 10): 10 from the first leg, 5 from the second → second leg, station 110, 5 L (west of northbound).
    expect(stationOffset(bent, 0, [95, 10])).toMatchObject({ station: 110, offset: 5, side: 'L', segmentIndex: 1 });
    // (110, −10): outside the corner; nearest is the vertex (100, 0): station 100, offset √200 R.
    const corner = stationOffset(bent, 0, [110, -10]);
    expect(corner.station).toBeCloseTo(100, 12);
    expect(corner.offset).toBeCloseTo(Math.SQRT2 * 10, 12);
    expect(corner.side).toBe('R');
    expect(alignmentLength(bent)).toBe(200);
  });

  it('when a point is past either end then it projects onto the extended end segment and is flagged', () => {
    // (110, 5): 10 past the end (x = 100), north = left: station 1110, 5 L, beyond end by 10.
    expect(stationOffset(straight, 1000, [110, 5])).toMatchObject({ station: 1110, offset: 5, side: 'L', beyond: 'end', distanceBeyond: 10 });
    // (−20, −3): 20 before the start: station 980, 3 R, beyond start by 20.
    expect(stationOffset(straight, 1000, [-20, -3])).toMatchObject({ station: 980, offset: 3, side: 'R', beyond: 'start', distanceBeyond: 20 });
    // Bent alignment, past the end of the northbound leg: (97, 130) → station 230, 3 L, 30 beyond.
    expect(stationOffset(bent, 0, [97, 130])).toMatchObject({ station: 230, offset: 3, side: 'L', beyond: 'end', distanceBeyond: 30 });
  });

  it('when a station/offset is given then the grid point (inverse)', () => {
    expect(pointAtStationOffset(straight, 1000, 1040, 7, 'R')).toMatchObject({ easting: 40, northing: -7, beyond: null });
    expect(pointAtStationOffset(bent, 0, 150, 10, 'L')).toMatchObject({ easting: 90, northing: 50 });
    expect(pointAtStationOffset(straight, 1000, 1110, 5, 'L')).toMatchObject({ easting: 110, northing: 5, beyond: 'end', distanceBeyond: 10 });
    expect(() => pointAtStationOffset(straight, 1000, 1040, -1, 'R')).toThrowError(expect.objectContaining({ code: 'INVALID_OFFSET' }));
  });

  it('when the alignment has a zero-length segment then it is skipped and the segment index still refers to the input', () => {
    // Vertices 1 and 2 coincide: segment 1 has zero length; (150, 10) lies on input segment 2.
    const dup: [number, number][] = [[0, 0], [100, 0], [100, 0], [200, 0]];
    expect(stationOffset(dup, 0, [150, 10])).toMatchObject({ station: 150, offset: 10, segmentIndex: 2 });
    expect(alignmentLength(dup)).toBe(200);
  });

  it('when the alignment has one distinct vertex then DEGENERATE_ALIGNMENT', () => {
    expect(() => stationOffset([[5, 5]], 0, [0, 0])).toThrowError(expect.objectContaining({ code: 'DEGENERATE_ALIGNMENT' }));
    expect(() => stationOffset([[5, 5], [5, 5]], 0, [0, 0])).toThrowError(expect.objectContaining({ code: 'DEGENERATE_ALIGNMENT' }));
    expect(() => prepareAlignment([[0, 0], [NaN, 1]])).toThrowError(expect.objectContaining({ code: 'INVALID_NUMBER' }));
  });
});

describe('stationOffset properties', () => {
  const coord = fc.double({ min: -1e6, max: 1e6, noNaN: true });

  it('when going station → point → station on a straight alignment then the same station, offset and side (also past the ends)', () => {
    fc.assert(
      fc.property(coord, coord, fc.double({ min: 1, max: 5000, noNaN: true }), fc.double({ min: 0, max: 2 * Math.PI, noNaN: true }),
        fc.double({ min: -2, max: 3, noNaN: true }), fc.double({ min: 0, max: 500, noNaN: true }), fc.constantFrom('L' as const, 'R' as const),
        (x, y, len, angle, f, offset, side) => {
          const align: [number, number][] = [[x, y], [x + len * Math.cos(angle), y + len * Math.sin(angle)]];
          const station = 500 + f * len;
          const p = pointAtStationOffset(align, 500, station, offset, side);
          const back = stationOffset(align, 500, [p.easting, p.northing]);
          const tol = 1e-9 * (Math.abs(x) + Math.abs(y) + len + offset + 1);
          expect(Math.abs(back.station - station)).toBeLessThan(tol * 10);
          expect(Math.abs(back.offset - offset)).toBeLessThan(tol * 10);
          if (offset > tol * 100) expect(back.side).toBe(side);
          if (Math.abs(f) > 1e-6 && Math.abs(f - 1) > 1e-6) expect(back.beyond).toBe(p.beyond);
        }),
    );
  });

  it('when going station → point → station on any polyline (offset 0) then the same station', () => {
    // Polylines monotone in easting cannot cross themselves, so every point on them has one station.
    fc.assert(
      fc.property(
        fc.array(fc.tuple(fc.double({ min: 1, max: 200, noNaN: true }), fc.double({ min: -300, max: 300, noNaN: true })), { minLength: 1, maxLength: 8 }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        (steps, f) => {
          const align: [number, number][] = [[0, 0]];
          for (const [dx, dy] of steps) {
            const last = align[align.length - 1]!;
            align.push([last[0] + dx, last[1] + dy]);
          }
          const station = 20 + f * alignmentLength(align);
          const p = pointAtStationOffset(align, 20, station, 0, 'R');
          const back = stationOffset(align, 20, [p.easting, p.northing]);
          expect(Math.abs(back.station - station)).toBeLessThan(1e-7);
          expect(back.offset).toBeLessThan(1e-7);
        },
      ),
    );
  });
});
