import ExcelJS from 'exceljs';
import PDFDocument from 'pdfkit';
import type { ConflictRowDto } from '@shared/api';
import { matchesConflictFilter } from '@shared/conflicts';
import { CLEARANCE_STATUS_LABELS, CONFLICT_STATUS_LABELS } from '@shared/domain';
import type { CsvIdStyle } from '@shared/schemas/export';
import type { ConflictRegister } from '../conflicts/conflict-rows';
import { csvDocument, type CsvColumn } from './csv';
import { describeFilter, type ConflictFilterInput, type ExportFrame, type FilterNames } from './export-data';
import {
  checkText,
  decimalsOf,
  DESIGN_AID_CAUTION,
  headerBlock,
  isoDay,
  isoSeconds,
  kindLabel,
  lengthText,
  round4,
  sizeText,
  stationText,
} from './export-header';

/**
 * The conflict list (SPEC §8) as CSV, XLSX and PDF, from the register's rows
 * (`loadConflictRegister`, the one builder of conflict rows). One column list feeds CSV and XLSX
 * so the two never disagree; the PDF prints the same facts grouped into fewer, wrapped columns.
 * The owner mail attaches this same CSV.
 */

/** A register row as the conflict list prints it. */
type Row = ConflictRowDto;


type Cell = string | number | Date | null;

const at = (iso: string | null | undefined): Date | null => (iso ? new Date(iso) : null);

/** The bore, and the pits the line conflicts with: `Bore 1; launch pit (line enters it)`. */
export function conflictWith(r: Row): string {
  return [r.bore.name, ...r.pits.map((p) => `${p.kind} pit${p.enters ? ' (line enters it)' : ' (line near it)'}`)].join('; ');
}

/** The test holes on the line (those verifying the governing point first), each number once. */
const holeNumbers = (r: Row): string => [...new Set(r.holes.map((h) => h.number))].join(', ');

const stationRange = (r: Row, frame: ExportFrame): string =>
  r.stationFrom == null ? '' : r.stationFrom === r.stationTo ? stationText(r.stationFrom, frame) : `${stationText(r.stationFrom, frame)} to ${stationText(r.stationTo, frame)}`;

/** A column of the conflict list: text (kept as text everywhere), number (project unit) or date. */
export interface ConflictColumn {
  key: string;
  header: string;
  type: 'text' | 'number' | 'date' | 'datetime';
  /** Identifiers: kept as text, protected from spreadsheets turning `007` into 7. */
  id?: boolean;
  /** Text people typed (guarded against spreadsheet formulas in CSV). */
  user?: boolean;
  width: number;
  value: (row: Row) => Cell;
}

