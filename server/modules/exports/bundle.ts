import JSZip from 'jszip';
import type { LineKind } from '@shared/domain';
import type { FileStorage } from '../../storage/storage';
import { conflictCsv, conflictList, conflictPdf, conflictXlsx } from './conflict-list';
import { holesCsv, linesCsv } from './data-tables';
import { conflictListFrame, filterNames, type ConflictFilterInput, type ProjectExportData } from './export-data';
import { DESIGN_AID_CAUTION, FIELD_CAUTIONS, isoSeconds } from './export-header';
import { projectGeojson } from './geojson';
import { stakeoutCsv, stakeoutDxf, stakeoutPoints } from './stakeout';

/**
 * The project zip: the data files, the test-hole sheets, the photos named by hole number
 * (`photos/TH-07_1.jpg`) and a README.txt giving CRS, unit, vertical datum and the time of the
 * last clearance check. Built from data loaded beforehand (no database access here), reporting
 * progress as it goes.
 */

export interface BundleProgress {
  phase: 'data' | 'sheets' | 'photos' | 'compressing';
  label: string;
  done: number;
  total: number;
  /** Overall 0–100. */
  percent: number;
}

export interface BundleOptions {
  filter: ConflictFilterInput;
  photos: boolean;
  /** One PDF sheet per test hole, when the sheet builder exists; else the zip says the sheets are not included. */
  sheet?: (holeId: number) => Promise<Buffer>;
}

/** A file-name-safe hole number: `TH-07` stays, `TH 7/A` becomes `TH_7_A`. */
export function safeName(text: string): string {
  return text.trim().replace(/[^A-Za-z0-9._-]+/g, '_').replace(/^\.+/, '_').slice(0, 60) || 'hole';
}

const EXTENSIONS: Record<string, string> = { 'image/jpeg': 'jpg', 'image/png': 'png', 'image/webp': 'webp', 'image/heic': 'heic' };

export async function buildBundle(data: ProjectExportData, storage: FileStorage, options: BundleOptions, onProgress: (p: BundleProgress) => void): Promise<Buffer> {
  const { frame } = data;
  const zip = new JSZip();
  const filter = options.filter;
  const kinds: LineKind[] | undefined = filter.kind?.length ? filter.kind : undefined;
  const date = new Date(frame.exportedAt);
  const add = (name: string, content: string | Buffer, store = false) =>
    zip.file(name, content, { date, ...(store ? { compression: 'STORE' as const } : {}) });

  // 1. Data files.
  const dataSteps = 8;
  let step = 0;
  const dataStep = (label: string) => onProgress({ phase: 'data', label, done: ++step, total: dataSteps, percent: Math.round((step / dataSteps) * 10) });
  // The conflict list is the register as the Conflicts screen shows it, stating its last check.
  const { rows, info, filterText } = conflictList(data.register, filter, filterNames(data.register.rows, data.bores));
  const listFrame = conflictListFrame(frame, data.register);
  add('conflicts.csv', conflictCsv(listFrame, rows, info));
  dataStep('Conflict list (CSV)');
  add('conflicts.xlsx', await conflictXlsx(listFrame, rows, info));
  dataStep('Conflict list (XLSX)');
  add('conflicts.pdf', await conflictPdf(listFrame, rows, info));
  dataStep('Conflict list (PDF)');
  const stakeFilter = { boreId: filter.boreId, kind: filter.kind };
  const points = stakeoutPoints(data, stakeFilter);
  add('stakeout-points.csv', stakeoutCsv(data, points, stakeFilter));
  dataStep('Stake-out point file');
  add('stakeout.dxf', stakeoutDxf(data, points, stakeFilter));
  dataStep('Stake-out DXF');
  add('project.geojson', JSON.stringify(projectGeojson(data, { kind: kinds }), null, 1));
  dataStep('GeoJSON');
  add('lines.csv', linesCsv(data, kinds));
  dataStep('Lines (CSV)');
  add('holes.csv', holesCsv(data, kinds));
  dataStep('Test holes (CSV)');

  const lineOk = (lineId: number) => {
    const l = data.linesById.get(lineId);
    return Boolean(l && (!kinds || kinds.includes(l.kind)));
  };
  const holes = data.holes.filter((h) => lineOk(h.lineId)).sort((a, b) => a.number.localeCompare(b.number, 'en', { numeric: true }) || a.id - b.id);

  // 2. Test-hole sheets (one per excavation number: the sheet lists every line it exposed).
  const sheetNames: string[] = [];
  const sheetsFailed: string[] = [];
  if (options.sheet) {
    const firstOfNumber = holes.filter((h, i) => holes.findIndex((x) => x.number === h.number) === i);
    let done = 0;
    for (const h of firstOfNumber) {
      try {
        add(`sheets/${safeName(h.number)}.pdf`, await options.sheet(h.id));
        sheetNames.push(h.number);
      } catch {
        sheetsFailed.push(h.number);
      }
      done++;
      onProgress({ phase: 'sheets', label: `Test-hole sheets ${done} of ${firstOfNumber.length}`, done, total: firstOfNumber.length, percent: 10 + Math.round((done / Math.max(firstOfNumber.length, 1)) * 10) });
    }
  }

  // 3. Photos, named by hole number in the order they were taken (uploaded).
  const missing: string[] = [];
  const photoNames: string[] = [];
  if (options.photos) {
    const holeById = new Map(holes.map((h) => [h.id, h]));
    const photos = data.photos
      .filter((p) => holeById.has(p.holeId))
      .sort((a, b) => holeById.get(a.holeId)!.number.localeCompare(holeById.get(b.holeId)!.number, 'en', { numeric: true }) || a.id - b.id);
    const counter = new Map<string, number>();
    let done = 0;
    for (const p of photos) {
      const hole = holeById.get(p.holeId)!;
      const base = safeName(hole.number);
      const n = (counter.get(base) ?? 0) + 1;
      counter.set(base, n);
      const name = `photos/${base}_${n}.${EXTENSIONS[p.mimeType] ?? 'bin'}`;
      const file = await storage.get(p.key);
      if (file) {
        add(name, file, true); // JPEGs are compressed already: stored, not deflated again
        photoNames.push(name);
      } else {
        missing.push(`${name} (photo ${p.id} of ${hole.number}: file not found in storage)`);
      }
      done++;
      onProgress({ phase: 'photos', label: `Reading photos ${done} of ${photos.length}`, done, total: photos.length, percent: 20 + Math.round((done / Math.max(photos.length, 1)) * 50) });
    }
  }

  add('README.txt', readme(data, { filterText, conflictRows: rows.length, points: points.length, holes: holes.length, photos: options.photos, photoNames, missing, sheetNames, sheetsFailed, sheets: Boolean(options.sheet) }));

  // 4. Compress.
  const buffer = await zip.generateAsync({ type: 'nodebuffer', compression: 'DEFLATE', compressionOptions: { level: 6 } }, (meta) => {
    onProgress({ phase: 'compressing', label: `Compressing ${Math.round(meta.percent)}%`, done: Math.round(meta.percent), total: 100, percent: 70 + Math.round(meta.percent * 0.3) });
  });
  return buffer;
}

