/**
 * Holes kept on this phone (the outbox) in the test-hole register, rendered to HTML with
 * react-dom/server around the real table: a kept hole shows with its "not sent" badge and no link
 * to a page the server does not have, a record whose client id the server already lists is shown
 * once (the server's copy), the status chips count kept holes under their own chip, sorting and
 * filtering treat kept rows like the rest, and the CSV export leaves them out and says so.
 *
 * Outside references: the expected hole-number order comes from `Intl.Collator` with numeric
 * collation (ECMA-402, the platform's own "natural" order: TH-2 before TH-14); the CSV is read
 * back with papaparse (a general-purpose CSV reader); client ids are RFC 9562 UUIDs checked with
 * zod's `z.uuid()`, the same identity the server dedupes on.
 */
import Papa from 'papaparse';
import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { MemoryRouter } from 'react-router-dom';
import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import type { HoleDto } from '@shared/api';
import { HolesTable, KEPT_BADGE, exportableRows, statusMatches, type HoleRow, type HoleTableContext } from '@/features/holes/components/holes-table';
import { holesCsv } from '@/features/holes/utils/holes-csv';
import { keptRecords, registerRows } from '@/features/holes/utils/kept-rows';
import type { OutboxHole } from '@/features/outbox/outbox-store';

const server: HoleDto = {
  id: 11, projectId: 1, clientId: '2f1a6c7e-7d3e-4f2a-9a51-0e0d7f3b9c11', number: 'TH-1', lineId: 3, status: 'dug',
  positionSource: 'grid', easting: 1000, northing: 2000, approximate: false, boreId: null, station: null, offset: null,
  offsetSide: null, gpsAccuracy: null, groundElevation: 100, depthToTop: 4, depthReference: 'top', measuredSize: null, boxWidth: null,
  boxHeight: null, depthToBottom: null, material: null, condition: null, direction: null, method: 'air',
  ticketNumber: null, surfaceType: null, markerSet: false, crew: 'Crew 1', dugAt: '2026-03-03T15:10:00.000Z',
  surveyedEasting: null, surveyedNorthing: null, surveyedTopElevation: null, surveyedGroundElevation: null, reviewNote: null,
  notes: null, soil: null, groundwater: null, restoration: null, createdById: 5, photoCount: 0, version: 1,
  createdAt: '2026-03-03T15:20:00.000Z', updatedAt: '2026-03-03T15:20:00.000Z',
};

/** TH-2 reached the server (its answer was lost, so the phone still has it as "sending"). */
const TH2_CLIENT = '3f1a6c7e-7d3e-4f2a-9a51-0e0d7f3b9c11';
const SERVER: HoleDto[] = [
  server,
  { ...server, id: 12, number: 'TH-2', clientId: TH2_CLIENT, status: 'surveyed', depthToTop: 2.5, crew: 'Crew 0' },
];

const project = { id: 1, name: 'Demo', crsCode: 'EPSG:26914', unit: 'm', verticalDatum: 'NAVD 88' };
const photo = (name: string, status: OutboxHole['status'] = 'local') => ({ key: name, name, type: 'image/png', data: new ArrayBuffer(4), clientId: crypto.randomUUID(), takenAt: '2026-03-04T09:00:00.000Z', status });

function record(seq: number, clientId: string, input: Partial<OutboxHole['input']> & { number: string }, extra: Partial<OutboxHole> = {}): OutboxHole {
  return {
    clientId,
    projectId: 1,
    project,
    seq,
    number: input.number,
    input: { clientId, positionSource: 'grid', easting: 1010, northing: 2010, depthReference: 'top', ...input } as OutboxHole['input'],
    madeAt: '2026-03-04T09:00:00.000Z',
    status: 'local',
    photos: [],
    ...extra,
  };
}