/** The columns, with units and the vertical datum in the headers. */
export function conflictColumns(frame: ExportFrame): ConflictColumn[] {
  const u = frame.unitSymbol;
  return [
    { key: 'number', header: 'Conflict', type: 'text', id: true, width: 10, value: (r) => r.number },
    { key: 'conflictWith', user: true, header: 'Bore or pit', type: 'text', width: 22, value: conflictWith },
    { key: 'computed', header: 'Last check', type: 'text', width: 18, value: (r) => CLEARANCE_STATUS_LABELS[r.computedStatus] },
    { key: 'stationRange', header: 'Station range', type: 'text', width: 22, value: (r) => stationRange(r, frame) },
    { key: 'station', header: 'Station (governing)', type: 'text', width: 14, value: (r) => stationText(r.station, frame) },
    { key: 'offset', header: `Offset (${u})`, type: 'number', width: 10, value: (r) => round4(r.offset) },
    { key: 'side', header: 'Side', type: 'text', width: 6, value: (r) => (r.offset ? (r.side ?? '') : '') },
    { key: 'line', user: true, header: 'Line', type: 'text', id: true, width: 14, value: (r) => r.line.label },
    { key: 'owner', user: true, header: 'Owner', type: 'text', width: 24, value: (r) => r.line.owner },
    { key: 'contact', user: true, header: 'Owner contact', type: 'text', width: 26, value: (r) => r.line.contactEmail ?? '' },
    { key: 'kind', header: 'Kind', type: 'text', width: 16, value: (r) => kindLabel(r.line) },
    { key: 'size', header: 'Size (outside)', type: 'text', width: 22, value: (r) => sizeText(r.line, frame) },
    { key: 'material', user: true, header: 'Material', type: 'text', width: 12, value: (r) => r.line.material ?? '' },
    { key: 'ql', header: 'Quality level', type: 'text', width: 8, value: (r) => r.line.qualityLevel },
    { key: 'holes', user: true, header: 'Test holes', type: 'text', id: true, width: 18, value: holeNumbers },
    { key: 'lineTop', header: `Top of line (${u} ${frame.verticalDatum})`, type: 'number', width: 14, value: (r) => round4(r.lineTop) },
    { key: 'governing', header: 'Clearance measured', type: 'text', width: 12, value: (r) => r.governing ?? '' },
    { key: 'required', header: `Required clearance (${u})`, type: 'number', width: 12, value: (r) => round4(r.required) },
    { key: 'clearance', header: `Measured clearance (${u})`, type: 'number', width: 12, value: (r) => round4(r.clearance) },
    { key: 'margin', header: `Margin (${u})`, type: 'number', width: 10, value: (r) => round4(r.margin) },
    { key: 'status', header: 'Status', type: 'text', width: 18, value: (r) => CONFLICT_STATUS_LABELS[r.status] },
    { key: 'resolution', user: true, header: 'Resolution', type: 'text', width: 30, value: (r) => r.resolutionNote ?? '' },
    { key: 'responsible', user: true, header: 'Responsible party', type: 'text', width: 20, value: (r) => r.responsibleParty ?? '' },
    { key: 'assignee', user: true, header: 'Assignee', type: 'text', width: 18, value: (r) => r.assigneeName ?? '' },
    { key: 'due', header: 'Due (assignee)', type: 'date', width: 12, value: (r) => at(r.dueDate) },
    { key: 'found', header: 'Found (UTC)', type: 'datetime', width: 18, value: (r) => at(r.createdAt) },
    { key: 'told', header: 'Owner told', type: 'date', width: 12, value: (r) => at(r.ownerNotifiedAt) },
    { key: 'answerDue', header: 'Answer due', type: 'date', width: 12, value: (r) => at(r.answerDueAt) },
    { key: 'closed', header: 'Closed', type: 'date', width: 12, value: (r) => at(r.closedAt) },
    { key: 'notes', user: true, header: 'Notes', type: 'text', width: 30, value: (r) => r.notes ?? '' },
  ];
}

/** Rows line for the header: `3 of 5 conflicts; filter: status = Open`. */
export function rowsLine(shown: number, total: number, filterText: string): [string, string] {
  return ['Rows', `${shown} of ${total} conflicts; filter: ${filterText}`];
}

/** A conflict list: the register's rows that pass the filter, and the header's Rows line. */
export interface ConflictList {
  rows: Row[];
  info: [string, string];
  filterText: string;
}

/**
 * The rows of the register that pass a filter (the Conflicts screen's rule, shared/conflicts.ts)
 * and, optionally, a further narrowing the filter cannot say (the owner mail's contact), with its words.
 */
export function conflictList(register: Pick<ConflictRegister, 'rows'>, filter: ConflictFilterInput, names: FilterNames, also?: { keep: (r: Row) => boolean; words: string }): ConflictList {
  const rows = register.rows.filter((r) => matchesConflictFilter(r, filter) && (!also || also.keep(r)));
  const base = describeFilter(filter, names);
  const filterText = also ? (base === 'none (everything)' ? also.words : `${base}; ${also.words}`) : base;
  return { rows, info: rowsLine(rows.length, register.rows.length, filterText), filterText };
}

