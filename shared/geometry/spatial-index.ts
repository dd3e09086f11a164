/**
 * A packed spatial index (flatbush) over every line segment of the project, so the work per
 * bore grows with the lines near it rather than with all lines (SPEC §4.11).
 */
import Flatbush from 'flatbush';
import type { PreparedPolyline } from './polyline';

/** All line segments in flat arrays; segment k belongs to line `line[k]`, kept-segment `seg[k]`. */
export interface SegmentStore {
  count: number;
  x0: Float64Array;
  y0: Float64Array;
  x1: Float64Array;
  y1: Float64Array;
  line: Int32Array;
  seg: Int32Array;
}

/** Flatten the segments of prepared polylines (indexed by their position in `lines`). */
export function buildSegmentStore(lines: readonly PreparedPolyline[]): SegmentStore {
  let count = 0;
  for (const l of lines) count += l.segmentCount;
  const s: SegmentStore = {
    count,
    x0: new Float64Array(count),
    y0: new Float64Array(count),
    x1: new Float64Array(count),
    y1: new Float64Array(count),
    line: new Int32Array(count),
    seg: new Int32Array(count),
  };
  let k = 0;
  lines.forEach((l, li) => {
    for (let j = 0; j < l.segmentCount; j++, k++) {
      s.x0[k] = l.xs[j]!;
      s.y0[k] = l.ys[j]!;
      s.x1[k] = l.xs[j + 1]!;
      s.y1[k] = l.ys[j + 1]!;
      s.line[k] = li;
      s.seg[k] = j;
    }
  });
  return s;
}

/** Build the flatbush index over the segment boxes (null when there are no segments). */
export function buildSegmentIndex(store: SegmentStore): Flatbush | null {
  if (store.count === 0) return null;
  const index = new Flatbush(store.count);
  for (let k = 0; k < store.count; k++) {
    const ax = store.x0[k]!, ay = store.y0[k]!, bx = store.x1[k]!, by = store.y1[k]!;
    index.add(Math.min(ax, bx), Math.min(ay, by), Math.max(ax, bx), Math.max(ay, by));
  }
  index.finish();
  return index;
}
