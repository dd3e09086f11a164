import { describe, it, expect } from 'vitest';
import { shiftWindow, windowPolygon, type VerticalConstraint } from '../../shared/geometry';

describe('window half-planes', () => {
  it('when an above and a below line at the same station leave no room then both windows are empty', () => {
    // At one station grade change cannot help: δ ≤ −0.5 (above, margin −0.5) and δ ≥ 0.2 (below, margin −0.2).
    const cs: VerticalConstraint[] = [
      { lineId: 1, station: 50, position: 'above', margin: -0.5, allowance: 0 },
      { lineId: 2, station: 50, position: 'below', margin: -0.2, allowance: 0 },
    ];
    expect(shiftWindow(cs, [], false)).toMatchObject({ empty: true, up: -0.5, down: 0.2, upGoverning: [1], downGoverning: [2] });
    expect(windowPolygon(cs, [], 0, false).vertices).toEqual([]);
  });

  it('when cover is the tightest limit then it governs the top with its station', () => {
    const cs: VerticalConstraint[] = [{ lineId: 1, station: 50, position: 'above', margin: 3, allowance: 0.5 }];
    const w = shiftWindow(cs, [{ station: 0, slack: 2 }, { station: 100, slack: 1 }], false);
    expect(w).toMatchObject({ up: 1, upGoverning: [], upGovernedByCover: true, coverStation: 100, down: null, empty: false });
  });

  it('when only a below line limits then the polygon is bounded by the search box above and the line below', () => {
    // −δ − g·(100 − 0) ≤ 1 → δ ≥ −1 − 100g. Box |δ| ≤ 10, |g| ≤ 0.05: at g = −0.05, δ ≥ 4; at g = 0.05, δ ≥ −6.
    const poly = windowPolygon([{ lineId: 1, station: 100, position: 'below', margin: 1, allowance: 0 }], [], 0, false, 10, 0.05);
    const sorted = [...poly.vertices].sort((a, b) => a[0] - b[0] || a[1] - b[1]);
    expect(sorted).toHaveLength(4);
    expect(sorted[0]![0]).toBeCloseTo(-6, 12);
    expect(sorted[0]![1]).toBeCloseTo(0.05, 12);
    expect(sorted[1]![0]).toBeCloseTo(4, 12);
    expect(sorted[1]![1]).toBeCloseTo(-0.05, 12);
  });
});
