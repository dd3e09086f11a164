import { describe, it, expect } from 'vitest';
import { computeClearances } from '../../shared/geometry';
import { syntheticCorridor } from '../../scripts/bench-engine';

describe('spatial index', () => {
  it('when the same corridor is computed with the index and by all pairs then the reports are identical', () => {
    // SPEC §4.11: the index only prunes the search; the exact test decides, so both must agree.
    const input = syntheticCorridor({ lines: 400, holes: 1600, bores: 16, seed: 7 });
    const indexed = computeClearances(input);
    const naive = computeClearances(input, { search: 'all' });
    expect(indexed.bores.reduce((n, b) => n + b.lines.length, 0)).toBeGreaterThan(50);
    expect(indexed.bores.some((b) => b.pitConflicts.length > 0)).toBe(true);
    expect(JSON.stringify(indexed)).toBe(JSON.stringify(naive));
  });

  it('when the corridor is computed then every status appears and no figure is NaN', () => {
    const r = computeClearances(syntheticCorridor({ lines: 400, holes: 1600, bores: 16, seed: 11 }));
    const statuses = new Set(r.bores.flatMap((b) => b.lines.map((l) => l.status)));
    expect([...statuses].sort()).toEqual(['clear', 'conflict', 'marginal', 'overlap', 'unverified']);
    const text = JSON.stringify(r);
    expect(text.includes('NaN')).toBe(false);
    // JSON turns NaN/Infinity into null; check numbers directly too.
    for (const b of r.bores) for (const l of b.lines) for (const p of l.points) {
      for (const v of [p.station, p.offset, p.planDistance, p.allowance, p.required]) expect(Number.isFinite(v)).toBe(true);
    }
  });
});
