/**
 * The Activity page in the project's own terms: stations in the project's style, coordinates and
 * depths with the unit, elevations with the datum, times as dates, lines by their label, records
 * by their name — and no bookkeeping (ids, client-made ids, versions).
 */
import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import type { ActivityDto } from '@shared/api';
import { ActivityList, type ActivityContext } from '@/features/activity/components/activity-list';

const ctx: ActivityContext = {
  unit: 'usft',
  datum: 'NAVD 88',
  stationStyle: '100',
  lineLabel: (id) => (id === 1 ? '12-in water main' : `line ${id}`),
  boreName: () => 'Bore 1',
};

const entries: ActivityDto[] = [
  {
    id: 2, projectId: 1, userId: 5, userName: 'Ada Crew', entity: 'hole', entityId: 3, action: 'update', at: '2026-03-04T10:00:00.000Z',
    changes: {
      number: { before: 'TH-03', after: 'TH-03' },
      station: { before: 1105, after: 1105.5 },
      groundElevation: { before: 429.49, after: 429.5 },
      version: { before: 3, after: 4 },
    },
  },
  {
    id: 1, projectId: 1, userId: 5, userName: 'Ada Crew', entity: 'line', entityId: 23, action: 'create', at: '2026-03-03T15:20:00.000Z',
    changes: {
      id: { before: null, after: 23 },
      label: { before: null, after: 'Unidentified clay pipe' },
      clientId: { before: null, after: '57e4aa00-0000-4000-8000-000000000000' },
      easting: { before: null, after: 2431215.5824643173 },
      createdAt: { before: null, after: '2026-03-03T15:20:00.000Z' },
      path: { before: null, after: [[1, 2], [3, 4]] },
    },
  },
];

describe('the Activity list', () => {
  const html = renderToStaticMarkup(createElement(ActivityList, { items: entries, ctx }));

  it('names each record by its own name, not its database id', () => {
    expect(html).toContain('changed test hole TH-03');
    expect(html).toContain('created line Unidentified clay pipe');
    expect(html).not.toContain('#23');
  });

  it('writes stations in the project style and figures with unit and datum', () => {
    expect(html).toContain('11+05.00');
    expect(html).toContain('11+05.50');
    expect(html).toMatch(/429\.50 US ft NAVD 88/);
    expect(html).toContain('2 vertices');
    expect(html).not.toContain('2431215.5824643173');
  });

  it('leaves out bookkeeping: ids, client-made ids, versions and timestamps', () => {
    expect(html).not.toContain('57e4aa00');
    expect(html).not.toMatch(/>version</);
    expect(html).not.toMatch(/>created at</);
  });
});
