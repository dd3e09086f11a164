/**
 * Benchmark of the Plan & profile map (issue 5): the engine benchmark's synthetic corridor
 * (5,000 lines, 20,000 test holes, 200 bores) loaded as a project, the page opened in headless
 * Chromium (playwright-core, Debian's chromium, software rendering at 1280×800), and timed:
 *  - time to first map paint: navigation start → every line drawn on the map's canvas (the
 *    map marks `data-line-count` once its layers are added; two animation frames later it has painted);
 *  - frame time while panning: the intervals between animation frames while the map is dragged
 *    with the mouse, at the opening view (one bore) and zoomed out to the whole corridor.
 * Figures only: nothing passes or fails on time.
 *
 * Run: npx tsx scripts/bench-map.ts        Import: printMapBench() from scripts/bench.ts.
 */
import { execFileSync } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import { mkdtempSync, rmSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { join, resolve, dirname } from 'node:path';
import { performance } from 'node:perf_hooks';
import { fileURLToPath, pathToFileURL } from 'node:url';
import type { Page } from 'playwright-core';
import { defaultProjectSettings } from '../shared/defaults';
import { DEMO_USERS } from '../seeds/demo';
import { createApp } from '../server/app';
import { testConfig } from '../server/config';
import { openDatabase } from '../server/db';
import { Bore, Pit, Project, TestHole, UtilityLine } from '../server/entities';
import { seedDemo } from '../server/seed/seeder';
import { DiskStorage } from '../server/storage/storage';
import { ensureChromium, launchBrowser } from '../tests/e2e/browser';
import { syntheticCorridor } from './bench-engine';

const ROOT = resolve(dirname(fileURLToPath(import.meta.url)), '..');
/** The corridor is generated near grid 0,0; move it into Texas South Central (EPSG:2278, US ft). */
const E0 = 2_300_000;
const N0 = 13_650_000;
const TEXAS_SOUTH_CENTRAL_FTUS =
  '+proj=lcc +lat_0=27.8333333333333 +lon_0=-99 +lat_1=30.2833333333333 +lat_2=28.3833333333333 +x_0=600000 +y_0=3999999.9998984 +ellps=GRS80 +towgs84=0,0,0,0,0,0,0 +units=us-ft +no_defs';

export interface MapBenchResult {
  lines: number;
  holes: number;
  bores: number;
  loadSeconds: number;
  firstPaintMs: number;
  /** When the last API response of the page had arrived. */
  dataMs: number;
  payloadKb: Record<string, number>;
  /** Request start → last byte of each API answer (the requests run together; the server answers one at a time). */
  apiMs: Record<string, number>;
  pan: { view: string; frames: number; medianMs: number; p95Ms: number; maxMs: number }[];
}

const shift = (p: readonly [number, number]): [number, number] => [p[0] + E0, p[1] + N0];

async function loadCorridor(orm: Awaited<ReturnType<typeof openDatabase>>): Promise<number> {
  const input = syntheticCorridor({ lines: 5000, holes: 20000, bores: 200 });
  const em = orm.em.fork();
  const project = new Project({
    name: 'Synthetic corridor (benchmark)',
    client: 'Benchmark',
    crsCode: 'EPSG:2278',
    crsProj4: TEXAS_SOUTH_CENTRAL_FTUS,
    unit: 'usft',
    verticalDatum: 'NAVD 88',
    stationStyle: '100',
    settings: defaultProjectSettings('usft'),
  });
  em.persist(project);
  for (const b of input.bores) {
    const bore = new Bore(project, { name: b.name, method: 'auger_bore', alignment: b.alignment.map(shift), beginStation: b.beginStation, profile: [...b.profile], casingOd: b.casingOd });
    Object.assign(bore, { groundProfile: [...b.groundProfile], toleranceHorizontal: b.toleranceHorizontal, toleranceVertical: b.toleranceVertical, minCover: b.minCover });
    em.persist(bore);
    for (const p of b.pits ?? []) em.persist(new Pit(bore, p.kind, p.footprint.map(shift), p.bottomElevation));
  }
  await em.flush();
  const lines = new Map<number, UtilityLine>();
  for (const l of input.lines) {
    const line = new UtilityLine(project, l.label, 'Benchmark owner', l.kind, l.path.map(shift));
    Object.assign(line, { shape: l.shape, diameter: l.diameter, width: l.width, height: l.height, qualityLevel: l.qualityLevel, recordDepth: l.recordDepth, requiredVertical: l.requiredVertical, requiredHorizontal: l.requiredHorizontal });
    em.persist(line);
    lines.set(l.id, line);
  }
  await em.flush();
  let n = 0;
  for (const h of input.holes) {
    const hole = new TestHole(project, lines.get(h.lineId)!, randomUUID(), h.number, h.easting + E0, h.northing + N0);
    Object.assign(hole, {
      status: h.status,
      approximate: h.approximate,
      groundElevation: h.groundElevation,
      depthToTop: h.depthToTop,
      depthReference: h.depthReference,
      surveyedEasting: h.surveyedEasting == null ? null : h.surveyedEasting + E0,
      surveyedNorthing: h.surveyedNorthing == null ? null : h.surveyedNorthing + N0,
      surveyedTopElevation: h.surveyedTopElevation,
    });
    em.persist(hole);
    if (++n % 4000 === 0) await em.flush();
  }
  await em.flush();
  return project.id;
}

/** Intervals between animation frames while the mouse drags the map `times` times by `dx`. */
async function panFrames(page: Page, times: number, dx: number): Promise<number[]> {
  const box = (await page.getByTestId('plan-map').boundingBox())!;
  // a string, so the bundler's helpers (keepNames) never reach the page
  await page.evaluate(`(() => {
    window.__frames = [];
    window.__stop = false;
    let last = performance.now();
    function tick(t) {
      window.__frames.push(t - last);
      last = t;
      if (!window.__stop) requestAnimationFrame(tick);
    }
    requestAnimationFrame(tick);
  })()`);
  const cx = box.x + box.width / 2;
  const cy = box.y + box.height / 2;
  for (let i = 0; i < times; i++) {
    const dir = i % 2 === 0 ? 1 : -1;
    await page.mouse.move(cx - (dir * dx) / 2, cy);
    await page.mouse.down();
    await page.mouse.move(cx + (dir * dx) / 2, cy + 20 * dir, { steps: 30 });
    await page.mouse.up();
    await page.waitForTimeout(150);
  }
  return page.evaluate(() => {
    const w = window as unknown as { __frames: number[]; __stop: boolean };
    w.__stop = true;
    return w.__frames.slice(1);
  });
}

function stats(view: string, frames: number[]) {
  const sorted = [...frames].sort((a, b) => a - b);
  const at = (q: number) => sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))] ?? NaN;
  return { view, frames: frames.length, medianMs: at(0.5), p95Ms: at(0.95), maxMs: sorted[sorted.length - 1] ?? NaN };
}

