import { describe, expect, it } from 'vitest';
import { parseVertices } from '@/features/lines/utils/parse-vertices';

// The inputs are what a spreadsheet puts on the clipboard (cells joined by a tab, rows by a line
// break — common practice of spreadsheet programs) and a CAD coordinate list ("E,N" or "E N").
describe('parseVertices', () => {
  it('reads "E, N", "E,N", "E N" and tab-separated rows, easting first', () => {
    const text = '2432500.25, 13653500.5\n2432600,13653520\n2432700 13653540.75\n2432800\t13653560\n';
    expect(parseVertices(text)).toEqual({
      points: [
        [2432500.25, 13653500.5],
        [2432600, 13653520],
        [2432700, 13653540.75],
        [2432800, 13653560],
      ],
      errors: [],
    });
  });

  it('skips blank and whitespace-only lines, trims each line and accepts Windows line ends', () => {
    const text = '\r\n  100.5 ,  200 \r\n\t\r\n\r\n300\t\t400\r\n';
    expect(parseVertices(text)).toEqual({ points: [[100.5, 200], [300, 400]], errors: [] });
  });

  it('accepts signs, a leading decimal point, a semicolon and an exponent', () => {
    expect(parseVertices('-12.5; +.75\n1e3 2.5E-1').points).toEqual([
      [-12.5, 0.75],
      [1000, 0.25],
    ]);
  });

  it('reports a bad line by its line number (blank lines counted) and keeps the good ones', () => {
    const text = '100, 200\n\n300, north\n400 500 600\n700\n800, 900';
    const result = parseVertices(text);
    expect(result.points).toEqual([
      [100, 200],
      [800, 900],
    ]);
    expect(result.errors.map((e) => e.line)).toEqual([3, 4, 5]);
    expect(result.errors[0]!.message).toContain('“north” is not a number');
    expect(result.errors[1]!.message).toContain('found 3 values');
    expect(result.errors[2]!.message).toContain('found 1 value:');
  });

  it('refuses numbers written with thousands separators or units rather than misreading them', () => {
    // "2,432,500" would otherwise split into three cells; "12ft" is not a plain number.
    expect(parseVertices('2,432,500, 13,653,500').errors).toHaveLength(1);
    expect(parseVertices('12ft, 30').errors[0]).toEqual({ line: 1, message: '“12ft” is not a number' });
  });

  it('gives nothing for empty text', () => {
    expect(parseVertices('')).toEqual({ points: [], errors: [] });
  });
});
