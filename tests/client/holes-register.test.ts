/**
 * Pure helpers of the test-hole register's client: the CSV export (read back with papaparse, a
 * general-purpose CSV reader), directions of run, next hole numbers and client-made ids.
 */
import Papa from 'papaparse';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { z } from 'zod';
import type { HoleDto } from '@shared/api';
import type { HoleRow } from '@/features/holes/components/holes-table';
import { parseBearing } from '@/features/holes/utils/bearing';
import { newClientId } from '@/features/holes/utils/client-id';
import { holesCsv, safeText, textId } from '@/features/holes/utils/holes-csv';
import { nextHoleNumber } from '@/features/holes/utils/next-number';

const hole: HoleDto = {
  id: 7, projectId: 1, clientId: '2f1a6c7e-7d3e-4f2a-9a51-0e0d7f3b9c11', number: '007', lineId: 3, status: 'surveyed',
  positionSource: 'station', easting: 2431201.92, northing: 13652412.45, approximate: false, boreId: 1, station: 1055.63, offset: 3.86,
  offsetSide: 'L', gpsAccuracy: null, groundElevation: 429.49, depthToTop: 4.34, depthReference: 'top', measuredSize: 1.1, boxWidth: null,
  boxHeight: null, depthToBottom: null, material: 'PVC, "blue"', condition: '=HYPERLINK("x")', direction: 'N 83° E', method: 'air',
  ticketNumber: '0026022714', surfaceType: 'Grass', markerSet: true, crew: 'Crew 2, day shift', dugAt: '2026-03-03T15:10:00.000Z',
  surveyedEasting: 2431201.93, surveyedNorthing: 13652412.45, surveyedTopElevation: 425.18, surveyedGroundElevation: 429.5, reviewNote: null,
  notes: 'Line one\nline two', soil: null, groundwater: null, restoration: null, createdById: 5, photoCount: 3, version: 4,
  createdAt: '2026-03-03T15:20:00.000Z', updatedAt: '2026-03-04T10:00:00.000Z',
};

const row: HoleRow = {
  hole, number: hole.number, status: hole.status, statusOrder: 2, lineId: 3, lineLabel: '12-in water main, south side', lineKind: 'water',
  qualityLevel: 'A', clearance: { status: 'marginal', bores: [{ boreId: 1, name: 'Bore 1', status: 'marginal' }] }, clearanceOrder: 2,
  ground: 429.5, groundSurveyed: true, depth: 4.34, top: 425.18, topSource: 'surveyed', boreName: 'Bore 1', dugAt: hole.dugAt ?? undefined, crew: hole.crew ?? undefined,
  photos: 3, search: '',
};

const frame = {
  projectName: 'Demo', crsCode: 'EPSG:2278', unit: 'usft' as const, verticalDatum: 'NAVD 88', clearancesCheckedAt: '2026-03-04T10:00:01.000Z',
  exportedAt: '2026-03-05T08:00:00.000Z', total: 14, filters: 'filtered: status Surveyed', fileStem: 'demo',
};