export async function runMapBench(): Promise<MapBenchResult> {
  const chromiumPath = ensureChromium();
  const clientDir = mkdtempSync(join(tmpdir(), 'tl-bench-dist-'));
  const dataDir = mkdtempSync(join(tmpdir(), 'tl-bench-map-'));
  execFileSync(join(ROOT, 'node_modules/.bin/vite'), ['build', '--logLevel', 'error', '--outDir', clientDir, '--emptyOutDir'], { stdio: 'inherit', cwd: ROOT });
  const config = testConfig({ dataDir, databasePath: join(dataDir, 'bench.sqlite') });
  const orm = await openDatabase(config.databasePath);
  const storage = new DiskStorage(join(dataDir, 'files'));
  const server = createApp({ orm, config, storage, clientDir }).listen(0, '127.0.0.1');
  let browser: Awaited<ReturnType<typeof launchBrowser>> | null = null;
  try {
    await new Promise<void>((r) => server.once('listening', () => r()));
    const baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
    const t0 = performance.now();
    await seedDemo(orm.em, storage, { photos: false });
    const projectId = await loadCorridor(orm);
    const loadSeconds = (performance.now() - t0) / 1000;

    browser = await launchBrowser(chromiumPath);
    const page = await browser.newPage();
    await page.setViewportSize({ width: 1280, height: 800 });
    const admin = DEMO_USERS.find((u) => u.role === 'admin')!;
    await page.goto(`${baseUrl}/`);
    await page.getByLabel('Email').fill(admin.email);
    await page.getByLabel('Password').fill(admin.password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByText(admin.name).first().waitFor({ timeout: 30_000 });

    // a fresh page load of the plan, so every byte is counted
    await page.goto(`${baseUrl}/projects/${projectId}/plan`);
    await page.waitForFunction(() => document.querySelector('[data-testid="plan-map"]')?.getAttribute('data-line-count') === '5000', undefined, { polling: 'raf', timeout: 120_000 });
    const firstPaintMs = await page.evaluate(async () => {
      await new Promise((r) => requestAnimationFrame(() => requestAnimationFrame(r)));
      return performance.now();
    });
    const payload = await page.evaluate(() => {
      const out: Record<string, number> = {};
      const ms: Record<string, number> = {};
      let dataAt = 0;
      for (const e of performance.getEntriesByType('resource') as PerformanceResourceTiming[]) {
        const m = /\/api\/projects\/\d+\/(lines|holes|clearances|bores|pits|rules|tiles)\/?$/.exec(e.name);
        if (m) {
          out[m[1]!] = Math.round(e.encodedBodySize / 1024);
          ms[m[1]!] = Math.round(e.responseEnd - e.requestStart);
          dataAt = Math.max(dataAt, e.responseEnd);
        }
      }
      return { out, ms, dataAt };
    });
    const payloadKb = payload.out;
    const dataMs = payload.dataAt;
    const apiMs = payload.ms;

    const pan = [stats('opening view (one bore, lines near it)', await panFrames(page, 4, 400))];
    // zoom out to the whole corridor (about 38 miles): every line on screen
    for (let i = 0; i < 18; i++) {
      await page.locator('.leaflet-control-zoom-out').click();
      await page.waitForTimeout(120);
    }
    await page.waitForTimeout(800);
    pan.push(stats('zoomed out: the whole corridor, 5,000 lines in view', await panFrames(page, 4, 400)));
    return { lines: 5000, holes: 20000, bores: 200, loadSeconds, firstPaintMs, dataMs, payloadKb, apiMs, pan };
  } finally {
    await browser?.close();
    server.close();
    await orm.close();
    rmSync(dataDir, { recursive: true, force: true });
    rmSync(clientDir, { recursive: true, force: true });
  }
}

/** Print the figures (for `npm run bench`). */
export async function printMapBench(): Promise<void> {
  console.log('Building the client and loading the synthetic corridor (5,000 lines, 20,000 holes, 200 bores)…');
  const r = await runMapBench();
  console.log(`corridor loaded into the database in ${r.loadSeconds.toFixed(1)} s`);
  console.log(`time to first map paint (navigation → all 5,000 lines painted): ${r.firstPaintMs.toFixed(0)} ms`);
  console.log(`  of which the API answers (bores, pits, lines, holes, rules, clearances, tiles) had all arrived at ${r.dataMs.toFixed(0)} ms`);
  console.log(`API payloads (no compression, kB): ${Object.entries(r.payloadKb).map(([k, v]) => `${k} ${v}`).join(', ')}`);
  console.log(`API request → last byte (ms, requests in parallel): ${Object.entries(r.apiMs).map(([k, v]) => `${k} ${v}`).join(', ')}`);
  console.log('frame time while panning (mouse drags, headless Chromium, software rendering, 1280×800):');
  for (const p of r.pan) {
    console.log(`  ${p.view}: median ${p.medianMs.toFixed(1)} ms, p95 ${p.p95Ms.toFixed(1)} ms, longest ${p.maxMs.toFixed(1)} ms over ${p.frames} frames`);
  }
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  await printMapBench();
}