// ---------------------------------------------------------------------------------------------
// CSV

/** The conflict list as CSV: the header block as `#` lines, then the column row and the rows. */
export function conflictCsv(frame: ExportFrame, rows: Row[], rowsInfo: [string, string], ids: CsvIdStyle = 'plain'): string {
  const columns: CsvColumn<Row>[] = conflictColumns(frame).map((c) => ({
    header: c.header,
    text: c.type !== 'number',
    id: c.id,
    user: c.user,
    value: (r) => {
      const v = c.value(r);
      if (v instanceof Date) return c.type === 'date' ? isoDay(v) : isoSeconds(v);
      return v;
    },
  }));
  return csvDocument(headerBlock(frame, 'conflict list', [rowsInfo]), columns, rows, ids);
}

// ---------------------------------------------------------------------------------------------
// XLSX

/**
 * The conflict list as an XLSX workbook: the header block above the table, the column row
 * frozen and filterable, identifiers stored as text (format `@`) so `007` stays `007`.
 */
export async function conflictXlsx(frame: ExportFrame, rows: Row[], rowsInfo: [string, string]): Promise<Buffer> {
  const wb = new ExcelJS.Workbook();
  wb.creator = 'Threadline';
  wb.created = frame.exportedAt;
  wb.title = `${frame.projectName}: conflict list`;
  const ws = wb.addWorksheet('Conflicts');
  const columns = conflictColumns(frame);
  const header = headerBlock(frame, 'conflict list', [rowsInfo]);

  header.forEach(([label, value], i) => {
    const row = ws.getRow(i + 1);
    row.getCell(1).value = label;
    row.getCell(1).font = { bold: true };
    row.getCell(2).value = value;
    row.getCell(2).numFmt = '@';
  });
  ws.getRow(1).getCell(2).font = { bold: true, size: 13 };

  const headRow = header.length + 2;
  const head = ws.getRow(headRow);
  columns.forEach((c, i) => {
    const cell = head.getCell(i + 1);
    cell.value = c.header;
    cell.font = { bold: true };
    cell.alignment = { wrapText: true, vertical: 'bottom' };
    cell.fill = { type: 'pattern', pattern: 'solid', fgColor: { argb: 'FFE5E7EB' } };
    ws.getColumn(i + 1).width = c.width;
  });
  const lengthFormat = decimalsOf(frame.unit) === 3 ? '0.000' : '0.00';
  rows.forEach((r, n) => {
    const row = ws.getRow(headRow + 1 + n);
    columns.forEach((c, i) => {
      const cell = row.getCell(i + 1);
      const v = c.value(r);
      if (c.type === 'text') {
        cell.value = v == null ? '' : String(v);
        cell.numFmt = '@';
        if (c.key === 'resolution' || c.key === 'notes' || c.key === 'conflictWith') cell.alignment = { wrapText: true, vertical: 'top' };
      } else if (c.type === 'number') {
        cell.value = typeof v === 'number' ? v : null;
        cell.numFmt = lengthFormat;
      } else {
        cell.value = v instanceof Date ? v : null;
        cell.numFmt = c.type === 'date' ? 'yyyy-mm-dd' : 'yyyy-mm-dd hh:mm';
      }
    });
  });
  ws.views = [{ state: 'frozen', ySplit: headRow, xSplit: 1 }];
  ws.autoFilter = { from: { row: headRow, column: 1 }, to: { row: headRow + Math.max(rows.length, 1), column: columns.length } };
  return Buffer.from(await wb.xlsx.writeBuffer());
}

// ---------------------------------------------------------------------------------------------
// PDF

/** Characters Helvetica's WinAnsi encoding lacks, replaced by plain ones. */
export function pdfSafe(text: string): string {
  return text
    .replace(/\u2212/g, '-')
    .replace(/\u2265/g, '>=')
    .replace(/\u2264/g, '<=')
    .replace(/\u2192/g, '->')
    .replace(/[\u2018\u2019]/g, "'")
    .replace(/[\u201c\u201d]/g, '"')
    .replace(/[^\u0000-\u00ff\u2013\u2014\u2022\u2026\u20ac]/g, '?');
}