describe('the register CSV, read back with papaparse', () => {
  const csv = holesCsv([row], frame, { unit: 'usft', stationStyle: '100' });
  const { data, errors } = Papa.parse<string[]>(csv, { skipEmptyLines: true });

  it('when exported, then it parses cleanly into a header line, a column row and one row per hole', () => {
    expect(errors).toEqual([]);
    expect(data).toHaveLength(3);
    expect(data[1]!.length).toBe(data[2]!.length);
  });

  it('when exported, then the first line carries CRS, unit, datum, export and clearance-check times and the filters', () => {
    const meta = data[0]![0]!;
    for (const part of ['CRS EPSG:2278', 'unit US survey feet (US ft)', 'vertical datum NAVD 88', 'exported 2026-03-05T08:00:00.000Z', 'clearances checked 2026-03-04T10:00:01.000Z', '1 of 14 holes (filtered: status Surveyed)']) {
      expect(meta).toContain(part);
    }
  });

  it('when a hole number or ticket has leading zeros, then it is written as a text formula so spreadsheets keep them', () => {
    const cols = data[1]!;
    const cell = (name: string) => data[2]![cols.indexOf(name)];
    expect(cell('Hole')).toBe('="007"');
    expect(cell('One-call ticket')).toBe('="0026022714"');
  });

  it('when text starts like a formula, then it is defused with an apostrophe (OWASP CSV injection advice); quotes and line breaks survive', () => {
    const cols = data[1]!;
    const cell = (name: string) => data[2]![cols.indexOf(name)];
    expect(cell('Condition')).toBe(`'=HYPERLINK("x")`);
    expect(cell('Material')).toBe('PVC, "blue"');
    expect(cell('Notes')).toBe('Line one\nline two');
  });

  it('when exported, then figures keep their values, units sit in the column names and elevations name the datum', () => {
    const cols = data[1]!;
    const cell = (name: string) => data[2]![cols.indexOf(name)];
    expect(cell('Top of line elevation (US ft NAVD 88)')).toBe('425.18');
    expect(cell('Top of line from')).toBe('surveyed');
    expect(cell('Station')).toBe('10+55.63');
    expect(cell('Offset (US ft)')).toBe('3.86');
    expect(cell('Side')).toBe('L');
    expect(cell('Clearance status')).toBe('Marginal');
    expect(cell('Easting (US ft)')).toBe('2431201.92');
  });

  it('textId and safeText leave ordinary values alone', () => {
    expect(textId(null)).toBe('');
    expect(textId('A"1')).toBe('="A""1"');
    expect(safeText('-3 ft below the kerb')).toBe("'-3 ft below the kerb");
    expect(safeText('Grass')).toBe('Grass');
  });
});

describe('direction of run as a grid azimuth', () => {
  // Quadrant bearings to azimuths: N θ E = θ, S θ E = 180 − θ, S θ W = 180 + θ, N θ W = 360 − θ
  // (surveying textbook convention, e.g. Ghilani & Wolf, Elementary Surveying, ch. 7; from memory).
  it.each([
    ['N 83° E', 83],
    ['S 12° E', 168],
    ['S12W', 192],
    ['N 45 W', 315],
    ['N 30° 30\' E', 30.5],
    ['83', 83],
    ['263.5°', 263.5],
    ['E-W', 90],
    ['NE-SW', 45],
    ['north', 0],
  ])('when a crew writes %s, then the azimuth is %d°', (text, azimuth) => {
    expect(parseBearing(text)).toBeCloseTo(azimuth, 9);
  });

  it.each(['', 'along the road', 'N 95 E', '400'])('when it cannot be read (%s), then null', (text) => {
    expect(parseBearing(text)).toBeNull();
  });
});

describe('the next hole number', () => {
  it('when holes TH-01 … TH-14 exist, then TH-15 is suggested', () => {
    expect(nextHoleNumber(Array.from({ length: 14 }, (_, i) => `TH-${String(i + 1).padStart(2, '0')}`))).toBe('TH-15');
  });
  it('when the project has none, then TH-01', () => {
    expect(nextHoleNumber([])).toBe('TH-01');
  });
  it('when prefixes are mixed, then the most used one continues, padded like it', () => {
    expect(nextHoleNumber(['PH-007', 'PH-012', 'TH-3', 'PH-009'])).toBe('PH-013');
  });
});

describe('client-made ids', () => {
  afterEach(() => vi.unstubAllGlobals());

  it('when crypto.randomUUID exists, then a version-4 UUID that zod accepts', () => {
    expect(z.uuid().safeParse(newClientId()).success).toBe(true);
  });

  it('when the page is not a secure context (no randomUUID), then the fallback still makes a valid, fresh version-4 UUID', () => {
    const real = globalThis.crypto;
    vi.stubGlobal('crypto', { getRandomValues: real.getRandomValues.bind(real) });
    const a = newClientId();
    const b = newClientId();
    expect(a).toMatch(/^[0-9a-f]{8}-[0-9a-f]{4}-4[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/);
    expect(z.uuid().safeParse(a).success).toBe(true);
    expect(a).not.toBe(b);
  });
});
