/**
 * Candidate line segments near a bore: a flatbush query of the bore's segments and pits expanded
 * by W (or every segment, for the naive baseline), then an exact distance test so the result does
 * not depend on how candidates were found.
 */
import type Flatbush from 'flatbush';
import type { BoreContext } from './bore-context';
import type { PreparedPit } from './pit';
import { pointInPolygon, segmentSegmentDistance } from './planar';
import type { Scene } from './scene';
import type { SegmentStore } from './spatial-index';

/** Distance from store segment k to the bore alignment (least over the bore's segments). */
function segmentToBore(store: SegmentStore, k: number, b: BoreContext): number {
  const a = b.align;
  let best = Infinity;
  for (let i = 0; i < a.segmentCount; i++) {
    const d = segmentSegmentDistance(store.x0[k]!, store.y0[k]!, store.x1[k]!, store.y1[k]!, a.xs[i]!, a.ys[i]!, a.xs[i + 1]!, a.ys[i + 1]!).distance;
    if (d < best) best = d;
  }
  return best;
}

function segmentToPit(store: SegmentStore, k: number, pit: PreparedPit): number {
  if (pointInPolygon(store.x0[k]!, store.y0[k]!, pit.ring)) return 0;
  let best = Infinity;
  const ring = pit.ring;
  for (let e = 0; e < ring.length; e++) {
    const p = ring[e]!;
    const q = ring[(e + 1) % ring.length]!;
    const d = segmentSegmentDistance(store.x0[k]!, store.y0[k]!, store.x1[k]!, store.y1[k]!, p[0], p[1], q[0], q[1]).distance;
    if (d < best) best = d;
  }
  return best;
}

/** The exact test every candidate passes: within W of the alignment or of a pit footprint. */
function isRelevant(store: SegmentStore, k: number, b: BoreContext): boolean {
  if (segmentToBore(store, k, b) <= b.reach) return true;
  for (const pit of b.pits) if (segmentToPit(store, k, pit) <= b.reach) return true;
  return false;
}

/** Candidate segments near a bore, grouped by line (line index → kept-segment indices, ascending). */
export function findCandidates(scene: Scene, b: BoreContext, index: Flatbush | null, search: 'index' | 'all'): Map<number, number[]> {
  const store = scene.store;
  let ks: number[];
  if (search === 'all') {
    ks = [];
    for (let k = 0; k < store.count; k++) ks.push(k);
  } else {
    const found = new Set<number>();
    if (index) {
      const w = b.reach;
      const a = b.align;
      for (let i = 0; i < a.segmentCount; i++) {
        const x0 = a.xs[i]!, y0 = a.ys[i]!, x1 = a.xs[i + 1]!, y1 = a.ys[i + 1]!;
        for (const k of index.search(Math.min(x0, x1) - w, Math.min(y0, y1) - w, Math.max(x0, x1) + w, Math.max(y0, y1) + w)) found.add(k);
      }
      for (const pit of b.pits) {
        const [x0, y0, x1, y1] = pit.bbox;
        for (const k of index.search(x0 - w, y0 - w, x1 + w, y1 + w)) found.add(k);
      }
    }
    ks = [...found].sort((p, q) => p - q);
  }
  const byLine = new Map<number, number[]>();
  for (const k of ks) {
    if (!isRelevant(store, k, b)) continue;
    const li = store.line[k]!;
    let list = byLine.get(li);
    if (!list) byLine.set(li, (list = []));
    list.push(store.seg[k]!);
  }
  return byLine;
}