interface ReadmeFacts {
  filterText: string;
  conflictRows: number;
  points: number;
  holes: number;
  photos: boolean;
  photoNames: string[];
  missing: string[];
  sheetNames: string[];
  sheetsFailed: string[];
  sheets: boolean;
}

/** README.txt: the frame first (CRS, unit, vertical datum, clearance check time), then the files. */
export function readme(data: ProjectExportData, facts: ReadmeFacts): string {
  const { frame } = data;
  const lines = [
    `Threadline export: ${frame.projectName}`,
    '='.repeat(Math.min(78, 20 + frame.projectName.length)),
    '',
    `Project:             ${frame.projectName} (${frame.client})`,
    `CRS:                 ${frame.crsCode} ${frame.crsName}`,
    `CRS definition:      ${frame.crsProj4}`,
    `Unit:                ${frame.unitLabel} (${frame.unitSymbol}) for all coordinates and lengths and elevations`,
    `Vertical datum:      ${frame.verticalDatum} (every elevation)`,
    `Clearances checked:  ${isoSeconds(data.computedAt)} UTC (recomputed when this zip was made: stake-out points, GeoJSON, sheets)`,
    `Conflict register:   ${data.register.checkedAt ? `last checked ${isoSeconds(data.register.checkedAt)} UTC` : 'no conflict on the register'}; the conflict files list the register as the`,
    '                     Conflicts screen shows it (every change that can move a clearance rechecks it)',
    `Exported:            ${isoSeconds(frame.exportedAt)} UTC by ${frame.exportedBy}`,
    `Filter:              ${facts.filterText}`,
    '',
    'Files',
    '-----',
    `conflicts.csv         The conflict list (${facts.conflictRows} rows), CSV. Lines starting with # are the header block;`,
    '                      the column row follows. Identifiers are text. For a spreadsheet, open conflicts.xlsx.',
    '                      Programs: skip lines starting with # (papaparse: comments "#").',
    'conflicts.xlsx        The conflict list as a workbook: header block above the table, identifiers stored as text.',
    'conflicts.pdf         The conflict list to print (landscape), with the header block and the caution.',
    `stakeout-points.csv   Stake-out point file (${facts.points} points): point, northing, easting, elevation, description.`,
    '                      Confirmed line positions over each crossing (elevation = top of line from the test holes)',
    '                      and suggested test holes (elevation = ground from the bore ground profile, where there is one).',
    'stakeout.dxf          The same points as DXF POINT + TEXT with true elevations as Z, a layer per line kind',
    '                      (UTIL-<KIND> for confirmed points and the 3-D top of line where holes give elevations,',
    '                      UTIL-<KIND>-PLAN for plan paths without elevation, UTIL-<KIND>-SUGGESTED), BORE-CENTRELINE.',
    'project.geojson       Lines, test holes and bores (RFC 7946). Positions are [longitude, latitude], WGS 84.',
    `                      Grid values (${frame.crsCode}, ${frame.unitSymbol}) and elevations are kept in the properties.`,
    'lines.csv             The lines of the register.',
    `holes.csv             The test holes (${facts.holes} records; one record per line an excavation exposed).`,
  ];
  if (facts.sheets) {
    lines.push(`sheets/               One PDF sheet per excavation (${facts.sheetNames.length}), named by hole number: TH-07.pdf.`);
    if (facts.sheetsFailed.length > 0) lines.push(`                      Sheets that could not be made (print them from the Test holes tab): ${facts.sheetsFailed.join(', ')}.`);
  } else {
    lines.push('sheets/               Not included: printable test-hole sheets are not available in this version;', '                      holes.csv carries the same facts.');
  }
  if (facts.photos) {
    lines.push(`photos/               ${facts.photoNames.length} photo${facts.photoNames.length === 1 ? '' : 's'} named by hole number and order: TH-07_1.jpg is the first photo of TH-07.`);
    if (facts.missing.length > 0) {
      lines.push('', 'Photos missing from storage (listed, not included):', ...facts.missing.map((m) => `  ${m}`));
    }
  } else {
    lines.push('photos/               Not included (left out when the zip was requested).');
  }
  lines.push('', 'Cautions', '--------', DESIGN_AID_CAUTION, ...FIELD_CAUTIONS.filter((c) => c !== DESIGN_AID_CAUTION), '');
  return lines.join('\r\n');
}
