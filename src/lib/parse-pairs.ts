/**
 * Reads a pasted list of value pairs, one pair a line, as copied from a spreadsheet (tab between
 * the cells) or a CAD / survey list ("A, B", "A,B", "A B" or "A; B"): grid E/N vertices of an
 * alignment, a plan path or a pit footprint, or station–elevation points of a profile. Blank lines
 * are skipped; a first line with no digit at all (a header such as "Easting, Northing") is skipped.
 * Every other line must hold exactly two values; a bad line is reported by its line number
 * (counting from 1, blank lines included) and nothing is taken from it. Numbers use a point for
 * decimals; thousands separators and units are refused rather than misread.
 */

/** A plain decimal number: optional sign, digits with an optional decimal point, optional exponent. */
const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i;

/** A typed plain number, or NaN when the text is not one (see NUMBER). */
export function plainNumber(text: string): number {
  const t = text.trim();
  return NUMBER.test(t) ? Number(t) : Number.NaN;
}

export interface PairParseOptions {
  /** What the two values are, for the messages: ['easting', 'northing'] (the default) or ['station', 'elevation']. */
  names?: readonly [string, string];
  /**
   * Reads the first value (a station in the project's style, say); throws an Error whose message
   * says what is wrong. By default the first value is a plain number like the second.
   */
  parseFirst?: (text: string) => number;
}

export interface PairParse {
  /** Each pair read, as numbers. */
  pairs: [number, number][];
  /** Each pair read, as the text of its two cells (for forms that keep what was typed). */
  cells: [string, string][];
  /** Lines not read, by line number (1-based), with the reason. */
  errors: { line: number; message: string }[];
}

export function parsePairs(text: string, options: PairParseOptions = {}): PairParse {
  const [firstName, secondName] = options.names ?? ['easting', 'northing'];
  const pairs: [number, number][] = [];
  const cells: [string, string][] = [];
  const errors: PairParse['errors'] = [];
  text.split(/\r\n|\r|\n/).forEach((raw, index) => {
    const line = index + 1;
    const trimmed = raw.trim();
    if (trimmed === '') return;
    // A header row before anything was read is not a problem.
    if (pairs.length === 0 && errors.length === 0 && !/\d/.test(trimmed)) return;
    // One comma or semicolon, or a run of spaces and tabs, separates the cells.
    const parts = trimmed.split(/\s*[,;]\s*|\s+/);
    if (parts.length !== 2) {
      errors.push({ line, message: `expected two values (${firstName}, ${secondName}), found ${parts.length} value${parts.length === 1 ? '' : 's'}: “${trimmed}”` });
      return;
    }
    const [a, b] = parts as [string, string];
    let first: number;
    if (options.parseFirst) {
      try {
        first = options.parseFirst(a);
      } catch (e) {
        errors.push({ line, message: `“${a === '' ? '(empty)' : a}” is not a ${firstName}${e instanceof Error ? `: ${e.message}` : ''}` });
        return;
      }
    } else {
      first = plainNumber(a);
      if (Number.isNaN(first)) {
        errors.push({ line, message: `“${a === '' ? '(empty)' : a}” is not a number` });
        return;
      }
    }
    const second = plainNumber(b);
    if (Number.isNaN(second)) {
      errors.push({ line, message: `“${b === '' ? '(empty)' : b}” is not a number` });
      return;
    }
    pairs.push([first, second]);
    cells.push([a, b]);
  });
  return { pairs, cells, errors };
}
