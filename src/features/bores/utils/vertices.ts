/**
 * Grid vertices as typed or pasted: one "E, N" or "E N" pair a line, as people copy them from a
 * spreadsheet (tab between columns) or a CAD point list. Numbers use a point for decimals.
 */

/** One vertex row of the form, as typed. */
export interface VertexRow {
  e: string;
  n: string;
}

export interface PastedVertices {
  rows: VertexRow[];
  /** Lines that are not two numbers, with their line number (1-based). */
  problems: { line: number; text: string }[];
}

const NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;

/**
 * Parse pasted text: each non-empty line must hold exactly two numbers separated by a comma,
 * semicolon, tab or spaces. A first line that is a header ("Easting, Northing") is skipped.
 */
export function parseVertexText(text: string): PastedVertices {
  const rows: VertexRow[] = [];
  const problems: PastedVertices['problems'] = [];
  const lines = text.split(/\r\n|\r|\n/);
  lines.forEach((raw, index) => {
    const line = raw.trim();
    if (line === '') return;
    const parts = line.split(/\s*[,;\t]\s*|\s+/).filter((p) => p !== '');
    if (parts.length === 2 && parts.every((p) => NUMBER.test(p))) {
      rows.push({ e: parts[0]!, n: parts[1]! });
      return;
    }
    // A header row before any number is not a problem.
    if (rows.length === 0 && problems.length === 0 && !/\d/.test(line)) return;
    problems.push({ line: index + 1, text: line });
  });
  return { rows, problems };
}

/** A typed number: empty → undefined (the schema says "is required"), unreadable → NaN (it says "must be a number"). */
export function numberOf(text: string): number | undefined {
  const t = text.trim();
  if (t === '') return undefined;
  return NUMBER.test(t) ? Number(t) : Number.NaN;
}

/** The form's rows as grid points for the schema (row i is point i, so a problem names its row). */
export function rowsToPoints(rows: VertexRow[]): [number | undefined, number | undefined][] {
  return rows.map((r) => [numberOf(r.e), numberOf(r.n)]);
}

/** Grid points as form rows. */
export function pointsToRows(points: readonly (readonly [number, number])[]): VertexRow[] {
  return points.map(([e, n]) => ({ e: String(e), n: String(n) }));
}
