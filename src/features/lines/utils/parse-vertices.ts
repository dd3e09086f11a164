/**
 * Reads a pasted list of plan vertices, one "E, N" per line, as copied from a spreadsheet (tab
 * between the cells) or a CAD coordinate list ("E N" or "E,N"). Blank lines are skipped. Each
 * line must hold exactly two numbers, easting first; any other line is reported by its line
 * number (counting from 1, blank lines included) and no vertex is taken from it.
 */
export interface VertexParse {
  points: [number, number][];
  errors: { line: number; message: string }[];
}

/** A plain decimal number: optional sign, digits with an optional decimal point, optional exponent. */
const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i;

export function parseVertices(text: string): VertexParse {
  const points: [number, number][] = [];
  const errors: { line: number; message: string }[] = [];
  text.split(/\r\n|\r|\n/).forEach((raw, index) => {
    const line = index + 1;
    const trimmed = raw.trim();
    if (trimmed === '') return;
    // One comma or semicolon, or a run of spaces and tabs, separates the cells.
    const cells = trimmed.split(/\s*[,;]\s*|\s+/);
    if (cells.length !== 2) {
      errors.push({ line, message: `expected two numbers (easting, northing), found ${cells.length} value${cells.length === 1 ? '' : 's'}: “${trimmed}”` });
      return;
    }
    const bad = cells.find((c) => !NUMBER.test(c));
    if (bad !== undefined) {
      errors.push({ line, message: `“${bad === '' ? '(empty)' : bad}” is not a number` });
      return;
    }
    points.push([Number(cells[0]), Number(cells[1])]);
  });
  return { points, errors };
}