interface PdfColumn {
  header: string;
  width: number;
  text: (r: Row) => string;
}

function pdfColumns(frame: ExportFrame): PdfColumn[] {
  const len = (v: number | null) => lengthText(v, frame);
  return [
    { header: 'Conflict', width: 44, text: (r) => r.number },
    { header: 'Line', width: 92, text: (r) => [r.line.label, kindLabel(r.line), sizeText(r.line, frame), [r.line.material, `QL ${r.line.qualityLevel}`].filter(Boolean).join(', ')].filter(Boolean).join('\n') },
    { header: 'Owner and contact', width: 92, text: (r) => [r.line.owner, r.line.contactEmail ?? ''].filter(Boolean).join('\n') },
    { header: 'Bore or pit', width: 70, text: (r) => conflictWith(r).replace(/; /g, '\n') },
    {
      header: 'Station, offset',
      width: 74,
      text: (r) =>
        [
          stationRange(r, frame),
          r.offset ? `${len(r.offset)} ${r.side ?? ''}` : r.offset === 0 ? 'on the bore' : '',
        ]
          .filter(Boolean)
          .join('\n'),
    },
    { header: `Top of line (${frame.verticalDatum})`, width: 58, text: (r) => len(r.lineTop) },
    {
      header: 'Clearance required / measured / margin',
      width: 76,
      text: (r) => [r.required == null ? '' : `req. ${len(r.required)}`, r.clearance == null ? '' : `meas. ${len(r.clearance)}${r.governing ? ` (${r.governing})` : ''}`, r.margin == null ? '' : `margin ${len(r.margin)}`].filter(Boolean).join('\n'),
    },
    { header: 'Last check', width: 54, text: (r) => CLEARANCE_STATUS_LABELS[r.computedStatus] },
    { header: 'Status, resolution', width: 84, text: (r) => [CONFLICT_STATUS_LABELS[r.status], r.resolutionNote ?? '', r.responsibleParty ? `Responsible: ${r.responsibleParty}` : '', r.assigneeName ? `Assignee: ${r.assigneeName}` : ''].filter(Boolean).join('\n') },
    { header: 'Test holes', width: 46, text: holeNumbers },
    {
      header: 'Dates',
      width: 82,
      text: (r) =>
        [
          `found ${isoDay(new Date(r.createdAt))}`,
          r.ownerNotifiedAt ? `owner told ${isoDay(new Date(r.ownerNotifiedAt))}` : '',
          r.answerDueAt ? `answer due ${isoDay(new Date(r.answerDueAt))}` : '',
          r.dueDate ? `due ${isoDay(new Date(r.dueDate))}` : '',
          r.closedAt ? `closed ${isoDay(new Date(r.closedAt))}` : '',
        ]
          .filter(Boolean)
          .join('\n'),
    },
  ];
}

/**
 * The conflict list as a landscape PDF (Letter) in pdfkit's built-in Helvetica: the header block
 * and the design-aid caution on the first page, the frame repeated in each page's running head,
 * the column row repeated on every page, page numbers at the foot.
 */
