/**
 * The one paste parser of the vertex editor (`src/lib/parse-pairs.ts`), used by the Lines form
 * (plan path), the Bores form (alignment, profile points, ground profile) and the pit form.
 *
 * Outside references: the inputs are what a spreadsheet puts on the clipboard — cells joined by a
 * tab, rows by a line break (the text/tab-separated-values form, IANA media type registration),
 * produced here by papaparse's `unparse` with a tab delimiter — and a CAD coordinate list ("E,N"
 * or "E N", common practice). Stations are read with the shared station parser, whose own tests
 * check it against published station notation.
 */
import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { parseStation } from '@shared/geometry';
import { parsePairs } from '@/lib/parse-pairs';

describe('parsePairs: grid E/N vertices', () => {
  it('reads "E, N", "E,N", "E N" and tab-separated rows, easting first', () => {
    const text = '2432500.25, 13653500.5\n2432600,13653520\n2432700 13653540.75\n2432800\t13653560\n';
    expect(parsePairs(text)).toEqual({
      pairs: [
        [2432500.25, 13653500.5],
        [2432600, 13653520],
        [2432700, 13653540.75],
        [2432800, 13653560],
      ],
      cells: [
        ['2432500.25', '13653500.5'],
        ['2432600', '13653520'],
        ['2432700', '13653540.75'],
        ['2432800', '13653560'],
      ],
      errors: [],
    });
  });

  it('reads a tab-separated spreadsheet copy with a header row, keeping the cells as typed', () => {
    const text = Papa.unparse(
      [
        ['Easting', 'Northing'],
        [645794.12, 3243453.24],
        [645816.12, 3243453.24],
      ],
      { delimiter: '\t' },
    );
    expect(parsePairs(text)).toEqual({
      pairs: [
        [645794.12, 3243453.24],
        [645816.12, 3243453.24],
      ],
      cells: [
        ['645794.12', '3243453.24'],
        ['645816.12', '3243453.24'],
      ],
      errors: [],
    });
  });

  it('skips blank and whitespace-only lines, trims each line and accepts Windows line ends', () => {
    const text = '\r\n  100.5 ,  200 \r\n\t\r\n\r\n300\t\t400\r\n';
    expect(parsePairs(text).pairs).toEqual([
      [100.5, 200],
      [300, 400],
    ]);
    expect(parsePairs(text).errors).toEqual([]);
    expect(parsePairs('1000.5, 2000.25\r\n\r\n1003.5   2004.25\n-12 7e2\n').cells).toEqual([
      ['1000.5', '2000.25'],
      ['1003.5', '2004.25'],
      ['-12', '7e2'],
    ]);
  });

  it('accepts signs, a leading decimal point, a semicolon and an exponent', () => {
    expect(parsePairs('-12.5; +.75\n1e3 2.5E-1').pairs).toEqual([
      [-12.5, 0.75],
      [1000, 0.25],
    ]);
  });

  it('reports a bad line by its line number (blank lines counted) and keeps the good ones', () => {
    const text = '100, 200\n\n300, north\n400 500 600\n700\n800, 900';
    const result = parsePairs(text);
    expect(result.pairs).toEqual([
      [100, 200],
      [800, 900],
    ]);
    expect(result.errors.map((e) => e.line)).toEqual([3, 4, 5]);
    expect(result.errors[0]!.message).toContain('“north” is not a number');
    expect(result.errors[1]!.message).toContain('found 3 values');
    expect(result.errors[2]!.message).toContain('found 1 value:');
    expect(parsePairs('1000, 2000\n1003 north\n1, 2, 3\n1,5 2,5').errors.map((e) => e.line)).toEqual([2, 3, 4]);
  });

  it('a line without digits after the first pair is a problem, not a header', () => {
    expect(parsePairs('1, 2\nEasting, Northing').errors.map((e) => e.line)).toEqual([2]);
  });

  it('refuses numbers written with thousands separators or units rather than misreading them', () => {
    // "2,432,500" would otherwise split into three cells; "12ft" is not a plain number.
    expect(parsePairs('2,432,500, 13,653,500').errors).toHaveLength(1);
    expect(parsePairs('12ft, 30').errors[0]).toEqual({ line: 1, message: '“12ft” is not a number' });
  });

  it('gives nothing for empty text', () => {
    expect(parsePairs('')).toEqual({ pairs: [], cells: [], errors: [] });
  });
});

describe('parsePairs: station–elevation profile points', () => {
  const style = '100' as const;
  const options = { names: ['station', 'elevation'] as const, parseFirst: (t: string) => parseStation(t, style) };

  it('reads stations in the project style (100-unit: 12+50 is 1250) with a header line', () => {
    const result = parsePairs('Station, Elevation\n10+00, 412.5\n12+50\t410.25\n15+00.5 411', options);
    expect(result.errors).toEqual([]);
    expect(result.pairs).toEqual([
      [1000, 412.5],
      [1250, 410.25],
      [1500.5, 411],
    ]);
    expect(result.cells[1]).toEqual(['12+50', '410.25']);
  });

  it('names a station the parser refuses, with its reason, and an elevation that is not a number', () => {
    const result = parsePairs('10+00, 412.5\n1+000, 410\n12+00, 4l0', options);
    expect(result.errors.map((e) => e.line)).toEqual([2, 3]);
    expect(result.errors[0]!.message).toMatch(/^“1\+000” is not a station: /);
    expect(result.errors[1]!.message).toBe('“4l0” is not a number');
    expect(parsePairs('10+00', options).errors[0]!.message).toContain('expected two values (station, elevation)');
  });
});
