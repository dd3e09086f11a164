/**
 * Benchmark of the clearance engine (SPEC §4.11): a synthetic corridor of 5,000 lines, 20,000
 * test holes and 200 bores (deterministic PRNG), recomputed with the spatial index and by the
 * naive all-pairs search (every bore × every line segment, exact distance test, no index) in the
 * same process; the two reports must be identical.
 *
 * Run: npx tsx scripts/bench-engine.ts      Import: runEngineBench() from scripts/bench.ts.
 */
import { pathToFileURL } from 'node:url';
import { performance } from 'node:perf_hooks';
import { LINE_KINDS, QUALITY_LEVELS, type LineKind } from '../shared/domain';
import { defaultProjectSettings } from '../shared/defaults';
import {
  analyseBore, buildSegmentIndex, computeClearances, prepareScene,
  type BoreInput, type ClearanceInput, type ClearanceReport, type HoleInput, type LineInput, type RuleInput,
} from '../shared/geometry';

/** Mulberry32: a small deterministic PRNG (public-domain algorithm by Tommy Ettinger). */
function prng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Size of a synthetic corridor. */
export interface CorridorSize {
  lines: number;
  holes: number;
  bores: number;
  seed?: number;
}

/**
 * A synthetic road corridor in US survey feet: bores along the corridor every ~1,000 ft, most
 * lines crossing it (north–south, a few bends), the rest running along it; holes scattered on
 * the lines (some planned, some off their line, some surveyed).
 */
export function syntheticCorridor(size: CorridorSize): ClearanceInput {
  const rnd = prng(size.seed ?? 20240601);
  const range = (lo: number, hi: number) => lo + (hi - lo) * rnd();
  const pick = <T,>(xs: readonly T[]): T => xs[Math.floor(rnd() * xs.length)]!;
  const corridorLength = size.bores * 1000;

  const bores: BoreInput[] = [];
  for (let i = 0; i < size.bores; i++) {
    const x0 = i * 1000 + range(50, 200);
    const len = range(300, 750);
    const nv = 2 + Math.floor(rnd() * 3);
    const alignment: [number, number][] = [];
    for (let k = 0; k < nv; k++) alignment.push([x0 + (len * k) / (nv - 1), k === 0 || k === nv - 1 ? range(-20, 20) : range(-60, 60)]);
    let plan = 0;
    for (let k = 1; k < nv; k++) plan += Math.hypot(alignment[k]![0] - alignment[k - 1]![0], alignment[k]![1] - alignment[k - 1]![1]);
    const begin = Math.round(x0);
    const profile = [];
    const np = 3 + Math.floor(rnd() * 3);
    for (let k = 0; k < np; k++) profile.push({ station: begin + (plan * k) / (np - 1), elevation: k === 0 || k === np - 1 ? range(88, 92) : range(80, 86) });
    const groundProfile = [];
    for (let k = 0; k < 4; k++) groundProfile.push({ station: begin + (plan * k) / 3, elevation: range(97, 103) });
    const [sx, sy] = alignment[0]!;
    const [ex, ey] = alignment[nv - 1]!;
    bores.push({
      id: i + 1,
      name: `B-${i + 1}`,
      alignment,
      beginStation: begin,
      profile,
      groundProfile,
      casingOd: pick([1.5, 2, 2.5, 3]),
      toleranceHorizontal: 0.5,
      toleranceVertical: 0.25,
      minCover: 4,
      pits: [
        { id: 2 * i + 1, kind: 'launch', footprint: [[sx - 24, sy - 6], [sx + 2, sy - 6], [sx + 2, sy + 6], [sx - 24, sy + 6]], bottomElevation: 84 },
        { id: 2 * i + 2, kind: 'receiving', footprint: [[ex - 2, ey - 5], [ex + 12, ey - 5], [ex + 12, ey + 5], [ex - 2, ey + 5]], bottomElevation: 85 },
      ],
    });
  }

  const lines: LineInput[] = [];
  for (let i = 0; i < size.lines; i++) {
    const kind = pick(LINE_KINDS);
    const box = rnd() < 0.15;
    const path: [number, number][] = [];
    if (rnd() < 0.7) {
      // Crossing the corridor north–south, with a few bends.
      const x = range(0, corridorLength);
      const nv = 2 + Math.floor(rnd() * 4);
      for (let k = 0; k < nv; k++) path.push([x + range(-40, 40), -800 + (1600 * k) / (nv - 1)]);
    } else {
      // Along the corridor.
      const x = range(0, corridorLength);
      const y = range(-300, 300);
      const len = range(1500, 6000);
      const nv = 5 + Math.floor(rnd() * 15);
      for (let k = 0; k < nv; k++) path.push([x + (len * k) / (nv - 1), y + range(-8, 8)]);
    }
    lines.push({
      id: i + 1,
      label: `U-${i + 1}`,
      kind,
      shape: box ? 'box' : 'round',
      diameter: box ? null : range(0.2, 3),
      width: box ? range(1, 4) : null,
      height: box ? range(1, 3) : null,
      qualityLevel: pick(QUALITY_LEVELS),
      path,
      recordDepth: range(3, 8),
      requiredVertical: rnd() < 0.1 ? range(1, 3) : null,
      requiredHorizontal: rnd() < 0.1 ? range(1, 5) : null,
    });
  }

  const holes: HoleInput[] = [];
  for (let i = 0; i < size.holes; i++) {
    const line = lines[Math.floor(rnd() * lines.length)]!;
    const k = Math.floor(rnd() * (line.path.length - 1));
    const [ax, ay] = line.path[k]!;
    const [bx, by] = line.path[k + 1]!;
    const f = rnd();
    const far = rnd() < 0.03;
    const off = far ? range(40, 80) : range(-1.5, 1.5);
    const len = Math.hypot(bx - ax, by - ay);
    const x = ax + f * (bx - ax) + (off * (by - ay)) / len;
    const y = ay + f * (by - ay) - (off * (bx - ax)) / len;
    const surveyed = rnd() < 0.1;
    holes.push({
      id: i + 1,
      number: `TH-${i + 1}`,
      lineId: line.id,
      status: rnd() < 0.2 ? 'planned' : surveyed ? 'surveyed' : pick(['dug', 'reviewed'] as const),
      easting: x,
      northing: y,
      approximate: rnd() < 0.05,
      groundElevation: range(97, 103),
      depthToTop: range(3, 10),
      depthReference: pick(['top', 'top', 'top', 'centre', 'bottom'] as const),
      surveyedEasting: surveyed ? x + range(-0.1, 0.1) : null,
      surveyedNorthing: surveyed ? y + range(-0.1, 0.1) : null,
      surveyedTopElevation: surveyed ? range(88, 96) : null,
    });
  }

  const rules: RuleInput[] = LINE_KINDS.map((kind: LineKind) => ({ kind, vertical: 2, horizontal: 2 }));
  return { unit: 'usft', settings: defaultProjectSettings('usft'), rules, bores, lines, holes };
}