export function conflictPdf(frame: ExportFrame, rows: Row[], rowsInfo: [string, string]): Promise<Buffer> {
  const doc = new PDFDocument({ size: 'LETTER', layout: 'landscape', margin: 36, bufferPages: true, info: { Title: `${frame.projectName}: conflict list`, Author: 'Threadline', Creator: 'Threadline' } });
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });

  const left = doc.page.margins.left;
  const right = doc.page.width - doc.page.margins.right;
  const bottom = doc.page.height - doc.page.margins.bottom - 14;
  const columns = pdfColumns(frame);
  const scale = (right - left) / columns.reduce((s, c) => s + c.width, 0);
  const widths = columns.map((c) => c.width * scale);
  const pad = 2;

  doc.font('Helvetica-Bold').fontSize(14).text(pdfSafe(`${frame.projectName}: conflict list`), left, doc.y);
  doc.moveDown(0.3);
  for (const [label, value] of headerBlock(frame, 'conflict list', [rowsInfo]).slice(1)) {
    if (label === 'Caution') continue;
    doc.font('Helvetica-Bold').fontSize(8.5).text(`${label}: `, { continued: true }).font('Helvetica').text(pdfSafe(value));
  }
  doc.moveDown(0.4);
  const boxTop = doc.y;
  doc.font('Helvetica-Bold').fontSize(8.5).fillColor('#7a4a00').text('Caution: ', left + 6, boxTop + 5, { continued: true, width: right - left - 12 }).font('Helvetica').text(pdfSafe(DESIGN_AID_CAUTION));
  const boxBottom = doc.y + 4;
  doc.rect(left, boxTop, right - left, boxBottom - boxTop).lineWidth(0.8).strokeColor('#c98a00').stroke();
  doc.fillColor('black').strokeColor('black');
  doc.y = boxBottom + 8;

  const drawHead = () => {
    doc.font('Helvetica-Bold').fontSize(7);
    const h = Math.max(...columns.map((c, i) => doc.heightOfString(pdfSafe(c.header), { width: widths[i]! - 2 * pad }))) + 2 * pad;
    const y = doc.y;
    doc.rect(left, y, right - left, h).fillColor('#e5e7eb').fill();
    doc.fillColor('black');
    let x = left;
    columns.forEach((c, i) => {
      doc.text(pdfSafe(c.header), x + pad, y + pad, { width: widths[i]! - 2 * pad });
      x += widths[i]!;
    });
    doc.y = y + h;
  };

  drawHead();
  if (rows.length === 0) {
    doc.font('Helvetica').fontSize(9).text('No conflict matches the filter.', left, doc.y + 6);
  }
  doc.font('Helvetica').fontSize(7);
  for (const r of rows) {
    const texts = columns.map((c) => pdfSafe(c.text(r)));
    const h = Math.max(...texts.map((t, i) => doc.heightOfString(t || ' ', { width: widths[i]! - 2 * pad }))) + 2 * pad;
    if (doc.y + h > bottom) {
      doc.addPage();
      doc.font('Helvetica').fontSize(7).fillColor('#444444');
      doc.text(pdfSafe(`${frame.projectName}: conflict list (continued). ${frame.crsCode}, ${frame.unitLabel}, ${frame.verticalDatum}; clearances checked ${checkText(frame.check, 'short')}`), left, doc.page.margins.top);
      doc.fillColor('black');
      doc.y += 4;
      drawHead();
      doc.font('Helvetica').fontSize(7);
    }
    const y = doc.y;
    let x = left;
    texts.forEach((t, i) => {
      doc.text(t, x + pad, y + pad, { width: widths[i]! - 2 * pad });
      x += widths[i]!;
    });
    doc.moveTo(left, y + h).lineTo(right, y + h).lineWidth(0.3).strokeColor('#9ca3af').stroke();
    doc.strokeColor('black');
    doc.y = y + h;
  }

  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    // Writing below the bottom margin would start a new page: lift the margin for the footer.
    const margin = doc.page.margins.bottom;
    doc.page.margins.bottom = 0;
    doc.font('Helvetica').fontSize(7).fillColor('#444444');
    const text = pdfSafe(`Page ${i - range.start + 1} of ${range.count}. Threadline, exported ${isoSeconds(frame.exportedAt)}. Clearances are a design aid; see the caution on page 1.`);
    doc.text(text, left, doc.page.height - margin + 10, { width: right - left, lineBreak: false });
    doc.page.margins.bottom = margin;
  }
  doc.end();
  return done;
}