const OUTBOX: OutboxHole[] = [
  // Logged with no signal on the water line, two photos.
  record(1, '5f1a6c7e-7d3e-4f2a-9a51-0e0d7f3b9c11', { number: 'TH-14', lineId: 3, depthToTop: 3.4, crew: 'Crew 2', dugAt: '2026-03-04T08:55:00.000Z' }, { photos: [photo('a.png'), photo('b.png')] }),
  // On a new unidentified line; the server refused it.
  record(2, '6f1a6c7e-7d3e-4f2a-9a51-0e0d7f3b9c11', { number: 'TH-3', newLine: { label: 'Unmarked conduit' }, direction: 'N 83° E', depthToTop: 1.1, measuredSize: 0.1 }, { status: 'refused', reason: 'number TH-3 is already used on this line' }),
  // Already on the server (same client id): must not show twice.
  record(3, TH2_CLIENT, { number: 'TH-2', lineId: 3 }, { status: 'sending' }),
  // Another project's hole and a record the server has kept in full: neither belongs here.
  record(4, '7f1a6c7e-7d3e-4f2a-9a51-0e0d7f3b9c11', { number: 'TH-90', lineId: 3 }, { projectId: 2 }),
  record(5, '8f1a6c7e-7d3e-4f2a-9a51-0e0d7f3b9c11', { number: 'TH-91', lineId: 3 }, { status: 'sent', holeId: 99 }),
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

const frame = { projectName: 'Demo', crsCode: 'EPSG:26914', unit: 'm' as const, verticalDatum: 'NAVD 88', clearancesCheckedAt: null, total: 2, fileStem: 'demo' };

function render(rows: HoleRow[], opts: { sort?: { id: string; desc: boolean }; filters?: { id: string; value: unknown }[]; search?: string } = {}): string {
  return renderToStaticMarkup(
    createElement(
      MemoryRouter,
      null,
      createElement(HolesTable, { rows, ctx, frame, initialSorting: [opts.sort ?? { id: 'number', desc: false }], initialFilters: opts.filters, initialSearch: opts.search }),
    ),
  );
}

/** The body rows, each as its hole number and its markup. */
function bodyRows(html: string): { number: string; html: string }[] {
  const body = html.slice(html.indexOf('<tbody'));
  return [...body.matchAll(/<tr[^>]*>.*?<\/tr>/g)].map((m) => ({ number: />(TH-\d+)</.exec(m[0])![1]!, html: m[0] }));
}

const rows = registerRows(SERVER, OUTBOX, ctx);

describe('holes kept on this phone in the register', () => {
  it('when records are kept, then only this project’s unsent ones the server does not list are added, deduped by client id', () => {
    expect(OUTBOX.every((r) => z.uuid().safeParse(r.clientId).success)).toBe(true);
    expect(keptRecords(OUTBOX, SERVER, 1).map((r) => r.number)).toEqual(['TH-14', 'TH-3']);
    expect(rows.map((r) => r.number)).toEqual(['TH-1', 'TH-2', 'TH-14', 'TH-3']);
    // The moment the server's list holds TH-14 (same client id), its kept row is gone: one row, the server's.
    const arrived = registerRows([...SERVER, { ...server, id: 13, number: 'TH-14', clientId: OUTBOX[0]!.clientId }], OUTBOX, ctx);
    expect(arrived.filter((r) => r.number === 'TH-14').map((r) => r.kept == null)).toEqual([true]);
  });

  it('when rendered, then a kept hole shows its badge, line, depth, crew, photo count and no link; the server’s holes link as before', () => {
    const html = render(rows);
    const shown = bodyRows(html);
    expect(shown.map((r) => r.number).filter((n) => n === 'TH-2')).toHaveLength(1);
    const th14 = shown.find((r) => r.number === 'TH-14')!.html;
    expect(th14).toContain(KEPT_BADGE);
    expect(th14).toContain('waiting for signal');
    expect(th14).toContain('W-1');
    expect(th14).toContain('3.40');
    expect(th14).toContain('Crew 2');
    expect(th14).toMatch(/>2<span[^>]*>on this phone</);
    expect(th14).toContain('bg-caution-50');
    expect(th14).not.toContain('<a ');
    const th3 = shown.find((r) => r.number === 'TH-3')!.html;
    expect(th3).toContain('Unmarked conduit');
    expect(th3).toContain('new line, made when the hole is sent');
    expect(th3).toContain('Refused (number TH-3 is already used on this line)');
    expect(th3).toContain('not checked until sent');
    const th1 = shown.find((r) => r.number === 'TH-1')!.html;
    expect(th1).toContain('href="/projects/1/holes/11"');
    expect(th1).not.toContain(KEPT_BADGE);
    expect(html).toContain('Showing 4 of 4 holes, 2 kept on this phone and not sent (left out of the CSV)');
    expect(html).toContain('Export CSV (2)');
  });

  it('when counted, then each existing status chip counts the server’s holes only and kept holes have a chip of their own', () => {
    const html = render(rows);
    const chip = (label: string) => new RegExp(`aria-pressed="(?:true|false)"[^>]*>${label}<span[^>]*>(\\d+)</span>`).exec(html)?.[1];
    expect(chip('All')).toBe('4');
    expect(chip('Dug')).toBe('1');
    expect(chip('Surveyed')).toBe('1');
    expect(chip('Planned')).toBe('0');
    expect(chip('Reviewed')).toBe('0');
    expect(chip('Kept on this phone')).toBe('2');
    // No kept holes: no extra chip.
    expect(render(registerRows(SERVER, [], ctx))).not.toContain('Kept on this phone');
  });

  it('when sorted by number, then kept holes take their place in natural order both ways', () => {
    const natural = new Intl.Collator('en', { numeric: true }).compare;
    const expected = rows.map((r) => r.number).sort(natural);
    expect(bodyRows(render(rows)).map((r) => r.number)).toEqual(expected); // TH-1, TH-2, TH-3, TH-14
    expect(bodyRows(render(rows, { sort: { id: 'number', desc: true } })).map((r) => r.number)).toEqual([...expected].reverse());
    // Depth: 1.1 (kept) < 2.5 < 3.4 (kept) < 4.
    expect(bodyRows(render(rows, { sort: { id: 'depth', desc: false } })).map((r) => r.number)).toEqual(['TH-3', 'TH-2', 'TH-14', 'TH-1']);
    // Status: kept holes sort before every server status.
    expect(bodyRows(render(rows, { sort: { id: 'status', desc: false } })).map((r) => r.number).slice(0, 2).sort()).toEqual(['TH-14', 'TH-3']);
  });

  it('when filtered, then the status, line, kind and search filters treat kept rows sanely', () => {
    const numbers = (opts: Parameters<typeof render>[1]) => bodyRows(render(rows, opts)).map((r) => r.number);
    expect(numbers({ filters: [{ id: 'status', value: 'kept' }] })).toEqual(['TH-3', 'TH-14']);
    expect(numbers({ filters: [{ id: 'status', value: 'dug' }] })).toEqual(['TH-1']); // the kept ones are not "Dug" yet
    expect(numbers({ filters: [{ id: 'line', value: 3 }] })).toEqual(['TH-1', 'TH-2', 'TH-14']);
    expect(numbers({ filters: [{ id: 'kind', value: 'unknown' }] })).toEqual(['TH-3']);
    expect(numbers({ search: 'crew 2' })).toEqual(['TH-14']);
    expect(numbers({ search: 'not sent' })).toEqual(['TH-3', 'TH-14']);
    expect(statusMatches({ status: 'dug', kept: undefined }, 'kept')).toBe(false);
  });

  it('when exported, then the CSV leaves kept holes out and its first line says how many', () => {
    const { rows: out, leftOut } = exportableRows(rows);
    expect(leftOut).toBe('2 holes kept on this phone and not sent left out');
    const csv = holesCsv(out, { ...frame, exportedAt: '2026-03-05T08:00:00.000Z', filters: leftOut }, { unit: 'm', stationStyle: '1000' });
    const { data, errors } = Papa.parse<string[]>(csv, { skipEmptyLines: true });
    expect(errors).toEqual([]);
    expect(data[0]![0]).toContain('2 of 2 holes (2 holes kept on this phone and not sent left out)');
    expect(data.slice(2).map((r) => r[0])).toEqual(['="TH-1"', '="TH-2"']);
    expect(exportableRows(rows.filter((r) => !r.kept)).leftOut).toBe('');
  });
});