/** Figures of one benchmark run (milliseconds and bytes). */
export interface EngineBenchResult {
  lines: number;
  holes: number;
  bores: number;
  segments: number;
  reportedPairs: number;
  /** Full recompute with the index (best of the timed runs). */
  totalMs: number;
  phases: { prepareMs: number; indexMs: number; boresMs: number };
  naiveMs: number;
  speedup: number;
  identical: boolean;
  heapUsedBytes: number;
  peakRssBytes: number;
}

function countPairs(r: ClearanceReport): number {
  return r.bores.reduce((s, b) => s + b.lines.length, 0);
}

/** Build the corridor, time the indexed recompute (per phase) and the naive one, and compare results. */
export function runEngineBench(size: CorridorSize = { lines: 5000, holes: 20000, bores: 200 }, runs = 5): EngineBenchResult {
  const input = syntheticCorridor(size);
  computeClearances(input); // warm-up (JIT)

  let best = { totalMs: Infinity, prepareMs: 0, indexMs: 0, boresMs: 0 };
  let indexed: ClearanceReport | null = null;
  let segments = 0;
  for (let run = 0; run < runs; run++) {
    const t0 = performance.now();
    const scene = prepareScene(input);
    const t1 = performance.now();
    const index = buildSegmentIndex(scene.store);
    const t2 = performance.now();
    const bores = input.bores.map((b) => analyseBore(scene, b, index));
    const t3 = performance.now();
    indexed = { unit: input.unit, bores, warnings: scene.warnings };
    segments = scene.store.count;
    if (t3 - t0 < best.totalMs) best = { totalMs: t3 - t0, prepareMs: t1 - t0, indexMs: t2 - t1, boresMs: t3 - t2 };
  }

  const n0 = performance.now();
  const naive = computeClearances(input, { search: 'all' });
  const naiveMs = performance.now() - n0;

  const identical = JSON.stringify(naive) === JSON.stringify(indexed);
  return {
    lines: input.lines.length,
    holes: input.holes.length,
    bores: input.bores.length,
    segments,
    reportedPairs: indexed ? countPairs(indexed) : 0,
    totalMs: best.totalMs,
    phases: { prepareMs: best.prepareMs, indexMs: best.indexMs, boresMs: best.boresMs },
    naiveMs,
    speedup: naiveMs / best.totalMs,
    identical,
    heapUsedBytes: process.memoryUsage().heapUsed,
    peakRssBytes: process.resourceUsage().maxRSS * 1024,
  };
}

/** Run the engine benchmark and print its figures. */
export function printEngineBench(): void {
  const r = runEngineBench();
  const mb = (b: number) => `${(b / 1048576).toFixed(1)} MB`;
  const ms = (m: number) => `${m.toFixed(1)} ms`;
  console.log(`Clearance engine: ${r.lines} lines (${r.segments} segments), ${r.holes} test holes, ${r.bores} bores`);
  console.log(`  line–bore pairs reported: ${r.reportedPairs}`);
  console.log(`  full recompute (indexed, best of 5): ${ms(r.totalMs)}`);
  console.log(`    prepare lines & holes: ${ms(r.phases.prepareMs)}`);
  console.log(`    build segment index:   ${ms(r.phases.indexMs)}`);
  console.log(`    bores (search+figures): ${ms(r.phases.boresMs)}`);
  console.log(`  naive all-pairs (every bore × every segment, exact test): ${ms(r.naiveMs)}`);
  console.log(`  results identical: ${r.identical ? 'yes' : 'NO'}`);
  console.log(`  memory: heap used ${mb(r.heapUsedBytes)}, peak RSS ${mb(r.peakRssBytes)}`);
  console.log(`  ${r.speedup.toFixed(1)}× faster than naive`);
  if (!r.identical) process.exitCode = 1;
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) printEngineBench();
