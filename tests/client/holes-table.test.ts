/**
 * The test-hole register table itself, rendered to HTML with react-dom/server: sorting a figure
 * column puts holes with no value last, ascending and descending (a blank is "not measured",
 * not "lowest" — common practice for registers of measurements). TanStack Table places only
 * `undefined` with `sortUndefined: 'last'`; a null would sort first ascending.
 */
import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { MemoryRouter } from 'react-router-dom';
import { describe, expect, it } from 'vitest';
import type { HoleDto } from '@shared/api';
import { HolesTable, toRows, type HoleTableContext } from '@/features/holes/components/holes-table';

const base: HoleDto = {
  id: 1, projectId: 1, clientId: '2f1a6c7e-7d3e-4f2a-9a51-0e0d7f3b9c11', number: 'TH-1', lineId: 3, status: 'dug',
  positionSource: 'grid', easting: 1000, northing: 2000, approximate: false, boreId: null, station: null, offset: null,
  offsetSide: null, gpsAccuracy: null, groundElevation: 100, depthToTop: 4, depthReference: 'top', measuredSize: null, boxWidth: null,
  boxHeight: null, depthToBottom: null, material: null, condition: null, direction: null, method: 'air',
  ticketNumber: null, surfaceType: null, markerSet: false, crew: 'Crew 1', dugAt: '2026-03-03T15:10:00.000Z',
  surveyedEasting: null, surveyedNorthing: null, surveyedTopElevation: null, surveyedGroundElevation: null, reviewNote: null,
  notes: null, soil: null, groundwater: null, restoration: null, createdById: 5, photoCount: 0, version: 1,
  createdAt: '2026-03-03T15:20:00.000Z', updatedAt: '2026-03-03T15:20:00.000Z',
};

// Three holes: ground 100 / none / 90; depth 4 / none / 6; crew set / none / set.
const HOLES: HoleDto[] = [
  base,
  { ...base, id: 2, number: 'TH-2', clientId: '3f1a6c7e-7d3e-4f2a-9a51-0e0d7f3b9c11', groundElevation: null, depthToTop: null, crew: null, dugAt: null },
  { ...base, id: 3, number: 'TH-3', clientId: '4f1a6c7e-7d3e-4f2a-9a51-0e0d7f3b9c11', groundElevation: 90, depthToTop: 6, crew: 'Crew 0' },
];

const ctx: HoleTableContext = {
  projectId: 1,
  unit: 'm',
  datum: 'NAVD 88',
  stationStyle: '1000',
  lines: new Map([[3, { label: 'W-1', kind: 'water', qualityLevel: 'A' }]]),
  bores: new Map(),
  clearances: new Map(),
  clearancesKnown: true,
};

const frame = { projectName: 'Demo', crsCode: 'EPSG:26914', unit: 'm' as const, verticalDatum: 'NAVD 88', clearancesCheckedAt: null, total: 3, fileStem: 'demo' };

function order(id: string, desc: boolean): string[] {
  const html = renderToStaticMarkup(
    createElement(MemoryRouter, null, createElement(HolesTable, { rows: toRows(HOLES, ctx), ctx, frame, initialSorting: [{ id, desc }] })),
  );
  return [...html.matchAll(/>(TH-\d)</g)].map((m) => m[1]!);
}

describe('the test-hole register table', () => {
  it('when sorted by ground elevation, then the hole with none comes last both ways', () => {
    expect(order('ground', false)).toEqual(['TH-3', 'TH-1', 'TH-2']);
    expect(order('ground', true)).toEqual(['TH-1', 'TH-3', 'TH-2']);
  });

  it('when sorted by depth, top of line, crew or dug-at time, then blanks come last ascending', () => {
    expect(order('depth', false)).toEqual(['TH-1', 'TH-3', 'TH-2']);
    expect(order('top', false)).toEqual(['TH-3', 'TH-1', 'TH-2']); // 90 − 6 = 84, 100 − 4 = 96
    expect(order('crew', false)).toEqual(['TH-3', 'TH-1', 'TH-2']);
    expect(order('dugAt', false).at(-1)).toBe('TH-2');
  });
});
