import Papa from 'papaparse';
import type { CsvIdStyle } from '@shared/schemas/export';

/**
 * CSV files that survive both programs and spreadsheets (RFC 4180 through papaparse):
 *
 * - a UTF-8 byte-order mark, so spreadsheets read accents and dashes right;
 * - the header block first, one `# Label: value` line each (no commas or quotes in it, so a
 *   spreadsheet shows each line in one cell of column A and a CSV reader told to skip `#`
 *   comment lines, e.g. papaparse `comments: '#'`, never sees it);
 * - then the column row and the rows, CRLF line ends, every text field quoted;
 * - identifiers always as text; with `ids=spreadsheet` they are written `="007"`, which a
 *   spreadsheet opening the file directly shows as the text 007 rather than the number 7
 *   (common practice; programs then read the formula text, so `plain` is the default);
 * - text people typed (owners, notes, labels) that starts with `=`, `+`, `-`, `@`, a tab or a
 *   carriage return gets a leading `'`, so a spreadsheet never runs it as a formula (the OWASP
 *   advice on CSV injection).
 */

export interface CsvColumn<T> {
  header: string;
  /** Text columns are quoted; numbers are written bare. */
  text: boolean;
  /** An identifier (written `="…"` in the spreadsheet style). */
  id?: boolean;
  /** Text people typed: guarded against formula injection. */
  user?: boolean;
  value: (row: T) => string | number | null;
}

/** A header value made safe for a `#` line: commas and quotes would split or quote the cell. */
export function commentSafe(text: string): string {
  return text.replace(/[\r\n]+/g, ' ').replace(/,/g, ';').replace(/"/g, "'");
}

export function csvDocument<T>(header: [string, string][], columns: CsvColumn<T>[], rows: T[], ids: CsvIdStyle = 'plain'): string {
  const comments = header.map(([label, value]) => `# ${commentSafe(label)}: ${commentSafe(value)}`);
  const data = rows.map((row) =>
    columns.map((c) => {
      const v = c.value(row);
      if (v === null || v === undefined) return '';
      if (c.id && ids === 'spreadsheet' && v !== '') return `="${String(v).replace(/"/g, '""')}"`;
      if (c.user && typeof v === 'string' && /^[=+\-@\t\r]/.test(v)) return `'${v}`;
      return v;
    }),
  );
  const body = Papa.unparse(
    { fields: columns.map((c) => c.header), data },
    { quotes: columns.map((c) => c.text), quoteChar: '"', escapeChar: '"', newline: '\r\n', header: true, escapeFormulae: false },
  );
  return `\ufeff${comments.join('\r\n')}\r\n${body}\r\n`;
}
